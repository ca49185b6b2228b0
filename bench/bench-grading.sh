#!/usr/bin/env bash
# npm run bench:grading: graded quiz submissions against a production build vs a bare node:http
# handler doing the same INSERT through the same mariadb pool settings. Own database and port.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/../scripts/lib.sh"
cd "$ROOT"
"$ROOT/scripts/db.sh" start >/dev/null
export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(local_secret)}"
export BENCH_DATABASE_URL="$("$ROOT/scripts/db.sh" url "${BENCH_DATABASE_NAME:-brinewright_bench_grading}")"
exec "$ROOT/node_modules/.bin/tsx" bench/bench-grading.ts "$@"
