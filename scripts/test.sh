#!/usr/bin/env bash
# npm test: every test, on a fresh machine. A throw-away PostgreSQL (never the demo data) and a
# fake SMTP server on their own ports, vitest (unit + integration against the real database),
# a production build, and the Playwright browser tests in Debian's chromium. Prints the counts
# as "N passed, N failed" and exits non-zero on any failure.
#   VITEST_ARGS / PW_ARGS narrow a run while working on one area; SEALPITCH_SKIP_E2E=1 skips the
#   build and the browser tests; SEALPITCH_TEST_OFFSET=N shifts the ports. CI sets none of them.
# Two lanes keep both cores busy: the static checks (scripts/lib/lint.sh) and then the production
# build run in the background while the stack starts and vitest runs its files one after another.
# A failed check still fails the run, before the browser tests start.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/test-stack.sh"
cd "$PROJECT_ROOT"
STARTED_AT=$(date +%s)
elapsed() { echo "$(($(date +%s) - STARTED_AT)) s"; }

ensure_node_modules
ensure_fe_tools
stack_workdir
say "static checks (prettier, eslint, knip) in the background: $WORK/lint.log"
setsid bash scripts/lib/lint.sh "$WORK/lint.done" >"$WORK/lint.log" 2>&1 &
LINT_PID=$!

stack_up
say "test stack up at $(elapsed)"
[ "${SEALPITCH_SKIP_E2E:-}" = 1 ] || stack_build_start "$WORK/lint.done"

say "unit and integration tests (vitest)"
set +e
NODE_ENV=test LOG_LEVEL="${VITEST_LOG_LEVEL:-warn}" npx vitest run ${VITEST_ARGS:-} --reporter=default --reporter=json --outputFile.json="$REPORTS/vitest.json"
VITEST_CODE=$?
set -e
say "vitest done at $(elapsed)"

LINT_CODE=0
wait "$LINT_PID" || LINT_CODE=$?
LINT_PID=""
cat "$WORK/lint.log"
[ "$LINT_CODE" = 0 ] || die "the static checks failed (see above)"

if [ "${SEALPITCH_SKIP_E2E:-}" = 1 ]; then
  node scripts/lib/summarize-tests.mjs "$REPORTS/vitest.json" --vitest-only || true
  exit "$VITEST_CODE"
fi

stack_app_up
say "app up at $(elapsed)"

say "browser tests (playwright, Debian chromium)"
set +e
PLAYWRIGHT_JSON_OUTPUT_NAME="$REPORTS/playwright.json" npx playwright test ${PW_ARGS:-} --reporter=list,json
PW_CODE=$?
[ "$PW_CODE" = 0 ] || { echo "--- app log (last 40 lines)"; tail -40 "$WORK/app.log"; }
node scripts/lib/summarize-tests.mjs "$REPORTS/vitest.json" "$REPORTS/playwright.json"
SUMMARY_CODE=$?
set -e
echo "npm test took $(elapsed)"
[ "$VITEST_CODE" = 0 ] && [ "$PW_CODE" = 0 ] && [ "$SUMMARY_CODE" = 0 ]
