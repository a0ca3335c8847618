#!/usr/bin/env bash
# Usage: db/app-server.sh start|stop — the production app server (server.ts) in the background,
# as `npm run up` and `npm run down` run it. Settings come from the environment (up.sh exports
# .env first; server.ts reads .env itself for anything unset). APP_STATE_DIR (default .data)
# holds app.pid and app.log.
set -uo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
STATE_DIR="${APP_STATE_DIR:-$ROOT/.data}"
PIDFILE="$STATE_DIR/app.pid"
LOG="$STATE_DIR/app.log"
PORT="${PORT:-3000}"
mkdir -p "$STATE_DIR"

# True when nothing listens on the port: binding it is the only sure test.
port_free() {
  node -e "const s = require('node:net').createServer(); s.once('error', () => process.exit(1)); s.listen(Number(process.argv[1]), () => s.close(() => process.exit(0)));" "$1"
}

# Our server runs in a process group of its own (setsid); stop the whole group: SIGTERM first
# (running sweeps get SPARWISE_SHUTDOWN_GRACE_MS to finish), SIGKILL after 30 s. A pid file
# whose process is not our server (stale after a reboot, the pid reused) kills nothing.
stop() {
  [ -f "$PIDFILE" ] || return 0
  local pid target
  pid="$(tr -dc '0-9' <"$PIDFILE")"
  # /proc, not ps: a minimal Debian has no procps.
  # react-router-serve: the server an older `npm run up` started (npx in its own group), stopped the same way.
  if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null && tr '\0' ' ' <"/proc/$pid/cmdline" | grep -Eq "server\.ts|react-router-serve"; then
    target="$pid"
    # Field 5 of /proc/PID/stat is the process group (the name in field 2 has no spaces: "(node)").
    if [ "$(cut -d' ' -f5 "/proc/$pid/stat")" = "$pid" ]; then target="-$pid"; fi
    kill -TERM -- "$target" 2>/dev/null
    for _ in $(seq 1 150); do
      kill -0 "$pid" 2>/dev/null || break
      sleep 0.2
    done
    if kill -0 "$pid" 2>/dev/null; then
      echo "The app server did not stop within 30 s; killing it." >&2
      kill -KILL -- "$target" 2>/dev/null
      sleep 0.5
    fi
    echo "App server stopped."
  fi
  rm -f "$PIDFILE"
}

start() {
  if [ -f "$PIDFILE" ]; then
    echo "Restarting the app server with the new build…"
    stop
  fi
  if ! port_free "$PORT"; then
    echo "Port $PORT is already in use by another program, not a server this checkout started." >&2
    echo "Stop that program (or set PORT in .env) and start again." >&2
    return 1
  fi
  # node itself, no npx wrapper: the pid recorded is the server's, and setsid makes it the
  # leader of a process group of its own.
  PORT="$PORT" NODE_ENV=production setsid node --import tsx server.ts >"$LOG" 2>&1 </dev/null &
  local pid=$!
  echo "$pid" >"$PIDFILE"
  # Success only when our own new server answers: if it died, whatever else holds the port does
  # not count. Node's fetch, not curl: a fresh machine has Node but not necessarily curl.
  healthy() {
    kill -0 "$pid" 2>/dev/null &&
      node -e "fetch('http://127.0.0.1:${PORT}/healthz').then((r) => process.exit(r.ok ? 0 : 1), () => process.exit(1))"
  }
  for _ in $(seq 1 150); do
    healthy && return 0
    kill -0 "$pid" 2>/dev/null || break
    sleep 0.2
  done
  healthy && return 0
  echo "The app did not start; see $LOG" >&2
  tail -30 "$LOG" >&2
  kill -0 "$pid" 2>/dev/null && kill -TERM -- "-$pid" 2>/dev/null
  rm -f "$PIDFILE"
  return 1
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  *) echo "usage: db/app-server.sh start|stop" >&2; exit 2 ;;
esac
