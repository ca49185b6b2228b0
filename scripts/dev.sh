#!/usr/bin/env bash
# npm run dev: MariaDB, migrations, demo data, the local fakes, the worker and `next dev` on :3000,
# in one command. Values in .env.local (copy .env.example) win over the defaults below.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

if [ -f "$ROOT/.env.local" ]; then set -a; source "$ROOT/.env.local"; set +a; fi
PORT="${PORT:-3000}"
"$ROOT/scripts/db.sh" start
demo_env "$PORT"
"$ROOT/node_modules/.bin/tsx" scripts/migrate.ts up
"$ROOT/node_modules/.bin/tsx" scripts/migrate.ts seed

cat <<MSG

  Brinewright (development): http://localhost:$PORT
$(demo_accounts)
  Stop with Ctrl-C; stop MariaDB with: npm run db:stop

MSG
start_services
"$ROOT/node_modules/.bin/next" dev --port "$PORT" &
PIDS+=($!)
wait -n "${PIDS[@]}"
