#!/usr/bin/env bash
# The whole suite: unit, integration (real SQLite), then end-to-end in Chromium.
set -euo pipefail
cd "$(dirname "$0")/.."
export NODE_ENV=test NEXT_TELEMETRY_DISABLED=1
npx vitest run
unset NODE_ENV
bash tests/e2e/run.sh
