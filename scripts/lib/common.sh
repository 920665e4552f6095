# shellcheck shell=bash
# Shared helpers for the scripts in scripts/: repo paths, messages, dependency installs, ports.
# Sourced, never run. Every path is derived from this file's location, never from the machine.

KB_ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)
KB_DATA="$KB_ROOT/.data"   # git-ignored: databases, logs, secrets, test results
export KB_ROOT KB_DATA

kb_say() { printf '==> %s\n' "$*"; }
kb_warn() { printf '!!! %s\n' "$*" >&2; }
kb_die() {
  printf '!!! %s\n' "$*" >&2
  exit 1
}

kb_is_root() { [[ $(id -u) -eq 0 ]]; }

kb_random_hex() { # $1 = number of random bytes
  od -An -tx1 -N"$1" /dev/urandom | tr -d ' \n'
}

kb_data_dir() {
  # 0711: the PostgreSQL server user must traverse it, nobody else needs to list it.
  [[ -d $KB_DATA ]] || mkdir -m 0711 "$KB_DATA"
}

# Installs Debian packages; only possible as root (CI runs as root, with no terminal).
kb_apt_install() {
  kb_is_root || return 1
  local log="$KB_DATA/apt.log"
  kb_data_dir
  kb_say "installing Debian packages: $* (log: .data/apt.log)"
  if ! { DEBIAN_FRONTEND=noninteractive apt-get update -q &&
    DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends "$@"; } >"$log" 2>&1; then
    tail -n 20 "$log" >&2
    kb_die "apt-get could not install: $*"
  fi
}

# npm ci when node_modules is missing or older than the lockfile (npm writes its own copy on install).
kb_ensure_node_modules() {
  local stamp="$KB_ROOT/node_modules/.package-lock.json"
  if [[ -f $stamp && ! $KB_ROOT/package-lock.json -nt $stamp ]]; then
    return 0
  fi
  kb_say "installing npm dependencies (npm ci)"
  (cd "$KB_ROOT" && npm ci --no-audit --no-fund)
}

kb_port_busy() { # $1 = TCP port on 127.0.0.1
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

# Prints the first free port from $1 on (up to 20 tries), so two runs on one machine do not collide.
kb_free_port() {
  local port=$1 last=$(($1 + 20))
  while ((port <= last)); do
    if ! kb_port_busy "$port"; then
      printf '%s\n' "$port"
      return 0
    fi
    port=$((port + 1))
  done
  return 1
}
