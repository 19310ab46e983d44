#!/usr/bin/env bash
# npm run bench: the benchmarks, printed as tables (not tests: nothing here passes or fails on time).
#   1. routing engine (scripts/bench.ts), largest floor plan (scripts/bench-graph-size.ts)
#   2. exact routes at cart size (scripts/bench-exact.ts), Held–Karp against its C reference
#      (scripts/bench/held-karp.ts), the LP bound on its own (scripts/bench/lp.ts)
#   3. wave batching (scripts/bench-waves.ts)
#   4. order sheet import into MariaDB (scripts/bench-import.ts), on a private server in .data/bench
#      on 127.0.0.1:33063 that is stopped again at the end.
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/lib/run.sh"
cd "$TRAILBIN_ROOT"

BENCH_DIR=$TRAILBIN_ROOT/.data/bench

main() {
  ensure_debian_packages
  ensure_node_modules
  node --import tsx scripts/bench.ts "$@"
  echo
  node --import tsx scripts/bench-graph-size.ts
  echo
  node --import tsx scripts/bench-exact.ts
  echo
  node --import tsx scripts/bench/held-karp.ts
  echo
  node --import tsx scripts/bench/lp.ts 5
  echo
  node --import tsx scripts/bench-waves.ts
  echo
  trap 'mariadb_stop' EXIT INT TERM
  mariadb_up "$BENCH_DIR" "${BENCH_DB_PORT:-33063}" "the benchmark MariaDB" "run with BENCH_DB_PORT=<another port>"
  fresh_database trailbin_bench
  migrate_and_seed >/dev/null
  node --conditions=react-server --import tsx scripts/bench-import.ts
}

main "$@"
