#!/usr/bin/env bash
# Starts, stops and reports the local e-mail and Stripe fakes (no Docker, nothing downloaded).
#   bash docker-free-scripts/fakes.sh start|stop|status|restart
# Settings (environment): SMTP_PORT (2525), MAILBOX_PORT (2580), STRIPE_FAKE_PORT (12111),
#   STRIPE_WEBHOOK_URL (http://127.0.0.1:3000/api/webhooks/stripe; empty = record events only),
#   STRIPE_WEBHOOK_SECRET (whsec_ampwright_local_fake), FAKES_STATE_DIR (<root>/.run/fakes).
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
RUN_DIR="${FAKES_STATE_DIR:-$ROOT/.run/fakes}"
FAKES_DIR="$ROOT/docker-free-scripts/fakes"

export SMTP_PORT="${SMTP_PORT:-2525}"
export MAILBOX_PORT="${MAILBOX_PORT:-2580}"
export STRIPE_FAKE_PORT="${STRIPE_FAKE_PORT:-12111}"
export STRIPE_WEBHOOK_URL="${STRIPE_WEBHOOK_URL-http://127.0.0.1:3000/api/webhooks/stripe}"
export STRIPE_WEBHOOK_SECRET="${STRIPE_WEBHOOK_SECRET:-whsec_ampwright_local_fake}"
export FAKES_STATE_DIR="${FAKES_STATE_DIR:-$RUN_DIR}"

say() { printf 'fakes: %s\n' "$*"; }
fail() { printf 'fakes: %s\n' "$*" >&2; exit 1; }

for name in SMTP_PORT MAILBOX_PORT STRIPE_FAKE_PORT; do
  value="${!name}"
  if ! [[ "$value" =~ ^[0-9]{1,5}$ ]] || (( value < 1 || value > 65535 )); then
    fail "$name must be a port number from 1 to 65535, got '$value'"
  fi
done

# Per fake: script file, ports it listens on, and the URL that answers when it is ready.
script_of() { case "$1" in mail) echo "$FAKES_DIR/mail-fake.ts" ;; stripe) echo "$FAKES_DIR/stripe-fake.ts" ;; esac; }
ports_of() { case "$1" in mail) echo "$SMTP_PORT $MAILBOX_PORT" ;; stripe) echo "$STRIPE_FAKE_PORT" ;; esac; }
health_of() {
  case "$1" in
    mail) echo "http://127.0.0.1:$MAILBOX_PORT/health" ;;
    stripe) echo "http://127.0.0.1:$STRIPE_FAKE_PORT/health" ;;
  esac
}

pid_file() { echo "$RUN_DIR/$1.pid"; }
ports_file() { echo "$RUN_DIR/$1.ports"; }
log_file() { echo "$RUN_DIR/$1.log"; }

# Running = the pid file names a live process that is still our fake (guards against pid reuse).
running_pid() {
  local file pid
  file="$(pid_file "$1")"
  [[ -f "$file" ]] || return 1
  pid="$(cat "$file" 2>/dev/null || true)"
  [[ "$pid" =~ ^[0-9]+$ ]] || return 1
  kill -0 "$pid" 2>/dev/null || return 1
  tr '\0' ' ' <"/proc/$pid/cmdline" 2>/dev/null | grep -q -- "$(basename "$(script_of "$1")")" || return 1
  echo "$pid"
}

port_taken() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

healthy() { curl -fsS --max-time 2 "$(health_of "$1")" >/dev/null 2>&1; }

describe() {
  case "$1" in
    mail) echo "mail fake: SMTP 127.0.0.1:${2:-?}, mailbox API http://127.0.0.1:${3:-?}/messages" ;;
    stripe) echo "stripe fake: API http://127.0.0.1:${2:-?} (webhooks to ${STRIPE_WEBHOOK_URL:-nowhere})" ;;
  esac
}

# Refuses before anything starts, so a taken port never leaves one fake half-started.
check_ports() {
  local name="$1" port
  running_pid "$name" >/dev/null && return 0
  for port in $(ports_of "$name"); do
    if port_taken "$port"; then
      fail "port $port is already in use by another program; cannot start the $name fake. Stop that program or choose another port (SMTP_PORT, MAILBOX_PORT, STRIPE_FAKE_PORT)."
    fi
  done
}

start_one() {
  local name="$1" pid port waited=0
  if pid="$(running_pid "$name")"; then
    say "$(describe "$name" $(cat "$(ports_file "$name")" 2>/dev/null)) already running (pid $pid)"
    return 0
  fi
  rm -f "$(pid_file "$name")"
  check_ports "$name"
  # From the project root so `--import tsx` resolves from this project's node_modules.
  (
    cd "$ROOT"
    nohup node --import tsx "$(script_of "$name")" >>"$(log_file "$name")" 2>&1 </dev/null &
    echo $! >"$(pid_file "$name")"
  )
  pid="$(cat "$(pid_file "$name")")"
  ports_of "$name" >"$(ports_file "$name")"
  until healthy "$name"; do
    if ! kill -0 "$pid" 2>/dev/null; then
      rm -f "$(pid_file "$name")"
      tail -n 20 "$(log_file "$name")" >&2 || true
      fail "the $name fake exited during start; see $(log_file "$name")"
    fi
    if (( waited >= 100 )); then
      kill "$pid" 2>/dev/null || true
      rm -f "$(pid_file "$name")"
      fail "the $name fake did not answer $(health_of "$name") within 20 s; see $(log_file "$name")"
    fi
    sleep 0.2
    waited=$((waited + 1))
  done
  say "started $(describe "$name" $(ports_of "$name")) (pid $pid, log $(log_file "$name"))"
}

stop_one() {
  local name="$1" pid waited=0
  if ! pid="$(running_pid "$name")"; then
    rm -f "$(pid_file "$name")"
    say "$name fake is not running"
    return 0
  fi
  kill -TERM "$pid" 2>/dev/null || true
  while kill -0 "$pid" 2>/dev/null; do
    if (( waited >= 50 )); then
      say "$name fake (pid $pid) did not stop within 10 s; killing it"
      kill -KILL "$pid" 2>/dev/null || true
      break
    fi
    sleep 0.2
    waited=$((waited + 1))
  done
  rm -f "$(pid_file "$name")"
  say "stopped $name fake (pid $pid)"
}

status_one() {
  local name="$1" pid
  if pid="$(running_pid "$name")"; then
    local ports
    ports="$(cat "$(ports_file "$name")" 2>/dev/null || ports_of "$name")"
    say "$(describe "$name" $ports) running (pid $pid)"
    return 0
  fi
  say "$name fake is not running"
  return 1
}

command -v node >/dev/null || fail "node is not on PATH (Node 20 is needed)"
command -v curl >/dev/null || fail "curl is not on PATH (used to check the fakes answer)"
[[ -d "$ROOT/node_modules/tsx" ]] || fail "tsx is missing from $ROOT/node_modules; run npm ci first"
mkdir -p "$RUN_DIR"

case "${1:-}" in
  start)
    check_ports mail
    check_ports stripe
    start_one mail
    start_one stripe
    say "state in $FAKES_STATE_DIR"
    ;;
  stop)
    stop_one stripe
    stop_one mail
    ;;
  restart)
    stop_one stripe
    stop_one mail
    check_ports mail
    check_ports stripe
    start_one mail
    start_one stripe
    ;;
  status)
    rc=0
    status_one mail || rc=3
    status_one stripe || rc=3
    exit "$rc"
    ;;
  *)
    echo "usage: $0 start|stop|status|restart" >&2
    exit 2
    ;;
esac
