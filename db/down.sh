#!/usr/bin/env bash
# Stop the app server started by `npm run up` and the private MariaDB, cleanly.
set -uo pipefail
. "$(dirname "$0")/env.sh"
export PATH="$PATH:/usr/sbin"
if [ -f "$DATA_DIR/app.pid" ] && kill -0 "$(cat "$DATA_DIR/app.pid")" 2>/dev/null; then
  kill "$(cat "$DATA_DIR/app.pid")" && echo "App server stopped."
  rm -f "$DATA_DIR/app.pid"
fi
if mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot ping >/dev/null 2>&1; then
  mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot shutdown && echo "MariaDB stopped."
else
  echo "MariaDB was not running."
fi
