#!/usr/bin/env bash
# npm test: every test suite, with every service it needs, from nothing; nothing is left running.
#   Debian packages (MariaDB, Chromium) -> node_modules -> format check + unit suite (no services)
#   -> private MariaDB in .data/test on 127.0.0.1:33062 -> fresh database "trailbin_test"
#   -> migrations + seed -> next build into .next-test (only when sources changed; always in CI)
#   -> next start on http://127.0.0.1:3001 -> integration + browser suites.
# Ends with one line "N passed, N failed" (all suites together); exits non-zero if anything failed.
#
# Never disturbs a running npm start: other datadir, ports, database and build folder.
# Settings (environment):
#   TEST_SUITES   which suites to run, comma or space separated: unit,integration,browser (default all)
#   TEST_PORT     app port (default 3001)        TEST_DB_PORT  MariaDB port (default 33062)
#   TEST_MAIL_SINK_PORT  the local SMTP sink (default 2526)
#   TEST_SECOND_PORT     a second app a fault test may start from the same build (default TEST_PORT+1)
#   TEST_FILES    only the test files whose paths contain one of these words (space separated),
#                 e.g. TEST_FILES="picking auth" while working on those; CI runs everything
# The suites see APP_URL, APP_ORIGIN, DB_HOST, DB_PORT, DB_NAME, DB_USER, DB_PASSWORD, SMTP_HOST,
# SMTP_PORT, CHROMIUM_PATH, NEXT_DIST_DIR, TEST_SECOND_APP_PORT and TRAILBIN_TEST_SERVICES (the
# command that stops and starts the test MariaDB or mail sink, scripts/test-services.sh).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/lib/run.sh"
cd "$TRAILBIN_ROOT"

TEST_DIR=$TRAILBIN_ROOT/.data/test
ENV_FILE=$TEST_DIR/env
APP_PORT=${TEST_PORT:-3001}
DB_PORT_TEST=${TEST_DB_PORT:-33062}
MAIL_SINK_PORT_TEST=${TEST_MAIL_SINK_PORT:-2526}
run_files "$TEST_DIR"
TOTAL_PASSED=0
TOTAL_FAILED=0
ANY_FAILED=0

# Which suites to run.
SUITES=" $(printf '%s' "${TEST_SUITES:-unit,integration,browser}" | tr ',' ' ') "
for s in $SUITES; do
  case $s in unit | integration | browser) ;; *) die "TEST_SUITES: unknown suite '$s' (use unit, integration, browser)" ;; esac
done
wants() { [[ $SUITES == *" $1 "* ]]; }
wants_services() { wants integration || wants browser; }

take_test_lock() {
  if ! run_lock "$TEST_DIR/test.lock"; then
    printf 'Another npm test is already running in this checkout (pid %s); wait for it to finish.\n' \
      "$(cat "$TEST_DIR/test.pid" 2>/dev/null || echo unknown)" >&2
    exit 1
  fi
  printf '%s\n' "$$" >"$TEST_DIR/test.pid"
}

# load_test_env : test credentials live in .data/test/env (git-ignored), made once, reused.
load_test_env() {
  local password
  password=$(env_file_get "$ENV_FILE" DB_PASSWORD)
  [[ -n $password ]] || password=$(random_secret)
  env_file_set "$ENV_FILE" DB_PASSWORD "$password"
  DB_HOST=127.0.0.1
  DB_PORT=$DB_PORT_TEST
  DB_NAME=trailbin_test
  DB_USER=trailbin
  DB_PASSWORD=$password
  export DB_HOST DB_PORT DB_NAME DB_USER DB_PASSWORD
}

cleanup() {
  run_stop
  rm -f "$TEST_DIR/test.pid"
}

# run_vitest NAME ARGS... : one vitest run with a JSON report, whose counts are added to the totals.
# A failed run with no failed test case (a file that does not import, an unhandled error) still
# counts as a failure, so the closing line never says "0 failed" for a red run.
run_vitest() {
  local name=$1 report=$TEST_DIR/results-$1.json rc=0
  shift
  rm -f "$report"
  log "running the $name suite"
  local filters=()
  if [[ -n ${TEST_FILES:-} ]]; then read -r -a filters <<<"$TEST_FILES"; fi
  node node_modules/vitest/vitest.mjs run "$@" "${filters[@]}" --passWithNoTests \
    --reporter=default --reporter=json --outputFile="$report" </dev/null || rc=$?
  local counts passed=0 failed=0 failed_files=0
  if [[ -f $report ]]; then
    counts=$(node -e '
      const r = JSON.parse(require("fs").readFileSync(process.argv[1], "utf8"));
      console.log([r.numPassedTests || 0, r.numFailedTests || 0, r.numFailedTestSuites || 0].join(" "));
    ' "$report") || counts="0 0 0"
    read -r passed failed failed_files <<<"$counts"
  fi
  if ((rc != 0)); then
    ANY_FAILED=1
    if ((failed == 0)); then failed=$((failed_files > 0 ? failed_files : 1)); fi
    warn "the $name suite failed (vitest exit status $rc)"
  fi
  TOTAL_PASSED=$((TOTAL_PASSED + passed))
  TOTAL_FAILED=$((TOTAL_FAILED + failed))
}

# check_format : prettier in check mode over the tree (.prettierignore says what it skips). An
# unformatted tree counts as one failed test, so the closing line shows it.
check_format() {
  local rc=0
  log "checking the formatting (prettier --check)"
  node node_modules/prettier/bin/prettier.cjs --check . --log-level warn --cache --cache-location "$TEST_DIR/prettier-cache" </dev/null || rc=$?
  if ((rc == 0)); then
    TOTAL_PASSED=$((TOTAL_PASSED + 1))
  else
    ANY_FAILED=1
    TOTAL_FAILED=$((TOTAL_FAILED + 1))
    warn "the formatting check failed (prettier exit status $rc) for the files above: Run npm run format"
  fi
}

# start_services : everything the integration and browser suites talk to.
start_services() {
  next_stop_stale "$NEXT_PIDFILE"
  mail_sink_stop_stale "$MAIL_PIDFILE"
  require_free_port "$APP_PORT" "the test app" "run with TEST_PORT=<another port>"
  require_free_port "$MAIL_SINK_PORT_TEST" "the test mail sink" "run with TEST_MAIL_SINK_PORT=<another port>"
  mariadb_up "$TEST_DIR" "$DB_PORT" "the test MariaDB" "run with TEST_DB_PORT=<another port>"
  mariadb_provision "$DB_NAME" "$DB_USER" "$DB_PASSWORD" recreate
  migrate_and_seed
  mail_sink_start "$MAIL_SINK_PORT_TEST" "$MAIL_LOG" "$MAIL_PIDFILE"
  export TRAILBIN_TEST_SERVICES=$TRAILBIN_ROOT/scripts/test-services.sh
  export TEST_SECOND_APP_PORT=${TEST_SECOND_PORT:-$((APP_PORT + 1))}
  app_start_built "$TEST_DIR" "$APP_PORT" .next-test
}

# on_exit : whatever happened, stop the services and print the closing line. A run that stops
# early (a build error, say, or Ctrl-C) counts as one more failure, so the line matches the exit code.
on_exit() {
  local rc=$1
  trap - EXIT INT TERM
  cleanup
  if ((rc != 0 && ANY_FAILED == 0)); then
    TOTAL_FAILED=$((TOTAL_FAILED + 1))
    warn "the test run stopped early (status $rc)"
  fi
  printf '%s passed, %s failed\n' "$TOTAL_PASSED" "$TOTAL_FAILED"
  exit "$rc"
}

main() {
  take_test_lock
  trap 'on_exit $?' EXIT
  trap 'exit 130' INT
  trap 'exit 143' TERM

  if wants browser; then ensure_debian_packages chromium; else ensure_debian_packages; fi
  ensure_node_modules
  export CHROMIUM_PATH=/usr/bin/chromium

  if wants unit; then
    check_format
    run_vitest unit --project unit
  fi

  if wants_services; then
    load_test_env
    start_services
    # One suite after the other: both share the test database, and a browser test that plans a wave
    # must not take the orders an integration test is about to plan.
    for s in integration browser; do
      if wants "$s"; then APP_URL=http://127.0.0.1:$APP_PORT run_vitest "$s" --project "$s"; fi
    done
  fi

  if ((ANY_FAILED)); then exit 1; fi
  exit 0
}

main "$@"
