#!/usr/bin/env bash
# What Playwright starts: the production server with its fakes and worker on this run's ports.
set -euo pipefail
cd "$(dirname "$0")/../.."
export NODE_ENV=production DUFFBANK_DEMO=1 PORT="$E2E_PORT"
exec npm start
