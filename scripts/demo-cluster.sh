#!/usr/bin/env bash
# npm run demo:cluster: the demo on TWO app servers behind nginx, sharing MariaDB and an
# S3-compatible photo store (the local fake in fakes/s3). MariaDB, migrations, demo data, one
# production build, the fakes, the worker, `next start` on two loopback ports, nginx on :3000.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

PORT="${PORT:-3000}"                 # nginx, the address people use
APP_PORT_A="${APP_PORT_A:-3001}"     # first app server (loopback only)
APP_PORT_B="${APP_PORT_B:-3002}"     # second app server
FAKE_S3_PORT="${FAKE_S3_PORT:-9310}"
CLUSTER_DIR="$ROOT/.data/cluster"

"$ROOT/scripts/db.sh" start
# One NEXTAUTH_SECRET for every app server: sessions are JWTs signed with it, so any server reads
# any session. NEXTAUTH_URL/APP_URL are nginx's address, never an app server's own port; webhooks
# from the payment fake go through nginx too, so either server may take them.
demo_env "$PORT"
# Photos in one bucket both servers reach (the fake keeps it under .data/fake-s3).
if [ ! -s "$ROOT/.data/fake-s3-secret" ]; then
  node -e "process.stdout.write(require('crypto').randomBytes(24).toString('hex'))" >"$ROOT/.data/fake-s3-secret"
fi
export STORAGE_DRIVER=s3
export S3_ENDPOINT="${S3_ENDPOINT:-http://127.0.0.1:$FAKE_S3_PORT}" S3_REGION="${S3_REGION:-us-east-1}" S3_BUCKET="${S3_BUCKET:-brinewright-photos}"
export S3_ACCESS_KEY_ID="${S3_ACCESS_KEY_ID:-BRINEWRIGHTDEMOKEY01}" S3_SECRET_ACCESS_KEY="${S3_SECRET_ACCESS_KEY:-$(cat "$ROOT/.data/fake-s3-secret")}"
export S3_FORCE_PATH_STYLE="${S3_FORCE_PATH_STYLE:-true}"
# The SDK's notice about its future Node 22 requirement, once per process, says nothing about this demo.
export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED="${AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED:-true}"

demo_prepare

NGINX_SETUP="$("$ROOT/node_modules/.bin/tsx" scripts/cluster/nginx.ts "$CLUSTER_DIR" "$PORT" "127.0.0.1:$APP_PORT_A" "127.0.0.1:$APP_PORT_B")"
read -r NGINX NGINX_CONF <<<"$NGINX_SETUP"

PIDS=()
stop_all() { for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done; wait 2>/dev/null || true; }
trap stop_all EXIT
trap 'exit 130' INT TERM

wait_for() { # URL SECONDS
  node -e '
    const [url, seconds] = process.argv.slice(1);
    const end = Date.now() + Number(seconds) * 1000;
    (async () => {
      for (;;) {
        try { if ((await fetch(url)).ok) process.exit(0); } catch {}
        if (Date.now() > end) { console.error(`[cluster] ${url} did not answer within ${seconds} s`); process.exit(1); }
        await new Promise((r) => setTimeout(r, 200));
      }
    })();' "$1" "$2"
}

"$ROOT/node_modules/.bin/tsx" scripts/fakes.ts &
PIDS+=($!)
wait_for "http://127.0.0.1:$FAKE_S3_PORT/_fake/health" 30
# The demo seed writes its practical photos to the disk folder; put them in the bucket as well.
"$ROOT/node_modules/.bin/tsx" scripts/cluster/copy-photos-to-s3.ts
"$ROOT/node_modules/.bin/tsx" --conditions=react-server scripts/worker.ts &
PIDS+=($!)
"$ROOT/node_modules/.bin/tsx" scripts/app-server.ts --port "$APP_PORT_A" &
PIDS+=($!)
"$ROOT/node_modules/.bin/tsx" scripts/app-server.ts --port "$APP_PORT_B" &
PIDS+=($!)
"$NGINX" -c "$NGINX_CONF" -p "$CLUSTER_DIR" &
PIDS+=($!)
wait_for "http://127.0.0.1:$APP_PORT_A/api/health" 60
wait_for "http://127.0.0.1:$APP_PORT_B/api/health" 60
wait_for "http://127.0.0.1:$PORT/api/health" 10

cat <<MSG

  Brinewright cluster demo: http://localhost:$PORT  (nginx, round robin)
    app server A   http://127.0.0.1:$APP_PORT_A  (pid ${PIDS[2]})
    app server B   http://127.0.0.1:$APP_PORT_B  (pid ${PIDS[3]})
    photo store    $S3_ENDPOINT  bucket $S3_BUCKET (local S3-compatible fake, files in ${FAKE_S3_ROOT:-.data/fake-s3})
    nginx          config $NGINX_CONF; access.log there names the app server that answered
$(demo_accounts)
  Stop one app server (kill PID) and nginx sends everything to the other.
  Stop with Ctrl-C; stop MariaDB with: npm run db:stop

MSG
# Runs until Ctrl-C or until nginx, the fakes or the worker stop; an app server may be stopped alone.
wait -n "${PIDS[0]}" "${PIDS[1]}" "${PIDS[4]}"
