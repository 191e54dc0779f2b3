#!/usr/bin/env bash
# `npm run bench`: every benchmark, printing figures beside their targets (no pass/fail).
#   npm run bench -- --quick    shorter runs
set -uo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh >/dev/null
TSX="node node_modules/tsx/dist/cli.mjs"
for bench in bench/engine.ts bench/report-pdf.ts bench/client.ts bench/api.ts bench/load.ts; do
  if [ -f "$bench" ]; then
    echo
    echo "== $bench"
    $TSX "$bench" "$@" || echo "($bench failed)"
  fi
done
