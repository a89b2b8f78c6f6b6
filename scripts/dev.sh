#!/usr/bin/env bash
# npm run dev: the vite dev server on 127.0.0.1 against the dev database, with the dev mail inbox.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
pg_start dev
npx tsx scripts/migrate.ts
S3_PORT="${S3_DEV_PORT:-4175}"
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
S3_DEV_PORT="$S3_PORT" S3_DEV_DIR=.run/s3/dev npx tsx scripts/s3-dev.ts >"$RUN_DIR/s3-dev.log" 2>&1 &
S3_PID=$!
MAIL_SMTP_PORT="${MAIL_DEV_SMTP_PORT:-2526}"
MAIL_DEV_SMTP_PORT="$MAIL_SMTP_PORT" npx tsx scripts/mail-dev.ts >"$RUN_DIR/mail-dev.log" 2>&1 &
MAIL_PID=$!
trap 'kill $MAIL_PID $S3_PID 2>/dev/null || true' EXIT INT TERM
for _ in $(seq 1 300); do grep -q 's3-dev ready' "$RUN_DIR/s3-dev.log" 2>/dev/null && break; sleep 0.1; done
npx tsx scripts/seed.ts
SMTP_HOST=127.0.0.1 SMTP_PORT="$MAIL_SMTP_PORT" npx vite dev --host 127.0.0.1
