#!/usr/bin/env bash
# What Playwright starts: the production server with its fakes and worker on this run's ports.
set -euo pipefail
cd "$(dirname "$0")/../.."
export NODE_ENV=production DUFFBANK_DEMO=1 PORT="$E2E_PORT"
# A copy of what it prints, for run.sh to show when tests fail.
if [ -n "${E2E_DIR:-}" ]; then exec > >(tee -a "$E2E_DIR/server.log") 2>&1; fi
exec npm start
