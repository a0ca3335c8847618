#!/usr/bin/env bash
# `npm test`: bootstrap the database as `npm run up` does, then type check and every suite.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash db/ensure-deps.sh
bash db/start.sh

echo "== type check"
npm run typecheck --silent

echo "== unit and property tests"
npx vitest run --project unit

echo "== integration tests (real MariaDB)"
npx vitest run --project integration

echo "== browser tests"
if [ ! -x /usr/bin/chromium ]; then
  echo "Installing Debian's chromium for the browser tests (about 45 s)…"
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
fi
npm run build --silent
npx vitest run --project e2e
echo "All suites passed."
