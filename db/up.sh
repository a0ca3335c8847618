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

export PORT="${PORT:-3000}"
bash db/app-server.sh start

cat <<MSG

Sparwise is running at http://localhost:${PORT}  (ready in $(( $(date +%s) - started )) s; logs in .data/app.log)
Demo sign-ins (password for all: sparwise-demo):
  admin     admin@tallowfield.example
  engineer  engineer@tallowfield.example   (and engineer2@tallowfield.example)
  reviewer  reviewer@tallowfield.example
  viewer    viewer@tallowfield.example
Stop everything with: npm run down
MSG
