# Shared helpers for scripts/start.sh and scripts/test.sh.
# Plain bash on purpose: this runs before node_modules exists.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
DATA_DIR="${GAITLOOM_DATA_DIR:-$ROOT/.data}"
RUN_DIR="$DATA_DIR/run"
LOG_DIR="$DATA_DIR/logs"

say() { printf '\033[1;36m[gaitloom]\033[0m %s\n' "$*"; }
warn() { printf '\033[1;33m[gaitloom]\033[0m %s\n' "$*" >&2; }
die() {
  printf '\033[1;31m[gaitloom] %s\033[0m\n' "$1" >&2
  shift
  for line in "$@"; do printf '           %s\n' "$line" >&2; done
  exit 1
}

# Is process $1 alive (not a zombie left unreaped) and, when $2 is given, named like it?
pid_alive() {
  local pid="$1" name="${2:-}" state
  [ -n "$pid" ] || return 1
  # Read once: the process may end between a check and a read.
  state="$(sed -E 's/^[0-9]+ \(.*\) ([A-Z]).*/\1/' "/proc/$pid/stat" 2>/dev/null)" || return 1
  [ -n "$state" ] && [ "$state" != "Z" ] || return 1
  [ -z "$name" ] || grep -q "$name" "/proc/$pid/comm" 2>/dev/null
}

# Is anything listening on 127.0.0.1:$1?
port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# Fails with a clear message when less than $2 MiB are free where $1 lives.
require_free_disk() {
  local dir="$1" need_mib="$2" free_kib
  mkdir -p "$dir" 2>/dev/null || true
  free_kib="$(df -Pk "$dir" | awk 'NR==2 {print $4}')"
  if [ -n "$free_kib" ] && [ "$free_kib" -lt $((need_mib * 1024)) ]; then
    die "Only $((free_kib / 1024)) MiB free on the disk holding $dir; Gaitloom needs at least $need_mib MiB." \
      "Free some space (for example: npm cache clean --force, or remove old build/ folders) and run again." \
      "Your data in $DATA_DIR has not been touched."
  fi
}

APT_UPDATED=""
# Installs the Debian packages that are not installed yet.
ensure_debian_packages() {
  local missing=() pkg
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q "install ok installed" || missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  [ "$(id -u)" -eq 0 ] || die "Missing Debian packages: ${missing[*]}" "Install them with: sudo apt-get install -y ${missing[*]}"
  say "installing Debian packages: ${missing[*]}"
  if [ -z "$APT_UPDATED" ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >"$LOG_DIR/apt.log" 2>&1 || true
    APT_UPDATED=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}" >>"$LOG_DIR/apt.log" 2>&1 \
    || die "apt-get could not install ${missing[*]}." "Last lines of $LOG_DIR/apt.log:" "$(tail -n 5 "$LOG_DIR/apt.log")"
}

# npm ci when node_modules is missing or was installed from another lock file.
ensure_node_modules() {
  command -v node >/dev/null || ensure_debian_packages nodejs npm
  local stamp="$ROOT/node_modules/.gaitloom-lock" want
  want="$(sha256sum "$ROOT/package-lock.json" | cut -d' ' -f1)"
  if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ]; then return 0; fi
  say "installing npm packages (npm ci)"
  (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed; see the messages above."
  echo "$want" >"$stamp"
}

mkdir -p "$RUN_DIR" "$LOG_DIR"
