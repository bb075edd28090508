#!/usr/bin/env bash
# Installs the npm packages when node_modules is missing or older than package-lock.json.
set -euo pipefail
cd "$(dirname "$0")/.."
if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "[setup] installing npm packages (npm ci)…"
  npm ci --no-audit --no-fund --loglevel=error
fi
