#!/usr/bin/env bash
# Runs every test: unit and integration (vitest), then the browser tests against the built app
# (Playwright in Debian's Chromium). Ends with one "N passed, N failed" line over both.
set -uo pipefail
cd "$(dirname "$0")/.."

# Browser tests use Debian's Chromium; PDF tests read pages with poppler. Install them when missing (root on CI).
need=()
command -v chromium >/dev/null || need+=(chromium)
command -v pdftotext >/dev/null || need+=(poppler-utils)
if [ ${#need[@]} -gt 0 ]; then
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >/dev/null || exit 1
fi

report=$(mktemp -d)
# Layer rules (DEVELOPERS.md): a violation fails the run like a failing test.
npm run -s lint:deps
layers=$?
NODE_ENV=test npx vitest run --reporter=default --reporter=json --outputFile.json="$report/vitest.json"
unit=$?

if npm run build >"$report/build.log" 2>&1; then
  PLAYWRIGHT_JSON_OUTPUT_NAME="$report/e2e.json" npx playwright test --reporter=list,json
  e2e=$?
else
  tail -50 "$report/build.log"
  e2e=1
fi

node -e '
const fs = require("fs")
const read = (f) => { try { return JSON.parse(fs.readFileSync(f, "utf8")) } catch { return null } }
const v = read(process.argv[1]) ?? { numPassedTests: 0, numFailedTests: 0 }
const p = read(process.argv[2])?.stats ?? { expected: 0, unexpected: 0, flaky: 0 }
const passed = v.numPassedTests + p.expected + p.flaky
const failed = v.numFailedTests + p.unexpected
console.log(`unit+integration: ${v.numPassedTests} passed, ${v.numFailedTests} failed; browser: ${p.expected + p.flaky} passed, ${p.unexpected} failed`)
console.log(`${passed} passed, ${failed} failed`)
' "$report/vitest.json" "$report/e2e.json"

[ "$layers" -eq 0 ] && [ "$unit" -eq 0 ] && [ "$e2e" -eq 0 ]
