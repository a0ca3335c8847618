#!/usr/bin/env bash
# Stop the app server started by `npm run up` and the private MariaDB, cleanly.
set -uo pipefail
. "$(dirname "$0")/env.sh"
export PATH="$PATH:/usr/sbin"
bash "$(dirname "$0")/app-server.sh" stop
if mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot ping >/dev/null 2>&1; then
  mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot shutdown && echo "MariaDB stopped."
else
  echo "MariaDB was not running."
fi
