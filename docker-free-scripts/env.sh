# Shared settings for the project's scripts. Source it; every value can be overridden by the environment.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export PGPORT_APP="${PGPORT_APP:-54329}"
export DATABASE_URL="${DATABASE_URL:-postgres://app@127.0.0.1:${PGPORT_APP}/ampwright}"
export TEST_DATABASE_URL="${TEST_DATABASE_URL:-postgres://app@127.0.0.1:${PGPORT_APP}/ampwright_test}"
export APP_PORT="${APP_PORT:-3000}"
export APP_URL="${APP_URL:-http://127.0.0.1:${APP_PORT}}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}"
export SMTP_PORT="${SMTP_PORT:-2525}"
export MAILBOX_PORT="${MAILBOX_PORT:-2580}"
export MAILBOX_URL="${MAILBOX_URL:-http://127.0.0.1:${MAILBOX_PORT}}"
export STRIPE_FAKE_PORT="${STRIPE_FAKE_PORT:-12111}"
export STRIPE_SECRET_KEY="${STRIPE_SECRET_KEY:-sk_test_ampwright_local}"
export STRIPE_API_BASE="${STRIPE_API_BASE:-http://127.0.0.1:${STRIPE_FAKE_PORT}}"
export STRIPE_WEBHOOK_SECRET="${STRIPE_WEBHOOK_SECRET:-whsec_ampwright_local_fake}"
export STRIPE_WEBHOOK_URL="${STRIPE_WEBHOOK_URL:-${APP_URL}/api/webhooks/stripe}"
export DEMO_MODE="${DEMO_MODE:-1}"
export NEXT_TELEMETRY_DISABLED=1
RUN_DIR="$ROOT/.run"
mkdir -p "$RUN_DIR"

say() { printf '[ampwright] %s\n' "$*"; }
die() { printf '[ampwright] error: %s\n' "$*" >&2; exit 1; }

# port_in_use PORT: true when something listens on 127.0.0.1:PORT.
port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# apt_install PKG...: installs Debian packages that are missing (the machine runs as root).
apt_install() {
  local missing=()
  for p in "$@"; do dpkg -s "$p" >/dev/null 2>&1 || missing+=("$p"); done
  [ ${#missing[@]} -eq 0 ] && return 0
  say "installing Debian packages: ${missing[*]}"
  local sudo=""
  [ "$(id -u)" -ne 0 ] && sudo="sudo"
  $sudo apt-get update -qq >/dev/null 2>&1 || true
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null \
    || die "apt-get install ${missing[*]} failed"
}

# npm_deps: installs npm packages from the lock file when node_modules is missing or older than the lock.
npm_deps() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "installing npm packages from package-lock.json (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed"
  fi
}
