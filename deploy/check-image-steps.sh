#!/usr/bin/env bash
# The container image's steps, run as a script where no Docker engine is available (CI): the
# runtime stage's files in a fresh folder, production dependencies only (npm ci --omit=dev, which
# also makes the bundle), the service started the way the image starts it, and the image's
# HEALTHCHECK command run against it. Fails when any step fails.
set -euo pipefail
cd "$(dirname "$0")/.."
if command -v docker >/dev/null && docker info >/dev/null 2>&1; then
  docker build -f deploy/Dockerfile -t shiftprobe:check .
  echo "image built"
  exit 0
fi
work="$(mktemp -d)"
trap 'kill "${pid:-0}" 2>/dev/null || true; rm -rf "$work"' EXIT
cp package.json package-lock.json tsconfig.json "$work/"
mkdir -p "$work/scripts" "$work/data"
cp scripts/build.mjs "$work/scripts/"
cp -r src bin fixtures "$work/"
(cd "$work" && npm ci --omit=dev --no-audit --no-fund --loglevel=error)
test -f "$work/dist/main.js" || { echo "no bundle after npm ci --omit=dev" >&2; exit 1; }
test ! -d "$work/node_modules/vitest" || { echo "dev dependencies in the production install" >&2; exit 1; }
# Start it as the image does (the HTTP API, so /healthz answers), with the image's environment.
(
  cd "$work"
  NODE_ENV=production DATABASE_PATH="$work/data/shiftprobe.db" HOST=127.0.0.1 LOG_FORMAT=json \
  HTTP_API_PORT=0 HTTP_API_KEYS="image-check:0123456789abcdef0123456789abcdef" PORT=38519 \
  exec node bin/shiftprobe.mjs --serve
) > "$work/log" 2>&1 &
pid=$!
port=""
for _ in $(seq 1 100); do
  port="$(grep -o 'the HTTP API at :[0-9]*' "$work/log" | grep -o '[0-9]*$' || true)"
  [ -n "$port" ] && break
  sleep 0.1
done
[ -n "$port" ] || { cat "$work/log" >&2; echo "the service did not start" >&2; exit 1; }
# The image's HEALTHCHECK, against the port the service took.
PORT="$port" node -e "fetch('http://127.0.0.1:'+(process.env.PORT||3000)+'/healthz').then(r=>process.exit(r.ok?0:1),()=>process.exit(1))"
kill -TERM "$pid"
wait "$pid" || { cat "$work/log" >&2; echo "the service did not stop cleanly" >&2; exit 1; }
grep -q '"level":"info"' "$work/log" || { echo "logs are not JSON" >&2; exit 1; }
echo "image steps: production install, bundle, start, health check and clean stop all passed"
