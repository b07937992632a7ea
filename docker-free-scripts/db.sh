#!/usr/bin/env bash
# A private PostgreSQL cluster for Ampwright, without Docker: Debian's server binaries, data in a
# git-ignored folder, listening on 127.0.0.1 only. Usage: db.sh start|stop|status|reset|create-test|psql
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"

PGPORT="$PGPORT_APP"
PGUSER_DB=app

pg_bin() {
  local v
  v=$(ls /usr/lib/postgresql 2>/dev/null | sort -n | tail -1 || true)
  [ -n "$v" ] && [ -x "/usr/lib/postgresql/$v/bin/initdb" ] && echo "/usr/lib/postgresql/$v/bin"
}

ensure_server() {
  if [ -z "$(pg_bin)" ]; then apt_install postgresql; fi
  PG="$(pg_bin)"
  [ -n "$PG" ] || die "PostgreSQL server binaries not found after install"
}

# initdb refuses root: run the server as the 'postgres' OS user when we are root.
RUNAS=()
choose_dirs() {
  # PG_CLUSTER names a second, separate cluster (the fault tests stop and start their own).
  local name="${PG_CLUSTER:-pg}"
  DATA="$ROOT/.data/$name"
  SOCK="$ROOT/.data/sock-$name"
  if [ "$(id -u)" -eq 0 ]; then
    id postgres >/dev/null 2>&1 || useradd --system --home /var/lib/postgresql --shell /bin/bash postgres
    RUNAS=(runuser -u postgres --)
    # The postgres user must be able to traverse the project path; otherwise keep the cluster in /tmp.
    if ! runuser -u postgres -- test -x "$ROOT"; then
      local h
      h=$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)
      DATA="/tmp/ampwright-$h/$name"
      SOCK="/tmp/ampwright-$h/sock-$name"
    fi
  fi
}

as_pg() { "${RUNAS[@]}" "$@"; }

is_running() { [ -f "$DATA/postmaster.pid" ] && as_pg "$PG/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }

init_cluster() {
  if [ -f "$DATA/PG_VERSION" ]; then return 0; fi
  say "creating a private PostgreSQL cluster in $DATA"
  mkdir -p "$DATA" "$SOCK"
  if [ ${#RUNAS[@]} -gt 0 ]; then chown -R postgres: "$DATA" "$SOCK"; chmod 700 "$DATA"; fi
  as_pg "$PG/initdb" -D "$DATA" -U "$PGUSER_DB" --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
}

start() {
  ensure_server; choose_dirs; init_cluster
  if is_running; then say "PostgreSQL already running on 127.0.0.1:$PGPORT (data $DATA)"; return 0; fi
  if port_in_use "$PGPORT"; then die "port $PGPORT is already taken by another program; set PGPORT_APP to a free port"; fi
  mkdir -p "$SOCK"; [ ${#RUNAS[@]} -gt 0 ] && chown postgres: "$SOCK"
  local extra=""
  # Tests only: trade durability for speed. Never for the demo or production.
  [ "${PG_FAST_UNSAFE:-0}" = 1 ] && extra="-c fsync=off -c synchronous_commit=off -c full_page_writes=off"
  as_pg "$PG/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 30 \
    -o "-k $SOCK -p $PGPORT -c listen_addresses=127.0.0.1 $extra" start >/dev/null \
    || { tail -20 "$DATA/server.log" >&2; die "PostgreSQL did not start"; }
  say "PostgreSQL started on 127.0.0.1:$PGPORT (data $DATA)"
  ensure_db ampwright
}

stop() {
  ensure_server; choose_dirs
  if ! is_running; then say "PostgreSQL is not running"; return 0; fi
  as_pg "$PG/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null
  say "PostgreSQL stopped"
}

status() {
  ensure_server; choose_dirs
  if is_running; then say "PostgreSQL running on 127.0.0.1:$PGPORT (data $DATA)"; else say "PostgreSQL not running (data $DATA)"; return 3; fi
}

psql_admin() { PGOPTIONS="-c client_min_messages=warning" "$PG/psql" -h 127.0.0.1 -p "$PGPORT" -U "$PGUSER_DB" -d postgres -v ON_ERROR_STOP=1 -qAt "$@"; }

ensure_db() {
  local name=$1
  if [ "$(psql_admin -c "select 1 from pg_database where datname='$name'")" != 1 ]; then
    psql_admin -c "create database \"$name\"" >/dev/null
    say "database $name created"
  fi
}

create_test() {
  start
  psql_admin -c "drop database if exists ampwright_test with (force)" >/dev/null
  psql_admin -c "create database ampwright_test" >/dev/null
  say "database ampwright_test re-created from empty"
}

reset() {
  ensure_server; choose_dirs
  if is_running; then as_pg "$PG/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null; fi
  rm -rf "$DATA"
  say "cluster removed ($DATA)"
  start
}

case "${1:-status}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  reset) reset ;;
  create-test) create_test ;;
  psql) ensure_server; shift; exec "$PG/psql" -h 127.0.0.1 -p "$PGPORT" -U "$PGUSER_DB" -d "${PSQL_DB:-ampwright}" "$@" ;;
  *) die "usage: db.sh start|stop|status|reset|create-test|psql" ;;
esac
