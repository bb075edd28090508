#!/usr/bin/env bash
# npm start: sets everything up on a fresh clone and runs Sharpfield on http://127.0.0.1:8080.
# Ctrl-C (or SIGTERM) stops everything this script started; the data under .data/ is kept.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT="$(pwd)"
export PORT="${PORT:-8080}" HOST="${HOST:-127.0.0.1}" DB_PORT="${DB_PORT:-3307}" SMTP_PORT="${SMTP_PORT:-2525}"
export DATA_DIR="${DATA_DIR:-$ROOT/.data}" DEMO_MODE="${DEMO_MODE:-true}" STATIC_DIR="${STATIC_DIR:-$ROOT/dist}"
mkdir -p "$DATA_DIR"

bash scripts/ensure-deps.sh

PIDS=()
cleanup() {
  trap - INT TERM EXIT
  echo; echo "[start] stopping…"
  for pid in "${PIDS[@]:-}"; do [ -n "$pid" ] && kill "$pid" 2>/dev/null || true; done
  for pid in "${PIDS[@]:-}"; do [ -n "$pid" ] && wait "$pid" 2>/dev/null || true; done
  bash scripts/db.sh stop "$DATA_DIR/mariadb" || true
  echo "[start] stopped."
}
trap cleanup INT TERM EXIT

bash scripts/db.sh start "$DB_PORT" "$DATA_DIR/mariadb"
npx tsx scripts/migrate.ts
npx tsx scripts/seed-demo.ts

node --import tsx scripts/fake-smtp.ts &
PIDS+=($!)

echo "[start] building the client…"
npx vite build --logLevel warn

node --import tsx server/index.ts &
PIDS+=($!)
for _ in $(seq 1 100); do
  curl -fs "http://$HOST:$PORT/api/health" >/dev/null 2>&1 && break
  sleep 0.2
done

cat <<MSG

  Sharpfield is running: http://$HOST:$PORT

  Demo accounts (password: sharpfield-demo — demo only):
    inspector@sharpfield.test     field checks, rounds, sync
    supervisor@sharpfield.test    fleet, work orders, reports
    maintenance@sharpfield.test   assigned work orders
    admin@sharpfield.test         users, sites, cameras

  Fake mail server (demo): smtp://127.0.0.1:$SMTP_PORT — caught mail in the Mailbox screen.
  Press Ctrl-C to stop.

MSG
wait -n "${PIDS[@]}" || true
