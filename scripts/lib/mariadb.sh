# shellcheck shell=bash
# A private MariaDB server per purpose (demo or test): its own datadir, socket, pid file and port
# on 127.0.0.1, so a system MariaDB on 3306 (if any) is never used or disturbed.
#
# Call mariadb_configure DIR PORT first; it sets:
#   MDB_DIR      .data/demo or .data/test (absolute)
#   MDB_DATADIR  MDB_DIR/mysql          the InnoDB files
#   MDB_SOCKET   MDB_DIR/mysqld.sock    root logs in over this socket (unix_socket auth, no password)
#   MDB_PIDFILE, MDB_LOG, MDB_PORT
# Needs common.sh. Sets MDB_PID to the server it started or adopted.

MDB_PID=

mariadb_configure() {
  MDB_DIR=$1
  MDB_PORT=$2
  MDB_DATADIR=$MDB_DIR/mysql
  MDB_SOCKET=$MDB_DIR/mysqld.sock
  # A unix socket path must fit in 108 bytes; a deep checkout (CI clones elsewhere) may not.
  if ((${#MDB_SOCKET} > 100)); then
    MDB_SOCKET=${TMPDIR:-/tmp}/trailbin-$(printf '%s' "$MDB_DIR" | sha256sum | cut -c1-12).sock
  fi
  MDB_PIDFILE=$MDB_DIR/mysqld.pid
  MDB_LOG=$MDB_DIR/mysqld.err
  # unix_socket auth maps the OS user to the MariaDB account of the same name.
  if [[ $EUID -eq 0 ]]; then MDB_ADMIN=root; else MDB_ADMIN=$(id -un); fi
  mkdir -p "$MDB_DIR"
}

# The --user flag: mariadbd refuses to run as root without it, and a non-root user cannot switch.
_mariadb_user_args() {
  if [[ $EUID -eq 0 ]]; then printf '%s\n' --user=root; fi
}

# mariadb_sql [mariadb args...] : run SQL from stdin as the admin over our socket only.
mariadb_sql() {
  mariadb --no-defaults --socket="$MDB_SOCKET" -u"$MDB_ADMIN" --batch "$@"
}

mariadb_ping() {
  mariadb-admin --no-defaults --socket="$MDB_SOCKET" -u"$MDB_ADMIN" --connect-timeout=2 ping >/dev/null 2>&1
}

_mariadb_install_db() { mariadb-install-db "$@" >"$MDB_DIR/install-db.log" 2>&1; }

# mariadb_init : create the system tables once. A marker file tells a finished init from one that
# was interrupted (a half-made datadir is useless and safe to redo: it holds no data yet).
mariadb_init() {
  if [[ -f $MDB_DIR/.initialised || -d $MDB_DATADIR/mysql ]]; then
    touch "$MDB_DIR/.initialised"
    return 0
  fi
  rm -rf "$MDB_DATADIR"
  mkdir -p "$MDB_DATADIR"
  local args=(--no-defaults --datadir="$MDB_DATADIR" --auth-root-authentication-method=socket --skip-test-db)
  if [[ $EUID -eq 0 ]]; then args+=(--user=root); else args+=(--auth-root-socket-user="$MDB_ADMIN"); fi
  log "initialising MariaDB datadir $MDB_DATADIR"
  if ! timed "mariadb-install-db" _mariadb_install_db "${args[@]}"; then
    tail -n 30 "$MDB_DIR/install-db.log" >&2
    die "mariadb-install-db failed (full log: $MDB_DIR/install-db.log)"
  fi
  touch "$MDB_DIR/.initialised"
}

# _mariadb_pid_is_ours PID : true when PID is a mariadbd serving our datadir (and not some other
# process that happens to have reused the number from a stale pid file).
_mariadb_pid_is_ours() {
  local cmd
  cmd=$(proc_cmdline "$1")
  [[ $cmd == *mariadbd* && $cmd == *"--datadir=$MDB_DATADIR "* ]]
}

mariadb_running_pid() {
  local pid
  [[ -n ${MDB_PIDFILE:-} ]] || return 0
  pid=$(cat "$MDB_PIDFILE" 2>/dev/null) || true
  if [[ -n $pid ]] && pid_alive "$pid" && _mariadb_pid_is_ours "$pid"; then printf '%s' "$pid"; fi
}

# mariadb_start : start our server, or adopt the one a killed earlier run left behind.
mariadb_start() {
  mariadb_try_start || die "MariaDB failed to start on port $MDB_PORT"
}

# mariadb_try_start [keep-log] : mariadb_start that returns 1 instead of ending the script, for the
# restarts of a supervised server; keep-log leaves the log of the server that died for a person to read.
mariadb_try_start() {
  local pid keep_log=${1:-}
  pid=$(mariadb_running_pid)
  if [[ -n $pid ]]; then
    if mariadb_ping; then
      log "reusing MariaDB (pid $pid) left running by an earlier run"
      MDB_PID=$pid
      return 0
    fi
    warn "MariaDB (pid $pid) from an earlier run does not answer; restarting it"
    stop_pid "$pid" MariaDB 60
  fi
  # Whatever the pid file named is gone or not ours: forget it.
  rm -f "$MDB_PIDFILE"
  if port_in_use "$MDB_PORT"; then
    warn "port $MDB_PORT is already in use by $(port_owner "$MDB_PORT"), but MariaDB needs it; stop that program"
    return 1
  fi

  [[ $keep_log == keep-log ]] || : >"$MDB_LOG"
  local args=(--no-defaults $(_mariadb_user_args) --datadir="$MDB_DATADIR"
    --bind-address=127.0.0.1 --port="$MDB_PORT" --socket="$MDB_SOCKET"
    --pid-file="$MDB_PIDFILE" --log-error="$MDB_LOG" --skip-name-resolve
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci)
  # setsid: Ctrl-C goes to our script only, which then stops Next before MariaDB (in that order).
  # 9>&- : the server must not inherit the start/test lock, or a crash would leave it held.
  setsid mariadbd "${args[@]}" </dev/null >>"$MDB_LOG" 2>&1 9>&- &
  MDB_PID=$!

  local i
  for ((i = 0; i < 300; i++)); do
    if mariadb_ping; then
      log "MariaDB is up on 127.0.0.1:$MDB_PORT (pid $MDB_PID)"
      return 0
    fi
    pid_running "$MDB_PID" || break
    sleep 0.1
  done
  warn "MariaDB did not start; last lines of $MDB_LOG:"
  tail -n 40 "$MDB_LOG" >&2
  stop_pid "$MDB_PID" MariaDB 10
  MDB_PID=
  return 1
}

# Supervision (npm start): a server that dies is started again after 1, 2, 4, 8 and 16 s; one that
# keeps dying is given up after MDB_MAX_RESTARTS tries in a row, since restarting it for ever would
# hide a full disk or a broken datadir behind an app that only ever says "database unavailable".
MDB_MAX_RESTARTS=5
# Up this long again, a server counts as healthy: its next death starts the count afresh.
MDB_HEALTHY_AFTER_S=60
MDB_RESTARTS=0
MDB_RETRY_AT=
MDB_UP_SINCE=$SECONDS

# _mariadb_reap PID : sets MDB_EXIT to how our server ended ("killed by SIGKILL", "exit status 1").
# Not in a $(...): a subshell cannot wait for its parent's child.
_mariadb_reap() {
  local rc=0
  wait "$1" 2>/dev/null || rc=$?
  if ((rc == 127)); then
    # Only our own child can be waited for, not a server adopted from an earlier run.
    MDB_EXIT="why is not known"
  elif ((rc > 128)); then
    MDB_EXIT="killed by SIG$(kill -l $((rc - 128)) 2>/dev/null || echo $((rc - 128)))"
  else
    MDB_EXIT="exit status $rc"
  fi
}

# mariadb_watch : one look, about once a second from npm start's wait. Starts the server again when it
# has died and its wait is over; returns 1 when it has failed MDB_MAX_RESTARTS times in a row.
mariadb_watch() {
  if [[ -n ${MDB_PID:-} ]] && pid_running "$MDB_PID"; then
    if ((MDB_RESTARTS > 0 && SECONDS - MDB_UP_SINCE >= MDB_HEALTHY_AFTER_S)); then MDB_RESTARTS=0; fi
    return 0
  fi
  if [[ -z $MDB_RETRY_AT ]]; then
    local how="it did not start again"
    if [[ -n ${MDB_PID:-} ]]; then
      _mariadb_reap "$MDB_PID"
      how=$MDB_EXIT
    fi
    if ((MDB_RESTARTS >= MDB_MAX_RESTARTS)); then
      warn "MariaDB stopped again ($how) after $MDB_RESTARTS restarts in a row; giving up. Its log: $MDB_LOG"
      return 1
    fi
    local delay=$((1 << MDB_RESTARTS))
    warn "MariaDB (pid ${MDB_PID:-none}) stopped unexpectedly ($how); restarting it in ${delay} s (attempt $((MDB_RESTARTS + 1)) of $MDB_MAX_RESTARTS). Meanwhile the app answers 503 \"database unavailable\". Its log: $MDB_LOG"
    MDB_PID=
    MDB_RETRY_AT=$((SECONDS + delay))
    return 0
  fi
  ((SECONDS >= MDB_RETRY_AT)) || return 0
  MDB_RETRY_AT=
  MDB_RESTARTS=$((MDB_RESTARTS + 1))
  if mariadb_try_start keep-log; then
    MDB_UP_SINCE=$SECONDS
    log "MariaDB is back (pid $MDB_PID); the app reconnects by itself"
  fi
  return 0
}

# mariadb_stop : clean shutdown (InnoDB flushes on SIGTERM), then wait for the process to exit.
mariadb_stop() {
  local pid=${MDB_PID:-}
  # The server we started may be gone and another in its place (a fault test restarts it through
  # scripts/test-services.sh): then the pid file names the one to stop. Reap ours if it is a zombie.
  if [[ -n $pid ]] && ! { pid_alive "$pid" && _mariadb_pid_is_ours "$pid"; }; then
    wait "$pid" 2>/dev/null || true
    pid=
  fi
  [[ -n $pid ]] || pid=$(mariadb_running_pid)
  [[ -n $pid ]] || return 0
  if pid_alive "$pid" && _mariadb_pid_is_ours "$pid"; then
    log "stopping MariaDB (pid $pid)"
    stop_pid "$pid" MariaDB 60
  fi
  MDB_PID=
}

# _sql_string S : S as a single-quoted SQL literal.
_sql_string() {
  local s=${1//\\/\\\\}
  printf "'%s'" "${s//\'/\\\'}"
}

# mariadb_provision DB USER PASSWORD [recreate] : the database plus an app user that may use only
# it, from 127.0.0.1. CREATE IF NOT EXISTS + ALTER keeps the password equal to the env file's on
# every run. "recreate" drops the database first (the test suite starts clean each time).
mariadb_provision() {
  local db=$1 user=$2 password=$3 recreate=${4:-}
  [[ $db =~ ^[A-Za-z0-9_]+$ ]] || die "DB_NAME '$db' may contain only letters, digits and _"
  [[ $user =~ ^[A-Za-z0-9_]+$ ]] || die "DB_USER '$user' may contain only letters, digits and _"
  [[ -n $password ]] || die "empty DB_PASSWORD"
  local pw
  pw=$(_sql_string "$password")
  {
    [[ $recreate == recreate ]] && printf 'DROP DATABASE IF EXISTS `%s`;\n' "$db"
    printf 'CREATE DATABASE IF NOT EXISTS `%s` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;\n' "$db"
    printf "CREATE USER IF NOT EXISTS '%s'@'127.0.0.1' IDENTIFIED BY %s;\n" "$user" "$pw"
    printf "ALTER USER '%s'@'127.0.0.1' IDENTIFIED BY %s;\n" "$user" "$pw"
    printf "GRANT ALL PRIVILEGES ON \`%s\`.* TO '%s'@'127.0.0.1';\n" "$db" "$user"
  } | mariadb_sql || die "could not create database $db / user $user"
}

# mariadb_up DIR PORT WHAT HINT : our server for DIR on PORT, running (started, or adopted from a
# killed earlier run); WHAT and HINT name it and the way out when something else holds the port.
mariadb_up() {
  mariadb_configure "$1" "$2"
  if [[ -z $(mariadb_running_pid) ]]; then require_free_port "$MDB_PORT" "$3" "$4"; fi
  mariadb_init
  mariadb_start
}
