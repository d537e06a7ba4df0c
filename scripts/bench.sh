#!/usr/bin/env bash
# npm run bench: the pure benchmarks, then the HTTP ones against the built app
# on loopback with its own database. Not part of npm test.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/postgres.sh"
source "$(dirname "$0")/lib/services.sh"

export GAITLOOM_ENV=test
APP_PORT="${GAITLOOM_BENCH_PORT:-3200}"
# A second app on the next port runs the heavy work on its request thread, for comparison.
NO_POOL_PORT=$((APP_PORT + 1))
ensure_node_modules
trap 'services_stop_all; [ -n "$PG_STARTED_HERE" ] && pg_stop' EXIT
pg_start
pg_recreate_database gaitloom_bench
export DATABASE_URL="$(pg_url gaitloom_bench)"
(cd "$ROOT" && npx tsx db/migrate.ts >/dev/null && npx tsx db/seed.ts >/dev/null)
(cd "$ROOT" && npx react-router build >"$LOG_DIR/bench-build.log" 2>&1) || die "The build failed." "$(tail -n 20 "$LOG_DIR/bench-build.log")"
export PUBLIC_URL="http://127.0.0.1:$APP_PORT" SESSION_SECRET="bench-$RANDOM$RANDOM" GAITLOOM_TOKEN_REQUESTS_PER_MINUTE=100000
export SMTP_URL="smtp://127.0.0.1:9" # nothing is mailed during the benchmarks
service_start bench-app "$LOG_DIR/bench-app.log" env NODE_ENV=production HOST=127.0.0.1 PORT="$APP_PORT" \
  node server.js build/server/index.js
service_start bench-app-no-pool "$LOG_DIR/bench-app-no-pool.log" env NODE_ENV=production HOST=127.0.0.1 PORT="$NO_POOL_PORT" GAITLOOM_SOLVE_POOL=off \
  node server.js build/server/index.js
service_wait_port bench-app "$APP_PORT" "$LOG_DIR/bench-app.log"
service_wait_port bench-app-no-pool "$NO_POOL_PORT" "$LOG_DIR/bench-app-no-pool.log"
export GAITLOOM_BENCH_URL="$PUBLIC_URL" GAITLOOM_BENCH_APP_PID="$(service_pid bench-app)"
export GAITLOOM_BENCH_NO_POOL_URL="http://127.0.0.1:$NO_POOL_PORT"
GAITLOOM_BENCH_TOKEN="$(cd "$ROOT" && npx tsx scripts/bench/make-token.ts)"
export GAITLOOM_BENCH_TOKEN
(cd "$ROOT" && npx tsx scripts/bench/run.ts)
