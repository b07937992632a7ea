#!/usr/bin/env bash
# The run command: on a fresh machine installs what is missing, starts PostgreSQL and the local
# fakes (mail, Stripe), migrates, loads the demo shop, builds and serves the app on APP_URL.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT"
started=$(date +%s)

command -v node >/dev/null || die "Node.js 20 is required (node not found)"
node -e 'process.exit(+process.versions.node.split(".")[0] >= 20 ? 0 : 1)' || die "Node.js 20 or newer is required"
if port_in_use "$APP_PORT"; then die "port $APP_PORT is already taken by another program; stop it or set APP_PORT"; fi

npm_deps
bash docker-free-scripts/db.sh start
npm run -s db:migrate
npm run -s db:seed
bash docker-free-scripts/fakes.sh start

if [ "${SKIP_BUILD:-0}" != 1 ] || [ ! -f .next/BUILD_ID ]; then
  say "building the app (next build)"
  npx next build >"$RUN_DIR/build.log" 2>&1 || { tail -40 "$RUN_DIR/build.log" >&2; die "next build failed (full log: .run/build.log)"; }
fi

cat <<MSG

  Ampwright is starting on $APP_URL   (set-up took $(( $(date +%s) - started )) s)

  Demo sign-ins (password for all: plating-demo-2026):
    owner       owner@kestrel-plating.test
    estimator   estimator@kestrel-plating.test
    plater      plater@kestrel-plating.test
    supervisor  supervisor@kestrel-plating.test
    customer    buyer@northgate-fastener.test     (Northgate Fastener Co.)
    customer    quality@halvorsen-valve.test      (Halvorsen Valve & Instrument)

  Sent e-mail: sign in as the owner and open Demo mailbox.  Stop with Ctrl-C.

MSG
if [ -f docker-free-scripts/worker.ts ]; then
  node --conditions=react-server --import tsx docker-free-scripts/worker.ts >"$RUN_DIR/worker.log" 2>&1 &
  worker=$!
  trap 'kill $worker 2>/dev/null || true' EXIT
fi
npx next start -H 127.0.0.1 -p "$APP_PORT"
