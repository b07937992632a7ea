#!/usr/bin/env bash
# npm run bench — starts what the benchmarks need (PostgreSQL, a bench database migrated and
# seeded) and prints the benchmark table. Figures are ratios to baselines measured in the same run.
# The web benchmarks build and serve the app themselves (.next-bench, port 3300) and stop it after.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT"
npm_deps
bash docker-free-scripts/db.sh start >/dev/null
# A database of its own, so a bench run never disturbs the tests' database.
export BENCH_DATABASE_URL="${BENCH_DATABASE_URL:-postgres://app@127.0.0.1:${PGPORT_APP}/ampwright_bench}"
export DATABASE_URL="$BENCH_DATABASE_URL" TEST_DATABASE_URL="$BENCH_DATABASE_URL"
bench_db="${BENCH_DATABASE_URL##*/}"
PSQL_DB=postgres bash docker-free-scripts/db.sh psql -qAt -c "select 1 from pg_database where datname='$bench_db'" | grep -q 1 \
  || PSQL_DB=postgres bash docker-free-scripts/db.sh psql -q -c "create database $bench_db" >/dev/null
npm run -s db:migrate >/dev/null
npm run -s db:seed >/dev/null
exec node --import tsx tests/bench/run.ts "$@"
