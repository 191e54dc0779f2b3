#!/usr/bin/env bash
# `npm run dev`: API in watch mode (tsx), the stand-ins, and ng serve on :4200 proxying /api.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/pg-cluster.sh start
  DATABASE_URL="$(bash scripts/pg-cluster.sh url)"; export DATABASE_URL
fi
export PUBLIC_URL="${PUBLIC_URL:-http://127.0.0.1:4200}" FAKES_DATA_DIR="$ROOT/.data/fakes"
npx tsx server/db/migrate-cli.ts up
npx tsx server/demo/seed-cli.ts
trap 'kill 0' EXIT INT TERM
npx tsx fakes/main.ts &
npx tsx watch server/main.ts &
npx ng serve &
wait
