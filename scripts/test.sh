#!/usr/bin/env bash
# `npm test`: every test, on the real stack. A private PostgreSQL cluster is created fresh for the
# run (unless DATABASE_URL names a throwaway database), then: type check, unit tests (shared,
# client), API tests (server, stand-ins), a production build, and the browser end-to-end suite.
# Ends with one line "N passed, N failed" added up from every runner.
set -uo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
export TZ=UTC NODE_ENV=test
mkdir -p artifacts/test-results
rm -f artifacts/test-results/*.json

bash scripts/ensure-deps.sh --test-tools || exit 1

OWN_CLUSTER=0
if [ -z "${DATABASE_URL:-}" ]; then
  export PG_DIR="$ROOT/.data/pg-test" PG_PORT="${TEST_PG_PORT:-54611}" PG_DB=sidecheck_test
  bash scripts/pg-cluster.sh destroy
  PG_FSYNC=off bash scripts/pg-cluster.sh start || exit 1
  DATABASE_URL="$(bash scripts/pg-cluster.sh url)"
  export DATABASE_URL PG_SUPERUSER_URL="$(bash scripts/pg-cluster.sh superuser-url)"
  OWN_CLUSTER=1
fi
export TEST_DATABASE_URL="$DATABASE_URL"
cleanup() { if [ "$OWN_CLUSTER" = 1 ]; then bash scripts/pg-cluster.sh stop; fi; }
trap cleanup EXIT

status=0
step() { echo; echo "== $1"; }

step "migrations"
npx tsx server/db/migrate-cli.ts up && npx tsx server/mail/prepare-queue-cli.ts || status=1

step "type check"
npx tsc -p tsconfig.check.json || status=1
npx tsc -p tsconfig.app.json --noEmit || status=1
npx tsc -p tsconfig.spec-check.json || status=1

step "unit tests: shared library and client"
npx jest --selectProjects shared client --json --outputFile=artifacts/test-results/unit.json || status=1

step "API and stand-in tests against PostgreSQL"
npx jest --selectProjects server -w 2 --json --outputFile=artifacts/test-results/server.json || status=1

# The API tests enqueue mail with no worker running; those jobs were never meant to be sent. Clear
# them so the browser suites' product server sends only the mail of its own scenario.
node -e "const {Client}=require('pg');const c=new Client({connectionString:process.env.DATABASE_URL});c.connect().then(()=>c.query(\"DELETE FROM pgboss.job WHERE state IN ('created','retry')\")).then((r)=>{console.log('queued mail of the API tests cleared: '+r.rowCount);return c.end();}).catch((e)=>{console.error(e.message);process.exit(1);})" || status=1

step "production build"
if npx ng build --configuration production > artifacts/test-results/build.log 2>&1 && npx tsc -p tsconfig.server.json; then
  tail -n 25 artifacts/test-results/build.log
  step "end-to-end in headless Chromium, security and fault suites"
  npx jest --selectProjects e2e --runInBand --json --outputFile=artifacts/test-results/e2e.json || status=1
else
  cat artifacts/test-results/build.log
  echo "build failed: end-to-end suite not run" >&2
  status=1
fi

node scripts/summarize-tests.js artifacts/test-results/*.json || status=1
exit $status
