#!/usr/bin/env bash
# npm run bench: every benchmark in bench/*.bench.ts, printing medians. The benchmarks that need
# the running app (the editor drag in Chromium) get the same throw-away stack as npm test.
# Benchmarks report numbers; they never pass or fail on time.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/test-stack.sh"
cd "$PROJECT_ROOT"

stack_up
stack_app_up >/dev/null
say "benchmarks (medians on this machine: $(nproc) cores)"
npx tsx --conditions=react-server bench/run.ts "$@"
