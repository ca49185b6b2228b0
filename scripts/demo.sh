#!/usr/bin/env bash
# npm run demo: MariaDB, migrations, demo data, the local fakes, a production build, the app on :3000.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

PORT="${PORT:-3000}"
"$ROOT/scripts/db.sh" start
export DATABASE_URL="${DATABASE_URL:-$("$ROOT/scripts/db.sh" url brinewright)}"
export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(local_secret)}"
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:$PORT}"
export APP_URL="${APP_URL:-http://localhost:$PORT}"
# The local fakes: the payment server the stripe SDK talks to, and the SMTP server with its mailbox page.
export STRIPE_API_HOST="${STRIPE_API_HOST:-127.0.0.1}" STRIPE_API_PORT="${STRIPE_API_PORT:-12111}" STRIPE_API_PROTOCOL="${STRIPE_API_PROTOCOL:-http}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}" SMTP_PORT="${SMTP_PORT:-2525}" FAKE_MAILBOX_PORT="${FAKE_MAILBOX_PORT:-2580}"
export MAILBOX_URL="${MAILBOX_URL:-http://127.0.0.1:$FAKE_MAILBOX_PORT}"
export FAKE_PAYMENTS_WEBHOOK_URL="${FAKE_PAYMENTS_WEBHOOK_URL:-http://127.0.0.1:$PORT/api/webhooks/stripe}"

"$ROOT/node_modules/.bin/tsx" scripts/migrate.ts up
"$ROOT/node_modules/.bin/tsx" scripts/migrate.ts seed

if [ "${SKIP_BUILD:-0}" != "1" ] || [ ! -f "${NEXT_DIST_DIR:-.next}/BUILD_ID" ]; then
  "$ROOT/node_modules/.bin/next" build
fi

cat <<MSG

  Brinewright demo: http://localhost:$PORT
  Demo accounts (demo only; never use these passwords anywhere real):
    learner      learner@cedarhollow.example       demo-learner-pass
    instructor   instructor@cedarhollow.example    demo-instructor-pass
    coordinator  coordinator@cedarhollow.example   demo-coordinator-pass
    admin        admin@cedarhollow.example         demo-admin-pass
  Local mailbox (every e-mail the demo sends): $MAILBOX_URL
  Test cards on the local checkout page: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined
  Stop with Ctrl-C; stop MariaDB with: npm run db:stop

MSG
# The fakes and the worker (outbox sender, reminders) run in the background and stop with the demo.
PIDS=()
stop_all() { for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done; }
trap stop_all EXIT
trap 'exit 130' INT TERM
"$ROOT/node_modules/.bin/tsx" scripts/fakes.ts &
PIDS+=($!)
"$ROOT/node_modules/.bin/tsx" --conditions=react-server scripts/worker.ts &
PIDS+=($!)
"$ROOT/node_modules/.bin/next" start -p "$PORT" &
PIDS+=($!)
wait "${PIDS[2]}"
