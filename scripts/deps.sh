#!/usr/bin/env bash
# Installs npm dependencies when missing or when package-lock.json changed since the last install.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
stamp="node_modules/.heatclock-lock-hash"
want="$(sha256sum package-lock.json | cut -c1-64)"
if [ -d node_modules ] && [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ]; then exit 0; fi
echo "[deps] installing npm dependencies (npm ci)"
npm ci --no-audit --no-fund --loglevel=error
echo "$want" >"$stamp"
