#!/usr/bin/env bash
# Entry point of `npm start`, `npm run dev` and `npm test`. Plain bash because it must run
# before the npm packages (and so tsx) are installed; everything after that is TypeScript.
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1

# Reinstall only when the locked dependency set changes (not when a script line is edited),
# recorded as the lock file's checksum.
stamp=node_modules/.hoebench-installed
wanted=$(sha256sum package-lock.json | cut -d' ' -f1)
if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$wanted" ] || [ ! -x node_modules/.bin/tsx ]; then
  echo "[hoebench] installing npm packages"
  npm ci --no-audit --no-fund --loglevel=error
  echo "$wanted" > "$stamp"
fi

exec node_modules/.bin/tsx scripts/run.ts "$@"
