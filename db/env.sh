# Shared settings for the MariaDB scripts; sourced, never run.
# Everything lives inside the project so a checkout never touches the system's MariaDB.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="$ROOT/.data"
DB_DIR="$DATA_DIR/mariadb"
DB_SOCK="$DATA_DIR/mysqld.sock"
DB_PID="$DATA_DIR/mysqld.pid"
DB_LOG="$DATA_DIR/mysqld.log"

# .env holds the generated secrets; created once, kept across runs, ignored by git.
ensure_env() {
  if [ ! -f "$ROOT/.env" ]; then
    {
      echo "SESSION_SECRET=$(head -c 32 /dev/urandom | od -An -tx1 | tr -d ' \n')"
      echo "DB_PASSWORD=$(head -c 18 /dev/urandom | od -An -tx1 | tr -d ' \n')"
      echo "DB_PORT=3307"
      echo "DB_NAME=sparwise"
      echo "PORT=3000"
    } > "$ROOT/.env"
    chmod 600 "$ROOT/.env"
  fi
  # Links in e-mail are built from APP_URL alone (the server refuses to start without it in
  # production); an .env from before that rule gets the local address appended.
  if ! grep -q '^APP_URL=' "$ROOT/.env"; then
    [ -z "$(tail -c 1 "$ROOT/.env")" ] || echo >> "$ROOT/.env"
    echo "APP_URL=http://localhost:3000" >> "$ROOT/.env"
  fi
  set -a; . "$ROOT/.env"; set +a
  DB_PORT="${SPARWISE_DB_PORT:-${DB_PORT:-3307}}"
  export DB_PORT DB_HOST=127.0.0.1 DB_USER="${DB_USER:-sparwise}"
}

as_root_sql() { mariadb --no-defaults --socket="$DB_SOCK" -uroot "$@"; }
