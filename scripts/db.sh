#!/usr/bin/env bash
# Usage: scripts/db.sh start|stop|status [dev|test] [fast|immediate]   (npm run db:start / db:stop / db:status)
source "$(dirname "$0")/lib.sh"
action="${1:-status}"
cluster="${2:-dev}"
case "$action" in
	start) pg_start "$cluster" ;;
	stop) pg_stop "$cluster" "${3:-fast}" ;;
	status) pg_status "$cluster" ;;
	*) die "usage: scripts/db.sh start|stop|status [dev|test]" ;;
esac
