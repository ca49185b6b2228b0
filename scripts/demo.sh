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

"$ROOT/node_modules/.bin/tsx" scripts/migrate.ts up
"$ROOT/node_modules/.bin/tsx" scripts/migrate.ts seed

if [ "${SKIP_BUILD:-0}" != "1" ] || [ ! -f .next/BUILD_ID ]; then
  "$ROOT/node_modules/.bin/next" build
fi

cat <<MSG

  Brinewright demo: http://localhost:$PORT
  Demo accounts (demo only; never use these passwords anywhere real):
    learner      learner@cedarhollow.example       demo-learner-pass
    instructor   instructor@cedarhollow.example    demo-instructor-pass
    coordinator  coordinator@cedarhollow.example   demo-coordinator-pass
    admin        admin@cedarhollow.example         demo-admin-pass
  Stop with Ctrl-C; stop MariaDB with: npm run db:stop

MSG
exec "$ROOT/node_modules/.bin/next" start -p "$PORT"
