#!/usr/bin/env bash
# One build at a time in this tree (.nuxt and .output are shared); a second caller waits.
set -euo pipefail
cd "$(dirname "$0")/.."
mkdir -p node_modules/.cache
exec flock node_modules/.cache/gammaboard-build.lock npx nuxt build
