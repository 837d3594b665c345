#!/usr/bin/env bash
# Runs every test: unit and integration (vitest), then the browser tests against the built app.
set -euo pipefail
cd "$(dirname "$0")/.."

# Browser tests use Debian's Chromium; PDF tests read pages with poppler. Install them when missing (root on CI).
need=()
command -v chromium >/dev/null || need+=(chromium)
command -v pdftotext >/dev/null || need+=(poppler-utils)
if [ ${#need[@]} -gt 0 ]; then
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >/dev/null
fi

export NODE_ENV=test
npx vitest run
unset NODE_ENV
npm run build >/tmp/inverso-build.log 2>&1 || { tail -50 /tmp/inverso-build.log; exit 1; }
npx playwright test
