#!/usr/bin/env bash
# Stops or starts one service of a running npm test, for the fault tests:
#   scripts/test-services.sh mariadb stop|start
#   scripts/test-services.sh mail-sink stop|start
# Same datadir, socket, ports and pid files as scripts/test.sh, which exports this script's path as
# TRAILBIN_TEST_SERVICES together with DB_* and SMTP_PORT; its cleanup stops whatever the pid files
# name, so a server restarted here is stopped at the end of the run like the first one.
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/lib/run.sh"
cd "$TRAILBIN_ROOT"

TEST_DIR=$TRAILBIN_ROOT/.data/test
[[ -f $TEST_DIR/test.pid ]] || die "no npm test is running in this checkout; run the fault tests through npm test"
service=${1:-}
action=${2:-}

case "$service:$action" in
  mariadb:stop | mariadb:start)
    [[ -n ${DB_PORT:-} ]] || die "DB_PORT is not set (scripts/test.sh exports it)"
    mariadb_configure "$TEST_DIR" "$DB_PORT"
    if [[ $action == stop ]]; then mariadb_stop; else mariadb_start; fi
    ;;
  mail-sink:stop)
    mail_sink_stop "$TEST_DIR/mail-sink.pid"
    ;;
  mail-sink:start)
    [[ -n ${SMTP_PORT:-} ]] || die "SMTP_PORT is not set (scripts/test.sh exports it)"
    mail_sink_start "$SMTP_PORT" "$TEST_DIR/mail-sink.log" "$TEST_DIR/mail-sink.pid"
    ;;
  *) die "usage: $0 mariadb|mail-sink stop|start" ;;
esac
