#!/usr/bin/env bash
# npm run demo: MariaDB, migrations, demo data, the local fakes, a production build, the app on :3000.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

PORT="${PORT:-3000}"
"$ROOT/scripts/db.sh" start
demo_env "$PORT"
demo_prepare

cat <<MSG

  Brinewright demo: http://localhost:$PORT
$(demo_accounts)
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
"$ROOT/node_modules/.bin/tsx" server.ts --port "$PORT" &
PIDS+=($!)
wait "${PIDS[2]}"
