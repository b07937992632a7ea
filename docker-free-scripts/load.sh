#!/usr/bin/env bash
# The load run, long form: `npm run load -- [seconds, default 60]`. Uses a database of its own
# (ampwright_load, demo seed), builds the app into ${LOAD_NEXT_DIST_DIR:-.next-load} when the sources changed,
# serves it with `next start` on 127.0.0.1:${LOAD_APP_PORT:-3400}, drives the realistic mix and
# stops the server. The test command runs a short form of the same mix (tests/e2e/load.test.ts).
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
port_in_use "$APP_PORT" && die "port $APP_PORT is in use; set LOAD_APP_PORT to a free port"
NEXT_DIST_DIR="$DIST" NODE_ENV=production setsid npx next start -H 127.0.0.1 -p "$APP_PORT" >"$RUN_DIR/load-app.log" 2>&1 &
app=$!
trap 'kill -- -$app 2>/dev/null || true' EXIT
for _ in $(seq 1 120); do curl -sf "$APP_URL/api/health" >/dev/null && break; sleep 0.5; done
curl -sf "$APP_URL/api/health" >/dev/null || die "the app did not start (see $RUN_DIR/load-app.log)"
node --conditions=react-server --import tsx docker-free-scripts/load.ts "${1:-60}"
