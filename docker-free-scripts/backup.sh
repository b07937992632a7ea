#!/usr/bin/env bash
# Backup and restore of the Ampwright database with PostgreSQL's own tools (uploaded files are in
# the database, so one dump holds everything).
#   backup.sh dump [FILE]              dump DATABASE_URL (default) to FILE (.run/backups/<time>.dump)
#   backup.sh restore FILE DB_NAME     restore FILE into a new, empty database DB_NAME on the same server
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
PG=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)
[ -n "$PG" ] || die "PostgreSQL client tools not found; run docker-free-scripts/db.sh start first"

case "${1:-}" in
  dump)
    out="${2:-$RUN_DIR/backups/$(date -u +%Y%m%dT%H%M%SZ).dump}"
    mkdir -p "$(dirname "$out")"
    "$PG/pg_dump" --format=custom --no-owner --dbname="$DATABASE_URL" --file="$out"
    say "dumped $(echo "$DATABASE_URL" | sed 's|.*/||') to $out ($(du -h "$out" | cut -f1))"
    ;;
  restore)
    file="${2:-}"; name="${3:-}"
    [ -f "$file" ] || die "no dump file '$file'"
    [[ "$name" =~ ^[a-z_][a-z0-9_]{0,40}$ ]] || die "give the new database a plain name (lowercase letters, digits, _)"
    admin="${DATABASE_URL%/*}/postgres"
    exists=$("$PG/psql" -qAt "$admin" -c "select 1 from pg_database where datname = '$name'")
    [ -z "$exists" ] || die "database $name already exists; restore only into an empty, new database"
    "$PG/psql" -q "$admin" -c "create database \"$name\"" >/dev/null
    "$PG/pg_restore" --no-owner --exit-on-error --dbname="${DATABASE_URL%/*}/$name" "$file"
    say "restored $file into database $name"
    ;;
  *) die "usage: backup.sh dump [FILE] | restore FILE DB_NAME" ;;
esac
