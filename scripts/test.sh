#!/usr/bin/env bash
# npm test: MariaDB of its own, then every test (unit, components, integration, browser).
# `--project integration` (npm run test:integration) needs MariaDB only: no browser, no nginx.
# npm run test:unit runs vitest directly: no database, no browser, no installs.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

case " $* " in
  *" --project integration "*) ;;
  *) ensure_chromium; ensure_nginx ;;
esac
"$ROOT/scripts/db.sh" start

export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(local_secret)}"
export DATABASE_URL="$("$ROOT/scripts/db.sh" url "${TEST_DATABASE_NAME:-brinewright_test}")"
export E2E_DATABASE_URL="$("$ROOT/scripts/db.sh" url "${E2E_DATABASE_NAME:-brinewright_e2e}")"

exec "$ROOT/node_modules/.bin/vitest" run "$@"
