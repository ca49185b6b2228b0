#!/usr/bin/env bash
# Shared by demo.sh and test.sh: paths and the demo-only secret.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1
mkdir -p "$ROOT/.data"

# A random secret made once per checkout for local runs; real deployments set NEXTAUTH_SECRET themselves.
local_secret() {
  local file="$ROOT/.data/nextauth-secret"
  if [ ! -s "$file" ]; then
    node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))" >"$file"
  fi
  cat "$file"
}

ensure_chromium() {
  if [ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then return 0; fi
  echo "[setup] Chromium is missing: installing Debian's chromium package for the browser tests" >&2
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq chromium >/dev/null
}
