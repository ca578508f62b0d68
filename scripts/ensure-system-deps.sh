#!/usr/bin/env bash
# Installs the Debian packages the tests need (chromium for browser tests, ngspice for the
# reference AC analysis, postgresql and redis-server for the several-node suites) when they are
# missing. apt needs root; CI runs as root. The tests start their own throwaway PostgreSQL and
# Redis servers (tests/support/services.ts) from Debian's binaries: /usr/lib/postgresql/N/bin, not
# whatever else a PATH may hold, and never the packaged clusters or services.
set -euo pipefail
missing=()
command -v chromium >/dev/null 2>&1 || missing+=(chromium)
command -v ngspice >/dev/null 2>&1 || missing+=(ngspice)
compgen -G '/usr/lib/postgresql/*/bin/initdb' >/dev/null || missing+=(postgresql)
[ -x /usr/bin/redis-server ] || missing+=(redis-server)
if [ ${#missing[@]} -eq 0 ]; then exit 0; fi
if [ "$(id -u)" -ne 0 ]; then
  echo "missing Debian packages: ${missing[*]} (run as root, or: sudo apt-get install -y ${missing[*]})" >&2
  exit 1
fi
echo "installing ${missing[*]} from Debian…"
apt-get update -o DPkg::Lock::Timeout=120 >/dev/null
DEBIAN_FRONTEND=noninteractive apt-get install -y -o DPkg::Lock::Timeout=120 --no-install-recommends "${missing[@]}" >/dev/null
