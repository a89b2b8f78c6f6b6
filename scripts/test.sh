#!/usr/bin/env bash
# npm test: the same set-up as npm start against a separate test database, then every test:
# svelte-check, unit and integration tests (vitest, real PostgreSQL), browser tests (Chromium).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
[ -x /usr/bin/chromium ] || apt_install chromium
pg_start test
npx tsx scripts/migrate.ts

failed_stages=()
stage() {
	local name="$1"; shift
	say "── $name"
	if "$@"; then say "$name: ok"; else say "$name: FAILED"; failed_stages+=("$name"); fi
}

rm -f "$RUN_DIR"/vitest-*.json
stage "sync" npx svelte-kit sync
stage "svelte-check" npx svelte-check --tsconfig ./tsconfig.json --fail-on-warnings --output machine-verbose --threshold error
stage "build" npx vite build --logLevel warn
stage "unit and integration tests" npx vitest run --project unit --project integration \
	--reporter=default --reporter=json --outputFile.json="$RUN_DIR/vitest-main.json"
stage "browser tests" npx vitest run --project browser \
	--reporter=default --reporter=json --outputFile.json="$RUN_DIR/vitest-browser.json"

node scripts/test-summary.js "${failed_stages[@]+"${failed_stages[@]}"}"
