#!/usr/bin/env bash
# npm start: everything from a clean clone to a running app on http://127.0.0.1:3000.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/postgres.sh"
source "$(dirname "$0")/lib/services.sh"

APP_PORT="${GAITLOOM_PORT:-3000}"
export GAITLOOM_ENV=local

require_free_disk "$ROOT" 500
if port_in_use "$APP_PORT"; then
  if service_is_running app; then
    die "Gaitloom is already running at http://127.0.0.1:$APP_PORT (process $(cat "$RUN_DIR/app.pid"))." \
      "Stop it with Ctrl-C in its terminal, or: kill $(cat "$RUN_DIR/app.pid")"
  fi
  die "Port $APP_PORT on 127.0.0.1 is taken by another program." "Stop it, or pick another port: GAITLOOM_PORT=3005 npm start"
fi

ensure_node_modules
trap 'services_stop_all; [ -n "$PG_STARTED_HERE" ] && pg_stop; exit 0' INT TERM
trap 'services_stop_all; [ -n "$PG_STARTED_HERE" ] && pg_stop' EXIT
pg_start
pg_create_database gaitloom_dev
export DATABASE_URL="$(pg_url gaitloom_dev)"

say "migrating and seeding the demo"
(cd "$ROOT" && npx tsx db/migrate.ts >/dev/null && npx tsx db/seed.ts)

FAKE_BASE="${GAITLOOM_FAKE_PORT_BASE:-3001}"
services_start_fakes "$FAKE_BASE" 2525 2526
export SESSION_SECRET="$(local_session_secret)"
say "building the app"
(cd "$ROOT" && npx react-router build >"$LOG_DIR/build.log" 2>&1) || die "The build failed." "$(tail -n 20 "$LOG_DIR/build.log")"

export PUBLIC_URL="http://127.0.0.1:$APP_PORT"
services_start_job_runner jobs "$LOG_DIR/jobs.log" "$ROOT/build"
service_wait_log jobs "$LOG_DIR/jobs.log" "$JOB_RUNNER_READY"
service_start app - env NODE_ENV=production HOST=127.0.0.1 PORT="$APP_PORT" node server.js build/server/index.js
service_wait_port app "$APP_PORT"
say "Gaitloom is running: $PUBLIC_URL  (Ctrl-C stops the app and its database)"
say "sign in as a demo person through the local GitHub stand-in; mail the app sends is at $PUBLIC_URL/local/mail (for the owner, Ines Okafor)"
say "the job runner sends it (its log: $LOG_DIR/jobs.log)"
wait "$(cat "$RUN_DIR/app.pid")" || true
