#!/usr/bin/env bash
# npm run bench — starts what the benchmarks need (PostgreSQL, the test database migrated and
# seeded) and prints the benchmark table. Figures are ratios to baselines measured in the same run.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT"
npm_deps
bash docker-free-scripts/db.sh start >/dev/null
export DATABASE_URL="$TEST_DATABASE_URL"
PSQL_DB=postgres bash docker-free-scripts/db.sh psql -qAt -c "select 1 from pg_database where datname='ampwright_test'" | grep -q 1 \
  || PSQL_DB=postgres bash docker-free-scripts/db.sh psql -q -c "create database ampwright_test" >/dev/null
npm run -s db:migrate >/dev/null
npm run -s db:seed >/dev/null
exec node --conditions=react-server --import tsx tests/bench/run.ts "$@"
