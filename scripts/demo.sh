#!/usr/bin/env bash
# Builds, migrates and seeds the demo database, and serves Gammaboard on http://localhost:3000.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/build.sh
mkdir -p data
export GAMMABOARD_DB="${GAMMABOARD_DB:-data/gammaboard.sqlite}"
export NUXT_SESSION_PASSWORD="${NUXT_SESSION_PASSWORD:-demo-only-session-password-change-me-in-production}"
export GAMMABOARD_SEED=demo
export PORT="${PORT:-3000}"
export HOST="${HOST:-127.0.0.1}"
echo "Gammaboard demo: http://localhost:${PORT}"
exec node .output/server/index.mjs
