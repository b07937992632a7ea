#!/usr/bin/env bash
# The test command: sets up everything on a fresh machine (npm packages, PostgreSQL, Chromium, the
# fakes), re-creates the test database from empty, type-checks, builds, and runs every test.
set -euo pipefail
# Tests use their own ports and state so that they never disturb a running demo.
export APP_PORT="${TEST_APP_PORT:-3100}"
export SMTP_PORT="${TEST_SMTP_PORT:-2526}"
export MAILBOX_PORT="${TEST_MAILBOX_PORT:-2581}"
export STRIPE_FAKE_PORT="${TEST_STRIPE_FAKE_PORT:-12112}"
export FAKES_STATE_DIR="${FAKES_STATE_DIR:-$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)/.run/test-fakes}"
source "$(dirname "${BASH_SOURCE[0]}")/env.sh"
cd "$ROOT"
started=$(date +%s)

npm_deps
apt_install chromium
bash docker-free-scripts/db.sh start
bash docker-free-scripts/db.sh create-test
export DATABASE_URL="$TEST_DATABASE_URL"
npm run -s db:migrate

bash docker-free-scripts/fakes.sh restart
trap 'bash docker-free-scripts/fakes.sh stop >/dev/null 2>&1 || true' EXIT

say "type-checking"
npx tsc --noEmit
say "building into .next-test"
NEXT_DIST_DIR=.next-test npx next build >"$RUN_DIR/test-build.log" 2>&1 || { tail -40 "$RUN_DIR/test-build.log" >&2; die "next build failed"; }

rm -f "$RUN_DIR"/vitest-*.json
status=0
for project in unit integration e2e; do
  say "running $project tests"
  npx vitest run --project "$project" --reporter=default --reporter=json --outputFile.json="$RUN_DIR/vitest-$project.json" || status=1
done
node docker-free-scripts/test-summary.mjs "$RUN_DIR" || status=1
say "test command finished in $(( $(date +%s) - started )) s"
exit $status
