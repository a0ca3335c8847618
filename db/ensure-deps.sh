#!/usr/bin/env bash
# Install npm packages when node_modules is missing or older than the lock file.
set -euo pipefail
cd "$(dirname "$0")/.."
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages…"
  npm install --no-audit --no-fund --loglevel=error
fi
