#!/usr/bin/env bash
# All tests: system packages, a production build, then unit and server/browser tests.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-system-deps.sh
bash scripts/build.sh
npx vitest run "$@"
