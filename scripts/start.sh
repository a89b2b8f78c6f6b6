#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL, migrate, seed the demo studio, build, serve.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

APP_PORT="${PORT:-4173}"
MAIL_SMTP_PORT="${MAIL_DEV_SMTP_PORT:-2526}"
MAIL_HTTP_PORT="${MAIL_DEV_HTTP_PORT:-4174}"

ensure_node_modules
pg_start dev
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts

# Build when anything the build depends on is newer than the last build.
stamp="$ROOT/build/.dartelier-built"
if [ ! -f "$stamp" ] || [ -n "$(find src static migrations package-lock.json svelte.config.js vite.config.ts tailwind.config.ts -newer "$stamp" -print -quit 2>/dev/null)" ]; then
	say "building the app"
	npx vite build --logLevel warn
	touch "$stamp"
fi

cleanup() {
	[ -n "${MAIL_PID:-}" ] && kill "$MAIL_PID" 2>/dev/null || true
	[ -n "${APP_PID:-}" ] && kill "$APP_PID" 2>/dev/null || true
}
trap cleanup EXIT INT TERM

MAIL_DEV_SMTP_PORT="$MAIL_SMTP_PORT" MAIL_DEV_HTTP_PORT="$MAIL_HTTP_PORT" npx tsx scripts/mail-dev.ts >"$RUN_DIR/mail-dev.log" 2>&1 &
MAIL_PID=$!

# adapter-node: without ORIGIN it assumes https, which would refuse form posts on plain-http loopback.
export HOST=127.0.0.1 PORT="$APP_PORT" ORIGIN="${ORIGIN:-http://127.0.0.1:$APP_PORT}"
export SMTP_HOST=127.0.0.1 SMTP_PORT="$MAIL_SMTP_PORT"
export MAIL_FROM="${MAIL_FROM:-Dartelier <studio@dartelier.localhost>}" BODY_SIZE_LIMIT="${BODY_SIZE_LIMIT:-8M}"
node build &
APP_PID=$!

cat <<MSG

  Dartelier is running:   http://127.0.0.1:$APP_PORT
  Dev inbox (e-mails):    http://127.0.0.1:$MAIL_HTTP_PORT
  PostgreSQL (dev):       127.0.0.1:$PG_PORT, database $PG_DB

  Demo studio "Linden Row Studio", password for every demo user: linden-demo-2026
    owner          ines.owner@linden-row.example
    patterncutter  tomas.cutter@linden-row.example
    designer       aya.designer@linden-row.example
    sampleroom     rui.sample@linden-row.example

  Ctrl-C stops the app. The database keeps running: stop it with  npm run db:stop

MSG
wait "$APP_PID"
