#!/usr/bin/env bash
# `npm run up`: everything a fresh Debian machine needs, then the app, then the URL and sign-ins.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
. db/env.sh
started=$(date +%s)

bash db/ensure-deps.sh
bash db/start.sh
ensure_env
npx tsx db/migrate.ts --seed

echo "Building the app…"
npm run build --silent >"$DATA_DIR/build.log" 2>&1 || { tail -40 "$DATA_DIR/build.log"; exit 1; }

if [ -f "$DATA_DIR/app.pid" ] && kill -0 "$(cat "$DATA_DIR/app.pid")" 2>/dev/null; then
  echo "Restarting the app server with the new build…"
  kill "$(cat "$DATA_DIR/app.pid")" 2>/dev/null || true
  sleep 1
fi
PORT="${PORT:-3000}" NODE_ENV=production setsid nohup npx react-router-serve ./build/server/index.js \
  >"$DATA_DIR/app.log" 2>&1 </dev/null &
echo $! >"$DATA_DIR/app.pid"
# Node's fetch, not curl: a fresh machine has Node but not necessarily curl.
healthy() { node -e "fetch('http://127.0.0.1:${PORT:-3000}/healthz').then((r) => process.exit(r.ok ? 0 : 1), () => process.exit(1))"; }
for _ in $(seq 1 150); do
  healthy && break
  sleep 0.2
done
healthy || { echo "The app did not start; see .data/app.log" >&2; tail -30 "$DATA_DIR/app.log" >&2; exit 1; }

cat <<MSG

Sparwise is running at http://localhost:${PORT:-3000}  (ready in $(( $(date +%s) - started )) s; logs in .data/app.log)
Demo sign-ins (password for all: sparwise-demo):
  admin     admin@tallowfield.example
  engineer  engineer@tallowfield.example   (and engineer2@tallowfield.example)
  reviewer  reviewer@tallowfield.example
  viewer    viewer@tallowfield.example
Stop everything with: npm run down
MSG
