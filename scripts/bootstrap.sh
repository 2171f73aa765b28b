#!/usr/bin/env bash
# Entry point of `npm start`, `npm run dev` and `npm test`. Plain bash because it must run
# before the npm packages (and so tsx) are installed; everything after that is TypeScript.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1

stamp=node_modules/.hoebench-installed
if [ ! -f "$stamp" ] || [ package-lock.json -nt "$stamp" ] || [ package.json -nt "$stamp" ]; then
  echo "[hoebench] installing npm packages"
  if [ -f package-lock.json ]; then
    npm ci --no-audit --no-fund --loglevel=error
  else
    npm install --no-audit --no-fund --loglevel=error
  fi
  touch "$stamp"
fi

exec node_modules/.bin/tsx scripts/run.ts "$@"
