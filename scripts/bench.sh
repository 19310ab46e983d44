#!/usr/bin/env bash
# npm run bench: the benchmarks, printed as tables (not tests: nothing here passes or fails on time).
#   1. routing engine (scripts/bench.ts), largest floor plan (scripts/bench-graph-size.ts)
#   2. wave batching (scripts/bench-waves.ts)
#   3. order sheet import into MariaDB (scripts/bench-import.ts), on a private server in .data/bench
#      on 127.0.0.1:33063 that is stopped again at the end.
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
source "$TRAILBIN_ROOT/scripts/lib/mariadb.sh"
source "$TRAILBIN_ROOT/scripts/lib/app.sh"
cd "$TRAILBIN_ROOT"

BENCH_DIR=$TRAILBIN_ROOT/.data/bench
MDB_PID=

main() {
  ensure_debian_packages
  ensure_node_modules
  node --import tsx scripts/bench.ts "$@"
  echo
  node --import tsx scripts/bench-graph-size.ts
  echo
  node --import tsx scripts/bench-waves.ts
  echo
  trap 'mariadb_stop' EXIT INT TERM
  mariadb_up "$BENCH_DIR" "${BENCH_DB_PORT:-33063}" "the benchmark MariaDB" "run with BENCH_DB_PORT=<another port>"
  export DB_HOST=127.0.0.1 DB_PORT=$MDB_PORT DB_NAME=trailbin_bench DB_USER=trailbin DB_PASSWORD
  DB_PASSWORD=$(random_secret)
  mariadb_provision "$DB_NAME" "$DB_USER" "$DB_PASSWORD" recreate
  migrate_and_seed >/dev/null
  node --conditions=react-server --import tsx scripts/bench-import.ts
}

main "$@"
