#!/usr/bin/env bash
# `npm test`: bootstrap the database as `npm run up` does, then type check and every suite.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash db/ensure-deps.sh
bash db/start.sh

# Each suite's output is kept so the closing line can add up the counts vitest prints.
LOG_DIR="$(mktemp -d)"
trap 'rm -rf "$LOG_DIR"' EXIT
suite() { local name="$1"; shift; npx vitest run --project "$name" "$@" 2>&1 | tee "$LOG_DIR/$name.log"; }
count() { sed 's/\x1b\[[0-9;]*m//g' "$LOG_DIR"/*.log | grep -E '^ *Tests ' | grep -oE "[0-9]+ $1" | awk '{s += $1} END {print s + 0}'; }

echo "== type check"
npm run typecheck --silent

echo "== unit and property tests"
suite unit

echo "== integration tests (real MariaDB)"
suite integration

echo "== browser tests"
if [ ! -x /usr/bin/chromium ]; then
  echo "Installing Debian's chromium for the browser tests (about 45 s)…"
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
fi
npm run build --silent
suite e2e
echo "All suites passed."
echo "$(count passed) passed, $(count failed) failed"
