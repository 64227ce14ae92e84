# Shared settings for the project's shell scripts; sourced, never run.
# Everything lives under the project folder so a clone is self-contained.
ROOT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export ROOT_DIR
export PGPORT="${PGPORT:-54329}"
export PGHOST_ADDR="127.0.0.1"
export PGDATA_DIR="${PGDATA_DIR:-$ROOT_DIR/.data/pg}"
export PGSOCK_DIR="${PGSOCK_DIR:-$ROOT_DIR/.data/pg-socket}"
export PG_DB_NAME="${PG_DB_NAME:-stablehand}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@$PGHOST_ADDR:$PGPORT/$PG_DB_NAME}"

# Production refuses the built-in session secret (server/config/env.ts), and npm start runs in
# production. Unless SESSION_SECRET is set, use a secret made for this checkout on first use and
# kept in .data/ (git-ignored), so sessions survive restarts.
if [ -z "${SESSION_SECRET:-}" ]; then
  SESSION_SECRET_FILE="$ROOT_DIR/.data/session-secret"
  if [ ! -s "$SESSION_SECRET_FILE" ]; then
    mkdir -p "$ROOT_DIR/.data"
    (umask 077 && od -An -N32 -tx1 /dev/urandom | tr -d ' \n' >"$SESSION_SECRET_FILE")
  fi
  SESSION_SECRET="$(cat "$SESSION_SECRET_FILE")"
  export SESSION_SECRET
fi

log() { printf '[stablehand] %s\n' "$*" >&2; }

# apt-get update runs at most once per script run.
APT_UPDATED=0
apt_install() {
  if [ "$(id -u)" -ne 0 ]; then
    log "need root to install: $* (run as root or install them first)"
    return 1
  fi
  if [ "$APT_UPDATED" -eq 0 ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -q >/dev/null
    APT_UPDATED=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -q "$@" >/dev/null
}

ensure_node_modules() {
  if [ ! -d "$ROOT_DIR/node_modules" ] || [ "$ROOT_DIR/package-lock.json" -nt "$ROOT_DIR/node_modules/.package-lock.json" ]; then
    log "installing npm dependencies (npm ci)"
    (cd "$ROOT_DIR" && npm ci --no-audit --no-fund)
  fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing Debian's chromium for the end-to-end tests"
    apt_install chromium fonts-liberation
  fi
}
