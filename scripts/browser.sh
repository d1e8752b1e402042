#!/usr/bin/env bash
# Browser tests drive Debian's Chromium through playwright-core; no browser is ever downloaded by a test tool.
set -euo pipefail
if command -v chromium >/dev/null 2>&1; then exit 0; fi
if [ "$(id -u)" != 0 ]; then
  echo "Chromium is missing: install it with 'sudo apt-get install -y chromium' (browser tests will be skipped)." >&2
  exit 0
fi
echo "[browser] installing chromium from Debian's packages (about 35 s)"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq >/dev/null
apt-get install -y -qq --no-install-recommends chromium >/dev/null
