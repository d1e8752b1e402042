#!/usr/bin/env bash
# Builds the client when anything it is made from is newer than the last build.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
stamp="dist/client/index.html"
if [ -f "$stamp" ] && [ -z "$(find src shared index.html vite.config.ts package-lock.json -newer "$stamp" -type f -print -quit 2>/dev/null)" ]; then
  exit 0
fi
echo "[build] building the client"
# Always the production build, whatever NODE_ENV the caller runs under: npm test exports
# NODE_ENV=test, and a build under it has import.meta.env.PROD false (no service worker, React's
# development build), so the browser journeys would not be testing what growers get.
NODE_ENV=production npx vite build --logLevel warn
