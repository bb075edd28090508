#!/usr/bin/env bash
# Private MariaDB for Sharpfield, on loopback only.
#   scripts/db.sh ensure                      install Debian's mariadb-server if missing (root only)
#   scripts/db.sh start PORT DATADIR          init DATADIR if empty, start mariadbd, wait, create app user
#   scripts/db.sh stop DATADIR                stop the server started for DATADIR
# Users created: sharpfield/sharpfield (all privileges on every database; loopback only).
set -euo pipefail

find_bin() {
  for c in "$@"; do
    if command -v "$c" >/dev/null 2>&1; then command -v "$c"; return 0; fi
    for d in /usr/sbin /usr/bin /usr/local/sbin /usr/local/bin; do
      if [ -x "$d/$c" ]; then echo "$d/$c"; return 0; fi
    done
  done
  return 1
}

ensure() {
  if find_bin mariadbd mysqld >/dev/null && find_bin mariadb-install-db mysql_install_db >/dev/null; then return 0; fi
  if [ "$(id -u)" != "0" ]; then
    echo "MariaDB server binaries are missing. Install Debian's mariadb-server (sudo apt-get install mariadb-server) and run again." >&2
    exit 1
  fi
  echo "[db] installing Debian's mariadb-server (one time)…"
  export DEBIAN_FRONTEND=noninteractive
  if ! apt-get install -y mariadb-server >/tmp/sharpfield-apt-mariadb.log 2>&1; then
    apt-get update >>/tmp/sharpfield-apt-mariadb.log 2>&1
    apt-get install -y mariadb-server >>/tmp/sharpfield-apt-mariadb.log 2>&1 || {
      echo "[db] apt-get install mariadb-server failed; see /tmp/sharpfield-apt-mariadb.log" >&2; exit 1; }
  fi
}

start() {
  local port="$1" datadir="$2"
  ensure
  local mariadbd install_db client
  mariadbd="$(find_bin mariadbd mysqld)"
  install_db="$(find_bin mariadb-install-db mysql_install_db)"
  client="$(find_bin mariadb mysql)"
  mkdir -p "$datadir"
  datadir="$(cd "$datadir" && pwd)"
  local sock="$datadir/mysqld.sock" pidf="$datadir/mysqld.pid" log="$datadir/mysqld.err"
  if [ -f "$pidf" ] && kill -0 "$(cat "$pidf")" 2>/dev/null; then
    echo "[db] already running on port $port (pid $(cat "$pidf"))"
    return 0
  fi
  if [ ! -d "$datadir/mysql" ]; then
    echo "[db] initialising $datadir"
    "$install_db" --no-defaults --datadir="$datadir" --user=root --auth-root-authentication-method=socket \
      --skip-test-db >"$datadir/install.log" 2>&1 || { cat "$datadir/install.log" >&2; exit 1; }
  fi
  "$mariadbd" --no-defaults --datadir="$datadir" --port="$port" --bind-address=127.0.0.1 \
    --socket="$sock" --pid-file="$pidf" --log-error="$log" --user=root --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --innodb-buffer-pool-size=256M --max-connections=500 --innodb-flush-log-at-trx-commit=2 \
    >/dev/null 2>&1 &
  for _ in $(seq 1 150); do
    if "$client" --no-defaults -uroot --socket="$sock" -e 'select 1' >/dev/null 2>&1; then break; fi
    sleep 0.1
  done
  "$client" --no-defaults -uroot --socket="$sock" -e 'select 1' >/dev/null 2>&1 || {
    echo "[db] MariaDB did not start; log:" >&2; tail -20 "$log" >&2; exit 1; }
  "$client" --no-defaults -uroot --socket="$sock" <<'SQL'
CREATE USER IF NOT EXISTS 'sharpfield'@'127.0.0.1' IDENTIFIED BY 'sharpfield';
GRANT ALL PRIVILEGES ON *.* TO 'sharpfield'@'127.0.0.1';
CREATE DATABASE IF NOT EXISTS sharpfield CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
FLUSH PRIVILEGES;
SQL
  echo "[db] MariaDB up on 127.0.0.1:$port (data $datadir)"
}

stop() {
  local datadir="$1" pidf
  pidf="$datadir/mysqld.pid"
  if [ -f "$pidf" ]; then
    local pid; pid="$(cat "$pidf")"
    kill "$pid" 2>/dev/null || true
    for _ in $(seq 1 100); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -9 "$pid" 2>/dev/null || true
    rm -f "$pidf"
  fi
}

case "${1:-}" in
  ensure) ensure ;;
  start) start "${2:?port}" "${3:?datadir}" ;;
  stop) stop "${2:?datadir}" ;;
  *) echo "usage: scripts/db.sh ensure | start PORT DATADIR | stop DATADIR" >&2; exit 2 ;;
esac
