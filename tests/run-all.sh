#!/usr/bin/env bash
# The whole suite: lint (layers, import circles, the environment module), unit and
# integration tests on SQLite, the integration tests again on
# PostgreSQL (each test file on a fresh database, either engine), end-to-end in Chromium on
# SQLite and on PostgreSQL, and several app processes with several workers sharing one
# PostgreSQL database.
#
# PostgreSQL: DATABASE_URL names a server to use (a developer's own); without it a throwaway
# PostgreSQL 15 cluster is started for the run and removed at the end (tests/postgres.sh),
# installed from Debian's packages first when missing and running as root.
set -euo pipefail
cd "$(dirname "$0")/.."
source tests/debian-package.sh
source tests/postgres.sh
export NEXT_TELEMETRY_DISABLED=1
PG_SERVER_URL="${DATABASE_URL:-}"
unset DATABASE_URL

echo "[test] lint: the layers, import circles and the one environment module (eslint.config.mjs)"
npm run lint

echo "[test] unit and integration tests on SQLite"
NODE_ENV=test npx vitest run

start_postgres "$PG_SERVER_URL"
echo "[test] integration tests on PostgreSQL"
DATABASE_URL="$PG_TEST_URL" NODE_ENV=test npx vitest run tests/integration

echo "[test] end-to-end tests (production build, SQLite)"
bash tests/e2e/run.sh

if [ "${E2E_POSTGRES:-1}" != "0" ]; then
  echo "[test] end-to-end tests again on PostgreSQL (the same build; E2E_POSTGRES=0 skips)"
  DATABASE_URL="$PG_TEST_URL" E2E_SKIP_BUILD=1 bash tests/e2e/run.sh
fi

echo "[test] two app processes and two workers on one PostgreSQL database"
DATABASE_URL="$PG_TEST_URL" NODE_ENV=test npx vitest run tests/processes
