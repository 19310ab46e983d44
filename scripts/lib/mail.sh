# shellcheck shell=bash
# The local SMTP sink (scripts/mail-sink.ts) shared by start.sh and test.sh: started after MariaDB and
# the migrations (it stores into the app's database), stopped after the app and before MariaDB.
# Needs common.sh and the DB_* variables. Sets MAIL_PID; exports SMTP_HOST and SMTP_PORT for the app.

MAIL_PID=

_mail_sink_pid_is_ours() {
  local cmd cwd
  cmd=$(proc_cmdline "$1")
  cwd=$(readlink "/proc/$1/cwd" 2>/dev/null) || true
  [[ $cmd == *scripts/mail-sink.ts* && $cwd == "$TRAILBIN_ROOT" ]]
}

# mail_sink_stop_stale PIDFILE : a killed earlier run may have left its sink behind, holding the port.
mail_sink_stop_stale() {
  local pidfile=$1 pid
  pid=$(cat "$pidfile" 2>/dev/null) || true
  if [[ -n $pid ]] && pid_alive "$pid" && _mail_sink_pid_is_ours "$pid"; then
    warn "stopping the mail sink (pid $pid) left running by an earlier run"
    stop_pid "$pid" "mail sink" 10
  fi
  rm -f "$pidfile"
}

# mail_sink_start PORT LOGFILE PIDFILE : start the sink on 127.0.0.1:PORT and wait until it accepts.
mail_sink_start() {
  local port=$1 logfile=$2 pidfile=$3 i
  mail_sink_stop_stale "$pidfile"
  require_free_port "$port" "the mail sink" "run with MAIL_SINK_PORT=<another port>"
  : >"$logfile"
  # Own session (Ctrl-C reaches only our script, which stops things in order); 9>&- keeps the lock ours.
  MAIL_SINK_PORT=$port setsid node --conditions=react-server --import tsx scripts/mail-sink.ts </dev/null >>"$logfile" 2>&1 9>&- &
  MAIL_PID=$!
  printf '%s\n' "$MAIL_PID" >"$pidfile"
  for ((i = 0; i < 150; i++)); do
    if port_in_use "$port"; then
      log "mail sink is up on 127.0.0.1:$port (pid $MAIL_PID)"
      export SMTP_HOST=127.0.0.1 SMTP_PORT=$port
      return 0
    fi
    pid_alive "$MAIL_PID" || break
    sleep 0.1
  done
  warn "the mail sink did not start; its log ($logfile):"
  tail -n 30 "$logfile" >&2
  mail_sink_stop "$pidfile"
  die "mail sink failed to start on port $port"
}

# mail_sink_stop [PIDFILE] : SIGTERM, wait; forget the pid file.
mail_sink_stop() {
  local pidfile=${1:-} pid=${MAIL_PID:-}
  # A fault test may have stopped ours and started another (scripts/test-services.sh): the pid file
  # then names the one running. Reap ours if it is a zombie.
  if [[ -n $pid ]] && ! { pid_alive "$pid" && _mail_sink_pid_is_ours "$pid"; }; then
    wait "$pid" 2>/dev/null || true
    pid=
  fi
  if [[ -z $pid && -n $pidfile ]]; then
    pid=$(cat "$pidfile" 2>/dev/null) || true
    # A pid read back from a file may have been reused by another program since.
    [[ -n $pid ]] && pid_alive "$pid" && _mail_sink_pid_is_ours "$pid" || pid=
  fi
  if [[ -n $pid ]] && pid_alive "$pid"; then
    log "stopping the mail sink (pid $pid)"
    stop_pid "$pid" "mail sink" 10
  fi
  MAIL_PID=
  [[ -z $pidfile ]] || rm -f "$pidfile"
}
