#!/usr/bin/env bash
# npm run db:backup [-- DIR] / npm run db:restore -- BACKUP: see scripts/db-backup.ts.
# The database is DATABASE_URL when the environment gives one, else the dev cluster (started if need be).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
action="$1"; shift
ensure_postgres_binaries
if [ -z "${DATABASE_URL:-}" ]; then pg_start dev >&2; fi
PG_BIN="$(pg_bin_dir)" exec npx tsx scripts/db-backup.ts "$action" "$@"
