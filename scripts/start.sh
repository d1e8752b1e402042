#!/usr/bin/env bash
# npm start: dependencies, MariaDB on loopback, migrations, demo seed, client build, then serve.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
bash scripts/deps.sh
if [ -z "${DATABASE_URL:-}" ]; then bash scripts/db.sh start; fi
export NODE_ENV="${NODE_ENV:-production}"
node --import tsx scripts/migrate.ts --seed-demo
bash scripts/build-client.sh
exec node --import tsx server/index.ts
