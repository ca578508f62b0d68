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
# Links in mails point here (never at a request's Host header); the server refuses mail without it.
export GAMMABOARD_PUBLIC_URL="${GAMMABOARD_PUBLIC_URL:-http://localhost:${PORT}}"
echo "Gammaboard demo: http://localhost:${PORT}"
echo "Demo sign-ins (workspace brackwater, Brackwater Sensor Works; seeded on a database without users):"
echo "  admin     Mara Quell      mara@brackwater.example   brackwater-admin-demo"
echo "  designer  Tomas Reyes     tomas@brackwater.example  brackwater-designer-demo"
echo "  reviewer  Ines Halvorsen  ines@brackwater.example   brackwater-reviewer-demo"
echo "Mail goes to the local catcher; admins read it at /w/brackwater/outbox."
exec node .output/server/index.mjs
