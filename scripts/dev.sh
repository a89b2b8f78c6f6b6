#!/usr/bin/env bash
# npm run dev: the vite dev server on 127.0.0.1 against the dev database, with the dev mail inbox, the object store and the payments fake.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
pg_start dev
npx tsx scripts/migrate.ts
S3_PORT="${S3_DEV_PORT:-4175}"
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
S3_DEV_PORT="$S3_PORT" S3_DEV_DIR=.run/s3/dev node --import tsx scripts/s3-dev.ts >"$RUN_DIR/s3-dev.log" 2>&1 &
S3_PID=$!
MAIL_SMTP_PORT="${MAIL_DEV_SMTP_PORT:-2526}"
MAIL_DEV_SMTP_PORT="$MAIL_SMTP_PORT" node --import tsx scripts/mail-dev.ts >"$RUN_DIR/mail-dev.log" 2>&1 &
MAIL_PID=$!
# The local payments fake, unless the environment names a real provider account (as npm start does).
PAYMENTS_PID=
if [ -z "${STRIPE_SECRET_KEY:-}" ]; then
	PAYMENTS_PORT="${PAYMENTS_FAKE_PORT:-4176}"
	export STRIPE_SECRET_KEY=sk_test_dartelier_local STRIPE_WEBHOOK_SECRET=whsec_dartelier_local
	export STRIPE_API_HOST=127.0.0.1 STRIPE_API_PORT="$PAYMENTS_PORT" STRIPE_API_PROTOCOL=http
	PAYMENTS_FAKE_PORT="$PAYMENTS_PORT" PAYMENTS_FAKE_WEBHOOK_URL="http://127.0.0.1:5173/api/billing/webhook" \
		node --import tsx scripts/payments-dev.ts >"$RUN_DIR/payments-dev.log" 2>&1 &
	PAYMENTS_PID=$!
fi
trap 'kill $MAIL_PID $S3_PID $PAYMENTS_PID 2>/dev/null || true' EXIT INT TERM
for _ in $(seq 1 300); do grep -q 's3-dev ready' "$RUN_DIR/s3-dev.log" 2>/dev/null && break; sleep 0.1; done
npx tsx scripts/seed.ts
SMTP_HOST=127.0.0.1 SMTP_PORT="$MAIL_SMTP_PORT" npx vite dev --host 127.0.0.1
