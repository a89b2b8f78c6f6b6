#!/usr/bin/env bash
# npm run dev: the vite dev server on 127.0.0.1 against the dev database, with the dev mail inbox.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
pg_start dev
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts
MAIL_SMTP_PORT="${MAIL_DEV_SMTP_PORT:-2526}"
MAIL_DEV_SMTP_PORT="$MAIL_SMTP_PORT" npx tsx scripts/mail-dev.ts >"$RUN_DIR/mail-dev.log" 2>&1 &
MAIL_PID=$!
trap 'kill $MAIL_PID 2>/dev/null || true' EXIT INT TERM
SMTP_HOST=127.0.0.1 SMTP_PORT="$MAIL_SMTP_PORT" npx vite dev --host 127.0.0.1
