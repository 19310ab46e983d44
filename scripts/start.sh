#!/usr/bin/env bash
# npm start: everything needed to run the Trailbin demo on this machine, from nothing.
#   Debian packages (MariaDB) -> node_modules -> private MariaDB in .data/demo on 127.0.0.1:33061
#   -> database "trailbin" + user from .env.local (made on first run) -> migrations + seed
#   -> next build (only when sources changed) -> next start on http://127.0.0.1:3000
# Then watches: a MariaDB that dies is started again (a few times, with growing pauses). Ctrl-C, or
# TERM, INT or HUP to npm's pid or to this script's, stops the app, the mail sink, then MariaDB, and
# prints "Stopped.".
#
# Overrides: PORT (app, default 3000), DB_PORT (MariaDB, default DB_PORT in .env.local, else 33061),
# MAIL_SINK_PORT (the local SMTP sink whose messages /admin/mail shows, default 2525),
# TRAILBIN_DATA_DIR (default .data/demo; any other folder keeps its credentials in DIR/env instead of
# .env.local, so a second demo, or the test of npm start, never touches the first one's),
# TRAILBIN_PREBUILT (serve the build already in that folder, e.g. .next-test, instead of building .next).
# The data stays in .data/demo between runs; delete that folder (and .env.local) to start afresh.
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/lib/run.sh"
cd "$TRAILBIN_ROOT"

if [[ -n ${TRAILBIN_DATA_DIR:-} ]]; then
  mkdir -p "$TRAILBIN_DATA_DIR"
  DEMO_DIR=$(cd "$TRAILBIN_DATA_DIR" && pwd)
  ENV_FILE=$DEMO_DIR/env
else
  DEMO_DIR=$TRAILBIN_ROOT/.data/demo
  ENV_FILE=$TRAILBIN_ROOT/.env.local
fi
APP_PORT=${PORT:-3000}
APP_URL=http://127.0.0.1:$APP_PORT
run_files "$DEMO_DIR"
MAIL_SINK_PORT=${MAIL_SINK_PORT:-2525}
BUILD_PID=

# take_start_lock : one demo per checkout.
take_start_lock() {
  if ! run_lock "$DEMO_DIR/start.lock"; then
    local pid url
    pid=$(sed -n 1p "$DEMO_DIR/start.pid" 2>/dev/null) || true
    url=$(sed -n 2p "$DEMO_DIR/start.pid" 2>/dev/null) || true
    printf 'Trailbin is already running at %s (pid %s); stop it with Ctrl-C in its terminal, or kill -TERM %s\n' \
      "${url:-$APP_URL}" "${pid:-unknown}" "${pid:-<pid>}" >&2
    exit 1
  fi
  printf '%s\n%s\n' "$$" "$APP_URL" >"$DEMO_DIR/start.pid"
}

# load_demo_env : credentials live in .env.local (git-ignored; Next reads it too). Made on the
# first run with a random password, reused afterwards; keys a person deleted are added back.
load_demo_env() {
  local password
  password=$(env_file_get "$ENV_FILE" DB_PASSWORD)
  [[ -n $password ]] || password=$(random_secret)
  env_file_set "$ENV_FILE" DB_HOST 127.0.0.1
  env_file_set "$ENV_FILE" DB_PORT 33061
  env_file_set "$ENV_FILE" DB_NAME trailbin
  env_file_set "$ENV_FILE" DB_USER trailbin
  env_file_set "$ENV_FILE" DB_PASSWORD "$password"

  # Our server binds 127.0.0.1 only, so the host is not configurable.
  DB_HOST=127.0.0.1
  DB_PORT=${DB_PORT:-$(env_file_get "$ENV_FILE" DB_PORT)}
  DB_NAME=$(env_file_get "$ENV_FILE" DB_NAME)
  DB_USER=$(env_file_get "$ENV_FILE" DB_USER)
  DB_PASSWORD=$(env_file_get "$ENV_FILE" DB_PASSWORD)
  export DB_HOST DB_PORT DB_NAME DB_USER DB_PASSWORD
}

shutdown() {
  # Ignored, not reset: Ctrl-C reaches us twice (from the terminal and again from npm, which passes
  # INT on), and the second must not cut the shutdown short with MariaDB still running.
  trap '' INT TERM HUP
  trap - EXIT
  stop_ticker
  if [[ -n $BUILD_PID ]]; then
    stop_tree "$BUILD_PID" "next build"
    BUILD_PID=
  fi
  run_stop
  rm -f "$DEMO_DIR/start.pid"
  echo "Stopped."
}

on_signal() {
  echo
  log "$1 received; stopping"
  shutdown
  exit 0
}

# The one-second pause of supervise, in the background so that a signal is handled at once.
TICK_PID=
stop_ticker() {
  if [[ -n $TICK_PID ]]; then
    kill "$TICK_PID" 2>/dev/null || true
    wait "$TICK_PID" 2>/dev/null || true
  fi
  TICK_PID=
}

# parent_is PID : npm ran us (package.json execs this script, so npm is our parent) and is still
# our parent. npm dies at once of a signal it does not pass on (HUP, KILL), and we are then handed
# to init: a changed parent is how we learn that nobody is left to stop us.
parent_is() { [[ -z $1 || $(proc_stat_field $$ 2) == "$1" ]]; }

# supervise NPM_PID : the long wait of npm start. About once a second: the app still running, the
# npm that ran us still there, MariaDB running (started again when it died).
supervise() {
  local npm_pid=$1 rc
  while :; do
    if ! pid_running "$NEXT_PID"; then
      rc=0
      wait "$NEXT_PID" || rc=$?
      warn "the app exited on its own (status $rc); its log is $NEXT_LOG"
      tail -n 30 "$NEXT_LOG" >&2 || true
      NEXT_PID=
      exit 1
    fi
    if ! parent_is "$npm_pid"; then
      log "npm (pid $npm_pid) has ended; stopping"
      shutdown
      exit 0
    fi
    if ! mariadb_watch; then
      warn "stopping Trailbin: without MariaDB it can only answer \"database unavailable\""
      exit 1
    fi
    sleep 1 9>&- &
    TICK_PID=$!
    wait "$TICK_PID" 2>/dev/null || true
    TICK_PID=
  done
}

print_welcome() {
  echo
  echo "Trailbin is running at $APP_URL"
  if [[ -f scripts/demo-accounts.ts ]]; then
    node --import tsx scripts/demo-accounts.ts || warn "could not list the demo accounts"
  fi
  echo "Mail (invitations, password resets) goes to a local sink on 127.0.0.1:$MAIL_SINK_PORT; admins read it at $APP_URL/admin/mail"
  echo "Press Ctrl-C to stop (or kill -TERM $$)."
}

main() {
  take_start_lock
  # From here on anything we started is stopped however the script ends, whichever of these signals
  # reaches us (a terminal's Ctrl-C or hang-up, a service manager's TERM, npm passing one on).
  trap 'on_signal INT' INT
  trap 'on_signal TERM' TERM
  trap 'on_signal HUP' HUP
  trap 'rc=$?; shutdown; exit $rc' EXIT
  local npm_pid=
  if [[ -n ${npm_lifecycle_event:-} ]]; then npm_pid=$PPID; fi

  ensure_debian_packages
  ensure_node_modules
  load_demo_env
  mariadb_configure "$DEMO_DIR" "$DB_PORT"

  next_stop_stale "$NEXT_PIDFILE"
  mail_sink_stop_stale "$MAIL_PIDFILE"
  # Check the ports before starting anything, so a clash costs nothing.
  require_free_port "$APP_PORT" "the web app" "run with PORT=<another port>"
  require_free_port "$MAIL_SINK_PORT" "the mail sink" "run with MAIL_SINK_PORT=<another port>"
  if [[ -z $(mariadb_running_pid) ]]; then require_free_port "$DB_PORT" "MariaDB" "run with DB_PORT=<another port>"; fi

  mariadb_init
  mariadb_start
  mariadb_provision "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
  # Before the seed: releasing the demo wave queues a mail whose links point at this app.
  export APP_ORIGIN=${APP_ORIGIN:-$APP_URL}
  migrate_and_seed
  # Mail goes to the local sink (SMTP_HOST/SMTP_PORT).
  mail_sink_start "$MAIL_SINK_PORT" "$MAIL_LOG" "$MAIL_PIDFILE"

  if [[ -n ${TRAILBIN_PREBUILT:-} ]]; then
    [[ -f $TRAILBIN_PREBUILT/BUILD_ID ]] || die "TRAILBIN_PREBUILT=$TRAILBIN_PREBUILT holds no finished build (no BUILD_ID)"
    export NEXT_DIST_DIR=$TRAILBIN_PREBUILT
  else
    export NEXT_DIST_DIR=.next
    # In the background so that a signal during a first build of minutes stops it at once.
    build_if_needed 9>&- &
    BUILD_PID=$!
    local rc=0
    wait "$BUILD_PID" || rc=$?
    BUILD_PID=
    ((rc == 0)) || exit "$rc"
  fi
  export UPLOAD_DIR=$DEMO_DIR/uploads
  NODE_ENV=production next_start "$APP_PORT" "$NEXT_LOG" "$NEXT_PIDFILE"
  print_welcome
  supervise "$npm_pid"
}

main "$@"
