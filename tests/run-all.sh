#!/usr/bin/env bash
# The whole test suite on a fresh machine: browser, build, unit, integration and browser tests.
# Called by `npm run test:all` (README) and so by .ci/run.
set -euo pipefail
cd "$(dirname "$0")/.."

if ! command -v chromium >/dev/null 2>&1; then
  echo "== installing Debian's chromium for the browser tests"
  if [ "$(id -u)" = "0" ]; then
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  fi
fi

echo "== typecheck"
npx tsc --noEmit -p tsconfig.json

echo "== lint"
npx eslint . --max-warnings=0

echo "== production build (the browser tests run against it)"
npx next build

echo "== tests"
mkdir -p data
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json=data/test-results.json || status=$?
# One plain closing line, whatever the runner printed above it.
node -e '
const r = require("./data/test-results.json");
const skipped = r.numPendingTests + r.numTodoTests;
console.log(`\n${r.numPassedTests} passed, ${r.numFailedTests} failed` + (skipped ? `, ${skipped} skipped` : ""));
' || true
exit "$status"
