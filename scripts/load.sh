#!/usr/bin/env bash
# npm run load: 50 handhelds confirming picks while a planner plans a 1,000-order wave, against a
# production build on loopback with its own MariaDB. Not a test and not part of npm test or CI.
#   Debian packages -> node_modules -> private MariaDB in .data/load on 127.0.0.1:33070
#   -> fresh database "trailbin_load" -> migrations + demo seed -> mail sink on 2530
#   -> next build into .next-load (only when sources changed) -> next start on http://127.0.0.1:3010
#   -> scripts/load.ts (set-up through the API, autocannon, the planner, the check in the database).
# Everything it started is stopped on exit, whatever happened. Exits non-zero when a target is missed.
#
# Settings (environment):
#   LOAD_SECONDS           length of the paced run (default 60)
#   LOAD_RATE              requests per second per handheld in the paced run (default 1, ten times a
#                          fast picker's pace)
#   LOAD_SATURATION_SECONDS  length of the unpaced run after it (default 10; 0 skips it)
#   LOAD_PORT, LOAD_DB_PORT, LOAD_MAIL_SINK_PORT  (defaults 3010, 33070, 2530)
# Arguments go to scripts/load.ts: --write puts the results into docs/benchmarks.md.
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/lib/run.sh"
cd "$TRAILBIN_ROOT"

LOAD_DIR=$TRAILBIN_ROOT/.data/load
APP_PORT=${LOAD_PORT:-3010}
DB_PORT_LOAD=${LOAD_DB_PORT:-33070}
MAIL_PORT_LOAD=${LOAD_MAIL_SINK_PORT:-2530}
run_files "$LOAD_DIR"

take_load_lock() {
  run_lock "$LOAD_DIR/load.lock" || die "another npm run load is already running in this checkout; wait for it to finish"
}

cleanup() {
  trap - EXIT INT TERM
  run_stop
}

main() {
  take_load_lock
  trap cleanup EXIT
  trap 'exit 130' INT
  trap 'exit 143' TERM

  ensure_debian_packages
  ensure_node_modules

  next_stop_stale "$NEXT_PIDFILE"
  require_free_port "$APP_PORT" "the load-run app" "run with LOAD_PORT=<another port>"
  mariadb_up "$LOAD_DIR" "$DB_PORT_LOAD" "the load-run MariaDB" "run with LOAD_DB_PORT=<another port>"

  # A fresh database every run: the check afterwards must see only this run's confirmations.
  fresh_database trailbin_load
  migrate_and_seed
  mail_sink_start "$MAIL_PORT_LOAD" "$MAIL_LOG" "$MAIL_PIDFILE"

  app_start_built "$LOAD_DIR" "$APP_PORT" .next-load

  APP_URL=$APP_ORIGIN NEXT_PID=$NEXT_PID MDB_PID=$MDB_PID \
    node --conditions=react-server --import tsx scripts/load.ts "$@" </dev/null
}

main "$@"
