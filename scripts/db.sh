#!/usr/bin/env bash
# The project's own PostgreSQL cluster: start | stop | status | reset | create-db NAME | drop-db NAME
# The cluster lives in a git-ignored folder of the project, is owned by the postgres user
# (initdb refuses root) and listens on 127.0.0.1 only.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"

find_pg_bin() {
  local dir
  dir="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)"
  if [ -z "$dir" ] || [ ! -x "$dir/initdb" ]; then
    log "PostgreSQL server binaries missing; installing Debian's postgresql"
    apt_install postgresql
    dir="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1)"
  fi
  PG_BIN="$dir"
}

# Run a command as the cluster owner when we are root, else as ourselves.
as_owner() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

is_running() {
  [ -f "$PGDATA_DIR/postmaster.pid" ] && as_owner "$PG_BIN/pg_ctl" -D "$PGDATA_DIR" status >/dev/null 2>&1
}

# The postgres user must be able to traverse every folder above the cluster. When the checkout
# sits under a private folder, keep the cluster in the postgres user's home instead, named after
# the checkout so two clones never share one.
choose_data_dir() {
  mkdir -p "$(dirname "$PGDATA_DIR")"
  if [ "$(id -u)" -eq 0 ] && ! runuser -u postgres -- test -x "$(dirname "$PGDATA_DIR")"; then
    local tag
    tag="$(printf '%s' "$ROOT_DIR" | sha1sum | cut -c1-10)"
    PGDATA_DIR="/var/lib/postgresql/stablehand-$tag/pg"
    PGSOCK_DIR="/var/lib/postgresql/stablehand-$tag/socket"
    mkdir -p "$(dirname "$PGDATA_DIR")"
    chown postgres:postgres "$(dirname "$PGDATA_DIR")"
  fi
}

init_cluster() {
  mkdir -p "$PGDATA_DIR" "$PGSOCK_DIR"
  if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$PGDATA_DIR" "$PGSOCK_DIR"; fi
  chmod 700 "$PGDATA_DIR"
  if [ ! -f "$PGDATA_DIR/PG_VERSION" ]; then
    log "creating a cluster in $PGDATA_DIR"
    as_owner "$PG_BIN/initdb" -D "$PGDATA_DIR" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
}

wait_ready() {
  local i
  for i in $(seq 1 100); do
    if "$PG_BIN/pg_isready" -h "$PGHOST_ADDR" -p "$PGPORT" -q; then return 0; fi
    sleep 0.1
  done
  log "PostgreSQL did not accept connections on $PGHOST_ADDR:$PGPORT"
  tail -n 20 "$PGDATA_DIR/server.log" >&2 || true
  return 1
}

create_db() {
  local name="$1"
  if ! as_owner "$PG_BIN/psql" -h "$PGHOST_ADDR" -p "$PGPORT" -U postgres -d postgres -tAc \
    "select 1 from pg_database where datname = '$name'" | grep -q 1; then
    as_owner "$PG_BIN/createdb" -h "$PGHOST_ADDR" -p "$PGPORT" -U postgres "$name"
    log "created database $name"
  fi
}

drop_db() {
  as_owner "$PG_BIN/psql" -h "$PGHOST_ADDR" -p "$PGPORT" -U postgres -d postgres -qc \
    "drop database if exists \"$1\" with (force)" >/dev/null
}

start() {
  init_cluster
  if is_running; then
    log "PostgreSQL already running on $PGHOST_ADDR:$PGPORT"
  else
    as_owner "$PG_BIN/pg_ctl" -D "$PGDATA_DIR" -l "$PGDATA_DIR/server.log" -w -s \
      -o "-c listen_addresses=$PGHOST_ADDR -p $PGPORT -k $PGSOCK_DIR -c fsync=off -c max_connections=200" start
    log "PostgreSQL started on $PGHOST_ADDR:$PGPORT"
  fi
  wait_ready
  create_db "$PG_DB_NAME"
}

stop() {
  if is_running; then
    as_owner "$PG_BIN/pg_ctl" -D "$PGDATA_DIR" -m fast -w -s stop
    log "PostgreSQL stopped"
  fi
}

find_pg_bin
choose_data_dir
case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if is_running; then echo "running on $PGHOST_ADDR:$PGPORT ($PGDATA_DIR)"; else echo "stopped"; exit 3; fi ;;
  reset) stop; rm -rf "$PGDATA_DIR"; start ;;
  create-db) create_db "${2:?database name}" ;;
  drop-db) drop_db "${2:?database name}" ;;
  *) echo "usage: scripts/db.sh start|stop|status|reset|create-db NAME|drop-db NAME" >&2; exit 2 ;;
esac
