#!/usr/bin/env bash
# npm test: the same bootstrap as npm start against a separate test database, then the suite.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
bash scripts/deps.sh
if [ -z "${DATABASE_URL:-}" ]; then bash scripts/db.sh start; fi
bash scripts/browser.sh
export NODE_ENV=test TZ=UTC
node --import tsx scripts/migrate.ts
bash scripts/build-client.sh
exec npx vitest run "$@"
