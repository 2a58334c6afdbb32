#!/usr/bin/env bash
# npm test: every test, on a fresh machine. A throw-away PostgreSQL (never the demo data) and a
# fake SMTP server on their own ports, vitest (unit + integration against the real database),
# a production build, and the Playwright browser tests in Debian's chromium. Prints the counts
# as "N passed, N failed" and exits non-zero on any failure.
#   VITEST_ARGS / PW_ARGS narrow a run while working on one area; SEALPITCH_SKIP_E2E=1 skips the
#   build and the browser tests; SEALPITCH_TEST_OFFSET=N shifts the ports. CI sets none of them.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/test-stack.sh"
cd "$PROJECT_ROOT"
STARTED_AT=$(date +%s)

ensure_node_modules
ensure_fe_tools
say "format check (prettier)"
npx prettier --check . --log-level=warn || die "files are not formatted: run npm run format"
say "lint (eslint: Next, react-hooks, typescript-eslint, import boundaries)"
npm run --silent lint -- --quiet || die "lint errors: see above (npm run lint)"
say "unused exports (knip)"
npm run --silent lint:exports || die "unused exports: remove them, or drop the export keyword (npm run lint:exports)"

stack_up

say "unit and integration tests (vitest)"
set +e
NODE_ENV=test LOG_LEVEL="${VITEST_LOG_LEVEL:-warn}" npx vitest run ${VITEST_ARGS:-} --reporter=default --reporter=json --outputFile.json="$REPORTS/vitest.json"
VITEST_CODE=$?
set -e

if [ "${SEALPITCH_SKIP_E2E:-}" = 1 ]; then
  node scripts/lib/summarize-tests.mjs "$REPORTS/vitest.json" --vitest-only || true
  exit "$VITEST_CODE"
fi

stack_app_up

say "browser tests (playwright, Debian chromium)"
set +e
PLAYWRIGHT_JSON_OUTPUT_NAME="$REPORTS/playwright.json" npx playwright test ${PW_ARGS:-} --reporter=list,json
PW_CODE=$?
[ "$PW_CODE" = 0 ] || { echo "--- app log (last 40 lines)"; tail -40 "$WORK/app.log"; }
node scripts/lib/summarize-tests.mjs "$REPORTS/vitest.json" "$REPORTS/playwright.json"
SUMMARY_CODE=$?
set -e
echo "npm test took $(( $(date +%s) - STARTED_AT )) s"
[ "$VITEST_CODE" = 0 ] && [ "$PW_CODE" = 0 ] && [ "$SUMMARY_CODE" = 0 ]
