#!/usr/bin/env bash
# Install (if missing), initialise and start the project's private MariaDB on loopback.
# Safe to run again: a server already answering on our socket is reused.
set -euo pipefail
. "$(dirname "$0")/env.sh"
ensure_env

if ! command -v mariadbd >/dev/null 2>&1 && [ ! -x /usr/sbin/mariadbd ]; then
  if [ "$(id -u)" != "0" ]; then
    echo "MariaDB is not installed and this user cannot install it: run 'apt-get install -y mariadb-server' as root, then retry." >&2
    exit 1
  fi
  echo "Installing mariadb-server with apt-get (about 30 s)…"
  apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq mariadb-server >/dev/null
fi
export PATH="$PATH:/usr/sbin"

mkdir -p "$DATA_DIR"
if [ ! -d "$DB_DIR/mysql" ]; then
  echo "Initialising MariaDB data directory in .data/mariadb…"
  mariadb-install-db --no-defaults --user=root --datadir="$DB_DIR" \
    --auth-root-authentication-method=socket --skip-test-db >"$DATA_DIR/install-db.log" 2>&1
fi

if mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot ping >/dev/null 2>&1; then
  echo "MariaDB already running (port $DB_PORT)."
else
  if (exec 3<>/dev/tcp/127.0.0.1/"$DB_PORT") 2>/dev/null; then
    echo "Port $DB_PORT is taken by another program: set SPARWISE_DB_PORT to a free port." >&2
    exit 1
  fi
  rm -f "$DB_SOCK"
  setsid mariadbd --no-defaults --user=root --datadir="$DB_DIR" --socket="$DB_SOCK" \
    --port="$DB_PORT" --bind-address=127.0.0.1 --pid-file="$DB_PID" --log-error="$DB_LOG" \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --innodb-buffer-pool-size=256M --max-connections=500 \
    </dev/null >/dev/null 2>&1 &
  for _ in $(seq 1 100); do
    mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot ping >/dev/null 2>&1 && break
    sleep 0.2
  done
  if ! mariadb-admin --no-defaults --socket="$DB_SOCK" -uroot ping >/dev/null 2>&1; then
    echo "MariaDB did not start; see .data/mysqld.log" >&2
    tail -20 "$DB_LOG" >&2 || true
    exit 1
  fi
  echo "MariaDB started on 127.0.0.1:$DB_PORT."
fi

# The app user may use every database named sparwise*, so tests get their own.
as_root_sql <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`sparwise%\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`sparwise%\`.* TO '$DB_USER'@'localhost';
FLUSH PRIVILEGES;
SQL
