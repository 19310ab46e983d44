# shellcheck shell=bash
# What the command scripts (start.sh, test.sh, load.sh, bench.sh, test-services.sh) share: every
# library, and the pieces of a run that keeps its servers under one folder of .data. Sourced, never run:
#   source "$(dirname "${BASH_SOURCE[0]}")/lib/run.sh"

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
source "$TRAILBIN_ROOT/scripts/lib/mariadb.sh"
source "$TRAILBIN_ROOT/scripts/lib/app.sh"
source "$TRAILBIN_ROOT/scripts/lib/mail.sh"

# run_files DIR : where the run in DIR keeps the pid files and logs of its app and its mail sink.
run_files() {
  NEXT_PIDFILE=$1/next.pid
  NEXT_LOG=$1/next.log
  MAIL_PIDFILE=$1/mail-sink.pid
  MAIL_LOG=$1/mail-sink.log
}

# run_lock FILE : take FILE's lock on fd 9, false when another run holds it. The lock lives for the life
# of the script (the kernel drops it when we exit, however we exit); servers are started with 9>&- so
# they never hold it.
run_lock() {
  mkdir -p "$(dirname "$1")"
  exec 9>"$1"
  flock -n 9
}

# run_stop : the app, then the mail sink, then MariaDB, which both write to.
run_stop() {
  next_stop
  rm -f "$NEXT_PIDFILE"
  mail_sink_stop "$MAIL_PIDFILE"
  mariadb_stop
}

# fresh_database NAME : a new database NAME on our MariaDB, for user trailbin with a new random
# password, and the DB_* variables exported for it.
fresh_database() {
  export DB_HOST=127.0.0.1 DB_PORT=$MDB_PORT DB_NAME=$1 DB_USER=trailbin DB_PASSWORD
  DB_PASSWORD=$(random_secret)
  mariadb_provision "$DB_NAME" "$DB_USER" "$DB_PASSWORD" recreate
}
