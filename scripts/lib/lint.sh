#!/usr/bin/env bash
# The static checks of npm test, one after another: format (prettier), lint (eslint) and unused
# exports (knip). scripts/test.sh runs this in the background while the test stack starts and
# vitest runs (vitest uses one core; these use the other), and reads the log once vitest is done.
# Prints each stage with its time; exits non-zero with one "sealpitch:" line on the first failure.
#   lint.sh DONE_FILE: touches DONE_FILE when it ends, pass or fail (the build waits for it).
set -uo pipefail
source "$(dirname "$0")/common.sh"
cd "$PROJECT_ROOT"
trap '[ -n "${1:-}" ] && touch "$1"' EXIT

step() {
  local name="$1" hint="$2" t0
  shift 2
  t0=$(date +%s)
  say "$name"
  "$@" || die "$hint"
  say "$name: $(($(date +%s) - t0)) s"
}

step "format check (prettier)" "files are not formatted: run npm run format" \
  npx prettier --check . --log-level=warn
step "lint (eslint: Next, react-hooks, typescript-eslint, import boundaries)" "lint errors: see above (npm run lint)" \
  npm run --silent lint -- --quiet
step "unused exports (knip)" "unused exports: remove them, or drop the export keyword (npm run lint:exports)" \
  npm run --silent lint:exports
