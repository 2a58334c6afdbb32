#!/usr/bin/env bash
# npm run bench [-- section …] [--no-write]: the benchmarks in bench/*.bench.ts (all, or those whose
# file name contains one of the words), printing medians and writing them into README.md's
# performance table (bench/run.ts; --no-write or BENCH_WRITE=0 leaves the README alone).
# The sections that need the app (the editor drag in Chromium, the HTTP load, the route sizes of
# the production build) get the same throw-away stack as npm test; the others need no build.
# Benchmarks report numbers; they never pass or fail on time.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/test-stack.sh"
cd "$PROJECT_ROOT"

APP_SECTIONS="editor-drag http-load route-size"
words=()
for a in "$@"; do case "$a" in --*) ;; *) words+=("$a") ;; esac; done
needs_app="" needs_fe=""
for f in bench/*.bench.ts; do
  name="$(basename "$f" .bench.ts)" picked=""
  if [ "${#words[@]}" = 0 ]; then picked=1; fi
  for w in "${words[@]}"; do case "$name" in *"$w"*) picked=1 ;; esac; done
  [ -n "$picked" ] || continue
  case " $APP_SECTIONS " in *" $name "*) needs_app=1 ;; esac
  [ "$name" = fe-check ] && needs_fe=1
done

# The app as npm start runs it: one web worker per core (scripts/serve.ts), unless WEB_WORKERS is set.
export WEB_WORKERS="${WEB_WORKERS:-$(nproc)}"
[ -z "$needs_fe" ] || ensure_fe_tools
stack_up
[ -z "$needs_app" ] || stack_app_up >/dev/null
say "benchmarks (medians on this machine: $(nproc) cores)"
npx tsx --conditions=react-server bench/run.ts "$@"
