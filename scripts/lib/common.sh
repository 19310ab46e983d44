# shellcheck shell=bash
# Shared helpers for scripts/start.sh and scripts/test.sh: logging, privilege, ports, processes,
# Debian packages. Sourced, never run. Everything here is a function; nothing runs on load
# except working out where the repository is.

TRAILBIN_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
# Debian keeps mariadbd and mariadb-install-db in /usr/sbin, which a non-root PATH lacks.
case ":$PATH:" in *:/usr/sbin:*) ;; *) PATH="$PATH:/usr/sbin" ;; esac
# Next asks a telemetry host on first run; nothing outside the registries is reachable here.
export NEXT_TELEMETRY_DISABLED=1

log() { printf '[trailbin] %s\n' "$*"; }
warn() { printf '[trailbin] warning: %s\n' "$*" >&2; }
die() {
  printf '[trailbin] error: %s\n' "$*" >&2
  exit 1
}

# timed LABEL CMD... : run CMD, then print how long it took (the report quotes these timings).
timed() {
  local label=$1 start rc=0
  shift
  start=$(date +%s.%N)
  "$@" || rc=$?
  log "$label took $(awk -v a="$start" -v b="$(date +%s.%N)" 'BEGIN { printf "%.1f s", b - a }')"
  return "$rc"
}

# as_root CMD... : apt needs root; use sudo when we are not root, and say so when neither works.
as_root() {
  if [[ $EUID -eq 0 ]]; then
    "$@"
  elif command -v sudo >/dev/null 2>&1; then
    sudo "$@"
  else
    die "'$*' needs root and sudo is not installed; install the Debian packages mariadb-server mariadb-client chromium by hand, or run as root"
  fi
}

# with_lock FILE CMD... : run CMD while holding an exclusive flock on FILE, so that a concurrent
# npm start and npm test never run apt-get or npm ci at the same moment.
with_lock() {
  local file=$1 fd
  shift
  mkdir -p "$(dirname "$file")"
  exec {fd}>"$file"
  flock "$fd"
  local rc=0
  "$@" || rc=$?
  exec {fd}>&-
  return "$rc"
}

have_mariadb() { command -v mariadbd >/dev/null 2>&1 || [[ -x /usr/sbin/mariadbd ]]; }
have_chromium() { [[ -x /usr/bin/chromium ]]; }

# ensure_debian_packages [chromium] : install MariaDB (always) and Chromium (when asked) if missing.
# Debian's postinst would like to start a system MariaDB on 3306; we never use or touch it
# (our servers have their own datadir, socket and port), and policy-rc.d usually blocks it anyway.
ensure_debian_packages() {
  local want_chromium=${1:-} pkgs=()
  have_mariadb || pkgs+=(mariadb-server mariadb-client)
  if [[ $want_chromium == chromium ]] && ! have_chromium; then pkgs+=(chromium); fi
  [[ ${#pkgs[@]} -eq 0 ]] && return 0
  log "installing Debian packages: ${pkgs[*]}"
  timed "apt-get update" as_root apt-get update -q || die "apt-get update failed"
  timed "apt-get install ${pkgs[*]}" as_root env DEBIAN_FRONTEND=noninteractive \
    apt-get install -y -q --no-install-recommends "${pkgs[@]}" </dev/null ||
    die "apt-get install ${pkgs[*]} failed"
  have_mariadb || die "mariadbd is still missing after installing mariadb-server"
  if [[ $want_chromium == chromium ]] && ! have_chromium; then die "/usr/bin/chromium is still missing after installing chromium"; fi
}

# port_in_use PORT : true when something accepts TCP connections on 127.0.0.1:PORT.
port_in_use() {
  timeout 2 bash -c "exec 3<>/dev/tcp/127.0.0.1/$1" 2>/dev/null
}

# port_owner PORT : best-effort description of who listens on PORT (for error messages).
port_owner() {
  local out
  out=$(ss -ltnpH "sport = :$1" 2>/dev/null | grep -o 'users:(([^)]*))' | head -n1) || true
  printf '%s' "${out:-unknown process}"
}

# require_free_port PORT WHAT [HINT] : refuse clearly instead of letting a server fail to bind.
require_free_port() {
  if port_in_use "$1"; then
    die "port $1 is already in use by $(port_owner "$1"), but $2 needs it; stop that program${3:+, or $3}"
  fi
}

# proc_cmdline PID : the command line of PID with spaces between arguments ('' when gone).
proc_cmdline() {
  [[ -r /proc/$1/cmdline ]] && tr '\0' ' ' <"/proc/$1/cmdline" 2>/dev/null || true
}

pid_alive() { [[ -n ${1:-} ]] && kill -0 "$1" 2>/dev/null; }

# proc_stat_field PID N : field N of /proc/PID/stat counted after the command name, which sits in
# parentheses and may hold spaces (1 = state, 2 = parent pid); '' when PID is gone.
proc_stat_field() {
  local stat
  stat=$(cat "/proc/$1/stat" 2>/dev/null) || return 0
  stat=${stat##*) }
  local fields
  read -r -a fields <<<"$stat"
  printf '%s' "${fields[$(($2 - 1))]:-}"
}

# pid_running PID : alive and not a zombie (an ended process whose parent has not reaped it yet,
# which kill -0 still sees; orphans here may have a parent that never reaps).
pid_running() { pid_alive "${1:-}" && [[ $(proc_stat_field "$1" 1) != Z ]]; }

# stop_tree PID NAME : stop PID and every process under it (a build forks workers of its own).
stop_tree() {
  local pid=$1 name=$2 kids
  pid_alive "$pid" || return 0
  kids=$(pgrep -P "$pid" 2>/dev/null) || true
  kill -TERM "$pid" 2>/dev/null || true
  local k
  for k in $kids; do stop_tree "$k" "$name"; done
  stop_pid "$pid" "$name" 15
}

# stop_pid PID NAME [SECONDS] : SIGTERM, wait for the process to exit, SIGKILL as a last resort.
# Works for processes that are not our children (a server left by a killed run), so it polls.
stop_pid() {
  local pid=$1 name=$2 limit=${3:-30} i
  pid_alive "$pid" || return 0
  kill -TERM "$pid" 2>/dev/null || true
  for ((i = 0; i < limit * 10; i++)); do
    pid_alive "$pid" || break
    # Reap it if it is our child, so that it does not linger as a zombie that kill -0 still sees.
    [[ -e /proc/$pid/stat && $(awk '{print $3}' "/proc/$pid/stat" 2>/dev/null) == Z ]] && { wait "$pid" 2>/dev/null || true; break; }
    sleep 0.1
  done
  if pid_alive "$pid" && [[ $(awk '{print $3}' "/proc/$pid/stat" 2>/dev/null) != Z ]]; then
    warn "$name (pid $pid) did not stop within ${limit}s; killing it"
    kill -KILL "$pid" 2>/dev/null || true
  fi
  wait "$pid" 2>/dev/null || true
}

# random_secret : 48 hex characters (no quoting problems in SQL or env files).
random_secret() {
  if command -v openssl >/dev/null 2>&1; then
    openssl rand -hex 24
  else
    node -e 'process.stdout.write(require("crypto").randomBytes(24).toString("hex"))'
  fi
}

# env_file_get FILE KEY : the value of KEY=VALUE in FILE ('' when absent). Optional quotes stripped.
env_file_get() {
  [[ -f $1 ]] || return 0
  local line
  line=$(grep -E "^[[:space:]]*(export[[:space:]]+)?$2=" "$1" | tail -n1) || true
  line=${line#*=}
  line=${line%$'\r'}
  if [[ $line == \"*\" || $line == \'*\' ]]; then line=${line:1:${#line}-2}; fi
  printf '%s' "$line"
}

# env_file_set FILE KEY VALUE : append KEY=VALUE when the key is missing (never rewrites a
# line a person may have edited). The file holds a password: only the owner may read it.
env_file_set() {
  local file=$1 key=$2 value=$3
  if [[ ! -f $file ]]; then
    (umask 077 && : >"$file")
  fi
  chmod 600 "$file" 2>/dev/null || true
  if ! grep -qE "^[[:space:]]*(export[[:space:]]+)?$key=" "$file"; then
    # Make sure we start on a fresh line even if the file lacks a trailing newline.
    [[ -s $file && $(tail -c1 "$file") != "" ]] && printf '\n' >>"$file"
    printf '%s=%s\n' "$key" "$value" >>"$file"
  fi
}
