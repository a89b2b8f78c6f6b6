#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL, migrate, seed the demo studio, build, serve.
# The terminal gets what a user needs (where the app is, the demo sign-in, what else runs); the tools'
# own output (npm, migrations, the build's warnings about dependencies) goes to log files under .run/.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

APP_PORT="${PORT:-4173}"
MAIL_SMTP_PORT="${MAIL_DEV_SMTP_PORT:-2526}"
MAIL_HTTP_PORT="${MAIL_DEV_HTTP_PORT:-4174}"
# The local payments fake (scripts/payments-dev.ts), unless the environment names a real provider account.
PAYMENTS_PORT="${PAYMENTS_FAKE_PORT:-4176}"
USE_PAYMENTS_FAKE=1
[ -n "${STRIPE_SECRET_KEY:-}" ] && USE_PAYMENTS_FAKE=0
# The local object store (scripts/s3-dev.ts), unless the environment names a hosted one (S3_ENDPOINT).
S3_PORT="${S3_DEV_PORT:-4175}"
USE_S3_FAKE=1
[ -n "${S3_ENDPOINT:-}" ] && USE_S3_FAKE=0
# Which of the project's clusters to use: dev (the start script's own test uses scratch).
CLUSTER="${DARTELIER_START_CLUSTER:-dev}"
# The build command (the start script's own test puts a stand-in here).
BUILD_CMD="${DARTELIER_START_BUILD:-npx vite build --logLevel warn}"

ensure_node_modules
pg_start "$CLUSTER"

cleanup() {
	[ -n "${S3_PID:-}" ] && kill "$S3_PID" 2>/dev/null || true
	[ -n "${MAIL_PID:-}" ] && kill "$MAIL_PID" 2>/dev/null || true
	[ -n "${PAYMENTS_PID:-}" ] && kill "$PAYMENTS_PID" 2>/dev/null || true
	[ -n "${APP_PID:-}" ] && kill "$APP_PID" 2>/dev/null || true
}
trap cleanup EXIT INT TERM

# The local object store for photos (before the seed, which stores the demo fitting's photos).
export S3_BUCKET="${S3_BUCKET:-dartelier-photos}"
if [ "$USE_S3_FAKE" = 1 ]; then
	export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
	S3_DEV_PORT="$S3_PORT" S3_DEV_DIR=".run/s3/$CLUSTER" node --import tsx scripts/s3-dev.ts >"$RUN_DIR/s3-dev.log" 2>&1 &
	S3_PID=$!
	for _ in $(seq 1 300); do
		grep -q 's3-dev ready' "$RUN_DIR/s3-dev.log" 2>/dev/null && break
		kill -0 "$S3_PID" 2>/dev/null || { tail -n 20 "$RUN_DIR/s3-dev.log" >&2; die "the object store stopped at once; see .run/s3-dev.log"; }
		sleep 0.1
	done
	grep -q 's3-dev ready' "$RUN_DIR/s3-dev.log" || die "the object store did not start; see .run/s3-dev.log"
fi
quietly "$RUN_DIR/migrate.log" "migrating the database" npx tsx scripts/migrate.ts
say "database migrated (log: .run/migrate.log)"
quietly "$RUN_DIR/seed.log" "seeding the demo studio" npx tsx scripts/seed.ts
say "$(grep -o 'demo studio [a-z ]*' "$RUN_DIR/seed.log" | head -n 1 || echo 'demo studio seeded')"

# Build when anything the build depends on is newer than the last build.
stamp="$ROOT/build/.dartelier-built"
if [ ! -f "$stamp" ] || [ -n "$(find src static migrations package-lock.json svelte.config.js vite.config.ts tailwind.config.ts -newer "$stamp" -print -quit 2>/dev/null)" ]; then
	say "building the app (about a minute; the build's own output: .run/build.log)"
	# shellcheck disable=SC2086 # the command is words on purpose
	quietly "$RUN_DIR/build.log" "the build" $BUILD_CMD
	mkdir -p "$ROOT/build" && touch "$stamp"
else
	say "the app is built and up to date"
fi

MAIL_DEV_SMTP_PORT="$MAIL_SMTP_PORT" MAIL_DEV_HTTP_PORT="$MAIL_HTTP_PORT" node --import tsx scripts/mail-dev.ts >"$RUN_DIR/mail-dev.log" 2>&1 &
MAIL_PID=$!
if [ "$USE_PAYMENTS_FAKE" = 1 ]; then
	export STRIPE_SECRET_KEY=sk_test_dartelier_local STRIPE_WEBHOOK_SECRET=whsec_dartelier_local
	export STRIPE_API_HOST=127.0.0.1 STRIPE_API_PORT="$PAYMENTS_PORT" STRIPE_API_PROTOCOL=http
	PAYMENTS_FAKE_PORT="$PAYMENTS_PORT" PAYMENTS_FAKE_WEBHOOK_URL="http://127.0.0.1:$APP_PORT/api/billing/webhook" \
		node --import tsx scripts/payments-dev.ts >"$RUN_DIR/payments-dev.log" 2>&1 &
	PAYMENTS_PID=$!
fi

# adapter-node: without ORIGIN it assumes https, which would refuse form posts on plain-http loopback.
export HOST=127.0.0.1 PORT="$APP_PORT" ORIGIN="${ORIGIN:-http://127.0.0.1:$APP_PORT}"
export SMTP_HOST=127.0.0.1 SMTP_PORT="$MAIL_SMTP_PORT"
export MAIL_FROM="${MAIL_FROM:-Dartelier <studio@dartelier.localhost>}" BODY_SIZE_LIMIT="${BODY_SIZE_LIMIT:-16M}"
# The app's own messages (errors) stay in the terminal, after the summary below.
node build &
APP_PID=$!
# Say they run once they answer.
answers() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }
for _ in $(seq 1 600); do
	kill -0 "$APP_PID" 2>/dev/null || die "the app stopped at once; see the lines above"
	kill -0 "$MAIL_PID" 2>/dev/null || die "the dev inbox stopped at once; see .run/mail-dev.log"
	[ -z "${PAYMENTS_PID:-}" ] || kill -0 "$PAYMENTS_PID" 2>/dev/null || die "the payments fake stopped at once; see .run/payments-dev.log"
	answers "$APP_PORT" && answers "$MAIL_HTTP_PORT" && { [ -z "${PAYMENTS_PID:-}" ] || answers "$PAYMENTS_PORT"; } && break
	sleep 0.1
done

# The demo sign-in, read from the seed's own data so that it cannot drift.
DEMO_USERS=$(node -e '
const d = JSON.parse(require("node:fs").readFileSync("fixtures/demo-studio.json", "utf8"));
const roles = { owner: "owner", patterncutter: "pattern cutter", designer: "designer", sampleroom: "sample room" };
console.log(`  Demo studio "${d.studio}", one user per role, password for each: ${d.password}`);
for (const u of d.users) console.log(`    ${(roles[u.role] ?? u.role).padEnd(16)}${u.email}`);
const b = JSON.parse(require("node:fs").readFileSync("fixtures/demo-billing.json", "utf8"));
const o = b.sketch.users.find((u) => u.role === "owner");
console.log(`  "${d.studio}" is on the Studio plan; "${b.sketch.studio}" on the free Sketch plan: ${o.email}`);
')

cat <<MSG

  Dartelier is running:   http://127.0.0.1:$APP_PORT   (sign in there)

$DEMO_USERS

  Also running:
$(printf '    %-22s%s\n' "Dev inbox" "http://127.0.0.1:$MAIL_HTTP_PORT   (invitation and password e-mails)")
$(if [ "$USE_S3_FAKE" = 1 ]; then printf '    %-22s%s\n' "Object store (photos)" "http://127.0.0.1:$S3_PORT, bucket $S3_BUCKET, data in .run/s3/$CLUSTER"; else printf '    %-22s%s\n' "Object store (photos)" "$S3_ENDPOINT, bucket $S3_BUCKET (from the environment)"; fi)
$(printf '    %-22s%s\n' "PostgreSQL ($PG_NAME)" "127.0.0.1:$PG_PORT, database $PG_DB")
$([ -n "${PAYMENTS_PID:-}" ] && printf '    %-22s%s\n' "Payments (local fake)" "http://127.0.0.1:$PAYMENTS_PORT   (test card 4242 4242 4242 4242)")
  Logs: .run/ (build.log, migrate.log, seed.log, mail-dev.log, payments-dev.log, s3-dev.log)

  Ctrl-C stops the app, the inbox, the payments fake and the object store. The database keeps running: npm run db:stop stops it.

MSG
wait "$APP_PID"
