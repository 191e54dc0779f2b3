#!/usr/bin/env bash
# Install what is missing: npm packages (from the lockfile), and with "--test-tools" the Debian
# packages the test suite drives (Chromium, Liberation fonts, poppler-utils, qpdf, NSS tools).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"

if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages (npm ci)..." >&2
  npm ci --no-audit --no-fund >&2
fi

if [ "${1:-}" = "--test-tools" ]; then
  missing=()
  command -v chromium >/dev/null 2>&1 || missing+=(chromium)
  [ -f /usr/share/fonts/truetype/liberation/LiberationSans-Regular.ttf ] || missing+=(fonts-liberation)
  command -v pdftotext >/dev/null 2>&1 || missing+=(poppler-utils)
  command -v qpdf >/dev/null 2>&1 || missing+=(qpdf)
  command -v certutil >/dev/null 2>&1 || missing+=(libnss3-tools)
  if [ ${#missing[@]} -gt 0 ]; then
    if [ "$(id -u)" -ne 0 ]; then echo "Missing Debian packages: ${missing[*]} (run as root or install them)" >&2; exit 1; fi
    echo "Installing Debian packages: ${missing[*]}..." >&2
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -q >/dev/null
    apt-get install -y -q "${missing[@]}" >/dev/null
  fi
fi
