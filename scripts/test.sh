#!/usr/bin/env bash
# npm test: MariaDB of its own, then every test (unit, components, integration, browser).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

ensure_chromium
ensure_nginx
"$ROOT/scripts/db.sh" start

export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(local_secret)}"
export DATABASE_URL="$("$ROOT/scripts/db.sh" url "${TEST_DATABASE_NAME:-brinewright_test}")"
export E2E_DATABASE_URL="$("$ROOT/scripts/db.sh" url "${E2E_DATABASE_NAME:-brinewright_e2e}")"

exec "$ROOT/node_modules/.bin/vitest" run "$@"
