#!/usr/bin/env bash
# The load run, long form: `npm run load -- [seconds, default 60]`. Uses a database of its own
# (ampwright_load, demo seed), builds the app into ${LOAD_NEXT_DIST_DIR:-.next-load} when the sources changed,
# serves it with two `next start` processes on 127.0.0.1:${LOAD_APP_PORT:-3400} and the next port, with two
# workers, drives the realistic mix through a round-robin in front of them and stops them all. The test command runs a short form of the same mix (tests/e2e/load.test.ts).
set -euo pipefail
export APP_PORT="${LOAD_APP_PORT:-3400}"
export APP_URL="http://127.0.0.1:${APP_PORT}"
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT"
npm_deps
bash docker-free-scripts/db.sh start >/dev/null
export DATABASE_URL="postgres://app@127.0.0.1:${PGPORT_APP}/ampwright_load"
PSQL_DB=postgres bash docker-free-scripts/db.sh psql -qAt -c "select 1 from pg_database where datname='ampwright_load'" | grep -q 1 \
  || PSQL_DB=postgres bash docker-free-scripts/db.sh psql -q -c "create database ampwright_load" >/dev/null
npm run -s db:migrate >/dev/null
npm run -s db:seed >/dev/null
DIST="${LOAD_NEXT_DIST_DIR:-.next-load}"
if [ ! -f "$DIST/BUILD_ID" ] || [ -n "$(find app components lib db proxy.ts next.config.mjs package-lock.json -newer "$DIST/BUILD_ID" -print -quit)" ]; then
  say "building into $DIST"
  NEXT_DIST_DIR="$DIST" npx next build >"$RUN_DIR/load-build.log" 2>&1 || { tail -40 "$RUN_DIR/load-build.log" >&2; die "next build failed"; }
fi
# Two app processes (as a shop would run behind its load balancer) and two background workers, all
# on the one database; load.ts puts a round-robin in front of the two.
SECOND_PORT=$((APP_PORT + 1))
pids=()
trap 'for p in "${pids[@]}"; do kill -- -"$p" 2>/dev/null || true; done' EXIT
for port in "$APP_PORT" "$SECOND_PORT"; do
  port_in_use "$port" && die "port $port is in use; set LOAD_APP_PORT to a free port"
  APP_URL="http://127.0.0.1:$port" NEXT_DIST_DIR="$DIST" NODE_ENV=production setsid npx next start -H 127.0.0.1 -p "$port" >"$RUN_DIR/load-app-$port.log" 2>&1 &
  pids+=($!)
done
for n in 1 2; do
  setsid node --conditions=react-server --import tsx docker-free-scripts/worker.ts >"$RUN_DIR/load-worker-$n.log" 2>&1 &
  pids+=($!)
done
for port in "$APP_PORT" "$SECOND_PORT"; do
  for _ in $(seq 1 120); do curl -sf "http://127.0.0.1:$port/api/health" >/dev/null && break; sleep 0.5; done
  curl -sf "http://127.0.0.1:$port/api/health" >/dev/null || die "the app on port $port did not start (see $RUN_DIR/load-app-$port.log)"
done
LOAD_UPSTREAM_PORTS="$APP_PORT,$SECOND_PORT" node --conditions=react-server --import tsx docker-free-scripts/load.ts "${1:-60}"
