#!/usr/bin/env bash
# `npm start`: everything from a fresh clone to a running Sidecheck with the demo scenario.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
export PORT="${PORT:-4610}"
export SMTP_PORT="${SMTP_PORT:-4625}" SMTP_HTTP_PORT="${SMTP_HTTP_PORT:-4626}" PAYMENTS_PORT="${PAYMENTS_PORT:-4627}"
export PUBLIC_URL="${PUBLIC_URL:-http://127.0.0.1:$PORT}"
export FAKES_DATA_DIR="${FAKES_DATA_DIR:-$ROOT/.data/fakes}"
export PAYMENTS_SECRET_KEY="${PAYMENTS_SECRET_KEY:-sk_test_sidecheck_local}"
export PAYMENTS_WEBHOOK_SECRET="${PAYMENTS_WEBHOOK_SECRET:-whsec_sidecheck_local}"
export PAYMENTS_WEBHOOK_URL="${PAYMENTS_WEBHOOK_URL:-http://127.0.0.1:$PORT/api/billing/webhook}"

bash scripts/ensure-deps.sh

OWN_CLUSTER=0
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/pg-cluster.sh start
  DATABASE_URL="$(bash scripts/pg-cluster.sh url)"
  export DATABASE_URL
  OWN_CLUSTER=1
fi

echo "Building the client and the server..." >&2
npx ng build --configuration production >/dev/null
npx tsc -p tsconfig.server.json

node dist/server/server/db/migrate-cli.js up
node dist/server/server/demo/seed-cli.js

pids=()
cleanup() {
  trap - EXIT INT TERM
  for pid in "${pids[@]}"; do kill "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  if [ "$OWN_CLUSTER" = 1 ]; then bash scripts/pg-cluster.sh stop; echo "PostgreSQL stopped (data kept in .data/pg)." >&2; fi
}
trap cleanup EXIT INT TERM

node dist/server/fakes/main.js &
pids+=($!)
# Node options of an API process (scripts/api-node-flags; DEVELOPERS.md, "Garbage collection").
# shellcheck disable=SC2046
NODE_ENV="${NODE_ENV:-development}" node $(cat scripts/api-node-flags) dist/server/server/main.js &
pids+=($!)

for _ in $(seq 1 60); do
  if curl -fsS "http://127.0.0.1:$PORT/api/health" >/dev/null 2>&1; then break; fi
  sleep 0.5
done
curl -fsS "http://127.0.0.1:$PORT/api/health" >/dev/null || { echo "Sidecheck did not start; see the messages above." >&2; exit 1; }

cat <<TXT

  Sidecheck is running:   $PUBLIC_URL
  Mail stand-in (inbox):  http://127.0.0.1:$SMTP_HTTP_PORT
  Payments stand-in:      http://127.0.0.1:$PAYMENTS_PORT

  Demo sign-ins (password for all: sidecheck-demo-2026), all invented people:
    Test engineer          tomasz.ellery@kestrelbay.example
    Technical reviewer     priya.castellanos@kestrelbay.example
    Lab administrator      imogen.varga@kestrelbay.example
    Billing                owen.achterberg@kestrelbay.example
    Manufacturer admin     delphine.okafor@halyard-radio.example
    Manufacturer viewer    rafael.lindqvist@halyard-radio.example

  Press Ctrl-C to stop.
TXT
wait -n "${pids[@]}"
