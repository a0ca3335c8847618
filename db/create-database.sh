#!/usr/bin/env bash
# Usage: db/create-database.sh NAME [--fresh] — create (or drop and recreate) one sparwise* database.
set -euo pipefail
. "$(dirname "$0")/env.sh"
ensure_env
export PATH="$PATH:/usr/sbin"
name="$1"
case "$name" in sparwise*) ;; *) echo "database names must start with sparwise" >&2; exit 1;; esac
if [ "${2:-}" = "--fresh" ]; then as_root_sql -e "DROP DATABASE IF EXISTS \`$name\`"; fi
as_root_sql -e "CREATE DATABASE IF NOT EXISTS \`$name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci"
