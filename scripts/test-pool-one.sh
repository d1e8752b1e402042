#!/usr/bin/env bash
# The API tests once more with the database pool limited to one connection (DB_POOL_MAX=1): a query
# inside a transaction that forgets `{ transaction }` then waits for the only connection, which its
# own transaction holds, and fails with an acquire timeout instead of passing unnoticed.
# Run after scripts/test.sh (MariaDB started, test database migrated, deps installed); extra args
# pass to vitest (.ci/run adds its JSON reporter).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
export NODE_ENV=test TZ=UTC DB_POOL_MAX=1
exec npx vitest run tests/api "$@"
