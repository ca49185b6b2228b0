#!/usr/bin/env bash
# npm run demo: MariaDB, migrations, demo data, the local fakes, a production build, the app
# (`next start` on a loopback port) behind nginx on :3000. nginx writes X-Forwarded-For itself, so a
# client cannot choose the address the sign-in and verification throttles count.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

PORT="${PORT:-3000}"               # nginx, the address people use
APP_PORT="${APP_PORT:-3001}"       # the app, on loopback only
PROXY_DIR="$ROOT/.data/proxy"
"$ROOT/scripts/db.sh" start
demo_env "$PORT"
demo_prepare
NGINX_SETUP="$("$ROOT/node_modules/.bin/tsx" scripts/cluster/nginx.ts "$PROXY_DIR" "$PORT" "127.0.0.1:$APP_PORT")"
read -r NGINX NGINX_CONF <<<"$NGINX_SETUP"

cat <<MSG

  Brinewright demo: http://localhost:$PORT
$(demo_accounts)
  Stop with Ctrl-C; stop MariaDB with: npm run db:stop

MSG
start_services
"$ROOT/node_modules/.bin/tsx" scripts/app-server.ts --port "$APP_PORT" &
PIDS+=($!)
"$NGINX" -c "$NGINX_CONF" -p "$PROXY_DIR" &
PIDS+=($!)
# Runs until Ctrl-C or until the app or nginx stops.
wait -n "${PIDS[2]}" "${PIDS[3]}"
