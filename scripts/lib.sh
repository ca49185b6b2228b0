#!/usr/bin/env bash
# Shared by demo.sh and test.sh: paths and the demo-only secret.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1
# The demo and the tests run production builds with the repository's demo secrets and local fakes,
# which a production process refuses without this flag (lib/production-check.ts).
export BRINEWRIGHT_DEMO=1
mkdir -p "$ROOT/.data"

# A random secret made once per checkout for local runs; real deployments set NEXTAUTH_SECRET themselves.
local_secret() {
  local file="$ROOT/.data/nextauth-secret"
  if [ ! -s "$file" ]; then
    node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))" >"$file"
  fi
  cat "$file"
}

# A Debian package the tests need, installed once when its program is missing: ensure_package
# <program path> <package> <what for>. Installing inside a test would eat that test's time limit.
ensure_package() {
  if [ -x "$1" ]; then return 0; fi
  echo "[setup] $1 is missing: installing Debian's $2 package for $3" >&2
  export DEBIAN_FRONTEND=noninteractive
  if [ -z "${APT_UPDATED:-}" ]; then apt-get update -qq; APT_UPDATED=1; fi
  apt-get install -y -qq "$2" >/dev/null
}

# The browser tests drive Debian's headless-only build of Chromium (no window system, about a third
# less CPU per page than the full browser in headless mode); CHROMIUM_PATH picks another binary.
ensure_chromium() {
  ensure_package "${CHROMIUM_PATH:-/usr/bin/chromium-headless-shell}" chromium-headless-shell "the browser tests"
}

ensure_nginx() {
  if [ -x /usr/bin/nginx ]; then return 0; fi
  ensure_package /usr/sbin/nginx nginx "the load balancer tests and the page benchmark"
}

# The demo's environment for a public address on PORT ($1): database, secret, addresses and the
# local fakes (the payment server the stripe SDK talks to, the SMTP server with its mailbox page).
demo_env() {
  local port="$1"
  export DATABASE_URL="${DATABASE_URL:-$("$ROOT/scripts/db.sh" url brinewright)}"
  export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(local_secret)}"
  export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:$port}"
  export APP_URL="${APP_URL:-http://localhost:$port}"
  export STRIPE_API_HOST="${STRIPE_API_HOST:-127.0.0.1}" STRIPE_API_PORT="${STRIPE_API_PORT:-12111}" STRIPE_API_PROTOCOL="${STRIPE_API_PROTOCOL:-http}"
  export SMTP_HOST="${SMTP_HOST:-127.0.0.1}" SMTP_PORT="${SMTP_PORT:-2525}" FAKE_MAILBOX_PORT="${FAKE_MAILBOX_PORT:-2580}"
  export MAILBOX_URL="${MAILBOX_URL:-http://127.0.0.1:$FAKE_MAILBOX_PORT}"
  export FAKE_PAYMENTS_WEBHOOK_URL="${FAKE_PAYMENTS_WEBHOOK_URL:-http://127.0.0.1:$port/api/webhooks/payments}"
}

# Migrations, demo data and (unless SKIP_BUILD=1 finds one) a production build.
demo_prepare() {
  "$ROOT/node_modules/.bin/tsx" "$ROOT/scripts/migrate.ts" up
  "$ROOT/node_modules/.bin/tsx" "$ROOT/scripts/migrate.ts" seed
  if [ "${SKIP_BUILD:-0}" != "1" ] || [ ! -f "${NEXT_DIST_DIR:-.next}/BUILD_ID" ]; then
    "$ROOT/node_modules/.bin/next" build
  fi
}

# The demo accounts, the mailbox and the test cards, as the demo banners print them.
demo_accounts() {
  cat <<MSG
  Demo accounts (demo only; never use these passwords anywhere real):
    learner      learner@cedarhollow.example       demo-learner-pass
    instructor   instructor@cedarhollow.example    demo-instructor-pass
    coordinator  coordinator@cedarhollow.example   demo-coordinator-pass
    admin        admin@cedarhollow.example         demo-admin-pass
  Local mailbox (every e-mail the demo sends): $MAILBOX_URL
  Practice payment page (no money moves): card 4600 4600 4600 4604 pays, 4600 4600 9090 9096 is turned down
MSG
}

# The fakes and the worker (outbox sender, reminders) in the background, stopped with the caller
# (demo.sh, dev.sh): their pids start PIDS, to which the caller adds its own servers.
start_services() {
  PIDS=()
  stop_all() { for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done; }
  trap stop_all EXIT
  trap 'exit 130' INT TERM
  "$ROOT/node_modules/.bin/tsx" scripts/fakes.ts &
  PIDS+=($!)
  "$ROOT/node_modules/.bin/tsx" --conditions=react-server scripts/worker.ts &
  PIDS+=($!)
}
