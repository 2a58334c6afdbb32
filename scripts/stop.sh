#!/usr/bin/env bash
# npm run stop: stops what `npm start` started (the app, the fake SMTP server, PostgreSQL).
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
RUN_DIR="$PROJECT_ROOT/.data/run"
for name in app smtp; do
  if [ -f "$RUN_DIR/$name.pid" ]; then stop_group "$(cat "$RUN_DIR/$name.pid")"; rm -f "$RUN_DIR/$name.pid"; fi
done
if [ -f "$RUN_DIR/pg-data-dir" ]; then
  sleep 1
  pg_stop "$(cat "$RUN_DIR/pg-data-dir")"
fi
say "stopped; the data is kept"
