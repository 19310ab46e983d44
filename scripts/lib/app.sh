# shellcheck shell=bash
# The Node side shared by start.sh and test.sh: node_modules, migrations and seed, next build,
# next start. Needs common.sh; runs from TRAILBIN_ROOT.

NODE_MODULES_STAMP=node_modules/.trailbin-install-stamp
NEXT_PID=

# What node_modules was installed from: the lockfile, plus Node's version (a new Node may need
# native addons rebuilt).
_install_fingerprint() {
  printf '%s node-%s\n' "$(sha256sum package-lock.json | cut -d' ' -f1)" "$(node --version)"
}

_npm_ci_if_stale() {
  local want
  want=$(_install_fingerprint)
  if [[ -d node_modules && -f $NODE_MODULES_STAMP && $(cat "$NODE_MODULES_STAMP") == "$want" ]]; then
    return 0
  fi
  if [[ -d node_modules ]]; then
    log "node_modules does not match package-lock.json; reinstalling"
  else
    log "installing node_modules"
  fi
  rm -f "$NODE_MODULES_STAMP"
  timed "npm ci" npm ci --no-audit --no-fund </dev/null || die "npm ci failed"
  printf '%s\n' "$want" >"$NODE_MODULES_STAMP"
}

# ensure_node_modules : npm ci when node_modules is missing or was installed from another lockfile.
# Locked so that npm start and npm test never install at the same moment.
ensure_node_modules() {
  [[ -f package-lock.json ]] || die "package-lock.json is missing"
  with_lock "$TRAILBIN_ROOT/.data/install.lock" _npm_ci_if_stale
}

# react-server: the seeds reuse db/ modules, which refuse to load outside server code otherwise.
_knex() { node --conditions=react-server --import tsx node_modules/knex/bin/cli.js "$@" --knexfile knexfile.ts; }

# migrate_and_seed : bring the schema up to date and load the (idempotent) seed. Uses DB_*.
migrate_and_seed() {
  timed "migrations" _knex migrate:latest || die "migrations failed"
  if [[ -d db/seeds ]] && [[ -n $(find db/seeds -maxdepth 1 -type f \( -name '*.ts' -o -name '*.js' \) -print -quit) ]]; then
    timed "seed" _knex seed:run || die "seed failed"
  else
    log "no seed files in db/seeds yet; skipping the seed"
  fi
}

# source_fingerprint : hash of every tracked or untracked-but-not-ignored file that can change the
# build (tests/ and docs/ cannot), contents and names together.
source_fingerprint() {
  {
    git ls-files -co --exclude-standard -z -- . ':(exclude)tests' ':(exclude)docs' |
      while IFS= read -r -d '' f; do
        # ls-files -c still lists a tracked file that was deleted in the work tree.
        [[ -f $f ]] && printf '%s\0' "$f"
      done |
      xargs -0 -r sha256sum
    printf 'NEXT_DIST_DIR=%s\n' "${NEXT_DIST_DIR:-.next}"
  } | sha256sum | cut -d' ' -f1
}

# build_if_needed : next build into ${NEXT_DIST_DIR:-.next} unless that build came from these very
# sources. CI always builds. The stamp lives inside the dist dir, so deleting the dir forces a build.
build_if_needed() {
  local dist=${NEXT_DIST_DIR:-.next} stamp fp=""
  stamp=$dist/.trailbin-source-hash
  if [[ ${CI:-} != true ]] && git rev-parse --is-inside-work-tree >/dev/null 2>&1; then
    fp=$(source_fingerprint)
    if [[ -f $stamp && $(cat "$stamp") == "$fp" && -f $dist/BUILD_ID ]]; then
      log "build in $dist is up to date; skipping next build"
      return 0
    fi
  fi
  log "building the app into $dist"
  timed "next build" node node_modules/next/dist/bin/next build </dev/null || die "next build failed"
  # Hash again after the build: next build itself may edit tsconfig.json (adding the dist dir's
  # types to "include"), and that edit must not make the next run think the sources changed.
  [[ -n $fp ]] && source_fingerprint >"$stamp"
  return 0
}

# next_start PORT LOGFILE PIDFILE : one process (never npx: killing npx leaves next-server running),
# in its own session so Ctrl-C reaches only our script, which decides the shutdown order.
# Sets NEXT_PID.
next_start() {
  local port=$1 logfile=$2 pidfile=$3
  require_free_port "$port" "the web app" "pick another port"
  : >"$logfile"
  setsid node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$port" </dev/null >>"$logfile" 2>&1 9>&- &
  NEXT_PID=$!
  printf '%s\n' "$NEXT_PID" >"$pidfile"
  wait_for_app "$port" "$logfile"
}

# wait_for_app PORT LOGFILE : poll /api/health for up to 60 s. 200 is what we want; while the app
# has no health route yet any HTTP answer means the server is up, accepted after a short grace.
wait_for_app() {
  local port=$1 logfile=$2 url="http://127.0.0.1:$1/api/health" code i first_other=""
  for ((i = 0; i < 600; i++)); do
    code=$(curl -s -o /dev/null -m 2 -w '%{http_code}' "$url" 2>/dev/null) || true
    if [[ $code == 200 ]]; then
      log "app is up on http://127.0.0.1:$port (pid $NEXT_PID)"
      return 0
    fi
    if [[ -n $code && $code != 000 ]]; then
      [[ -n $first_other ]] || first_other=$i
      if ((i - first_other >= 30)); then
        warn "$url answers HTTP $code, not 200; treating the server as up"
        return 0
      fi
    fi
    if ! pid_alive "$NEXT_PID"; then break; fi
    sleep 0.1
  done
  warn "the app did not come up; its log ($logfile):"
  tail -n 60 "$logfile" >&2
  next_stop
  die "next start failed on port $port"
}

# next_stop : stop the server we started (and any worker it forked), then forget its pid.
next_stop() {
  local pid=${NEXT_PID:-}
  [[ -n $pid ]] || return 0
  if pid_alive "$pid"; then
    log "stopping the app (pid $pid)"
    pkill -TERM -P "$pid" 2>/dev/null || true
    stop_pid "$pid" "next start" 15
  fi
  NEXT_PID=
}

# next_stop_stale PIDFILE : a killed earlier run may have left its next start behind, holding the
# port. Stop it only if it really is a next start from this checkout.
next_stop_stale() {
  local pidfile=$1 pid cmd cwd
  pid=$(cat "$pidfile" 2>/dev/null) || true
  [[ -n $pid ]] && pid_alive "$pid" || { rm -f "$pidfile"; return 0; }
  cmd=$(proc_cmdline "$pid")
  cwd=$(readlink "/proc/$pid/cwd" 2>/dev/null) || true
  if [[ $cmd == *next* && $cwd == "$TRAILBIN_ROOT" ]]; then
    warn "stopping the app (pid $pid) left running by an earlier run"
    NEXT_PID=$pid next_stop
  fi
  rm -f "$pidfile"
}

# app_start_built DIR PORT DIST : a production server of this checkout on PORT, built into DIST when
# the sources changed, its uploads in DIR/uploads (emptied first, apart from the demo's); sets
# APP_ORIGIN. Needs NEXT_LOG and NEXT_PIDFILE.
app_start_built() {
  export APP_ORIGIN=http://127.0.0.1:$2
  export NEXT_DIST_DIR=$3
  rm -rf "$1/uploads"
  export UPLOAD_DIR=$1/uploads
  build_if_needed
  NODE_ENV=production next_start "$2" "$NEXT_LOG" "$NEXT_PIDFILE"
}
