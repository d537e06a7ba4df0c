#!/usr/bin/env bash
# npm run probe: thousands of malformed and hostile requests across every
# route, counting per route how many reached its loader or action and how
# each was answered; fails on any 5xx and on any route never reached.
#
# Against an app already running on loopback: GAITLOOM_PROBE_URL=http://127.0.0.1:3000
# (started with GAITLOOM_PROBE_COUNTS=1 GAITLOOM_RATE_LIMITS=off, and the local
# GitHub stand-in to sign in through). Otherwise it starts its own: a build of
# this tree on 127.0.0.1:$GAITLOOM_PROBE_PORT (3300) with a database of its own
# in the project-local cluster and the local fakes on the next three ports
# (or from $GAITLOOM_PROBE_FAKE_PORT_BASE), and two more app processes with
# the rate limits on (ports + 4 and + 5) for the limit they share. Arguments go to scripts/probe/run.ts:
# --seed N, --count N (requests), --seconds N (wall-clock cap), --concurrency N.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"

if [ -n "${GAITLOOM_PROBE_URL:-}" ]; then
  ensure_node_modules
  cd "$ROOT" && exec npx tsx scripts/probe/run.ts --url "$GAITLOOM_PROBE_URL" "$@"
fi

source "$(dirname "$0")/lib/postgres.sh"
source "$(dirname "$0")/lib/services.sh"

export GAITLOOM_ENV=test
APP_PORT="${GAITLOOM_PROBE_PORT:-3300}"
FAKE_BASE="${GAITLOOM_PROBE_FAKE_PORT_BASE:-$((APP_PORT + 1))}"
DATABASE="gaitloom_probe_$APP_PORT"
# Pid files and logs of its own, so a probe beside npm test or npm run bench
# stops only what it started.
RUN_DIR="$DATA_DIR/run/probe-$APP_PORT"
LOG_DIR="$DATA_DIR/logs/probe-$APP_PORT"
SERVE_DIR="$DATA_DIR/probe-serve-$APP_PORT"
mkdir -p "$RUN_DIR" "$LOG_DIR"

port_in_use "$APP_PORT" && die "Port $APP_PORT on 127.0.0.1 is taken; choose another: GAITLOOM_PROBE_PORT=3310 npm run probe"
ensure_node_modules
trap 'services_stop_all; [ -n "$PG_STARTED_HERE" ] && pg_stop' EXIT
pg_start
pg_recreate_database "$DATABASE"
export DATABASE_URL="$(pg_url "$DATABASE")"
(cd "$ROOT" && npx tsx db/migrate.ts >/dev/null && npx tsx db/seed.ts >/dev/null)

say "building the app"
(cd "$ROOT" && npx react-router build >"$LOG_DIR/build.log" 2>&1) || die "The build failed." "$(tail -n 20 "$LOG_DIR/build.log")"
# Serve a copy, so a build started elsewhere meanwhile cannot swap the assets
# under the probe (the server finds them at build/ in its working folder).
rm -rf "$SERVE_DIR" && mkdir -p "$SERVE_DIR" && cp -r "$ROOT/build" "$SERVE_DIR/build"

services_start_fakes "$FAKE_BASE" $((FAKE_BASE + 1)) $((FAKE_BASE + 2))
export PUBLIC_URL="http://127.0.0.1:$APP_PORT" SESSION_SECRET="probe-$RANDOM$RANDOM"
services_start_job_runner probe-jobs "$LOG_DIR/jobs.log" "$SERVE_DIR/build"
service_wait_log probe-jobs "$LOG_DIR/jobs.log" "$JOB_RUNNER_READY"
service_start probe-app "$LOG_DIR/app.log" env NODE_ENV=production HOST=127.0.0.1 PORT="$APP_PORT" \
  GAITLOOM_PROBE_COUNTS=1 GAITLOOM_RATE_LIMITS=off \
  bash -c 'cd "$1" && exec node "$2/server.js" build/server/index.js' serve "$SERVE_DIR" "$ROOT"
service_wait_port probe-app "$APP_PORT" "$LOG_DIR/app.log"
# Two more processes on the same database with the rate limits on: one token's
# calls spread over both must meet one allowance (decision 009).
LIMITED_APPS=""
for port in $((APP_PORT + 4)) $((APP_PORT + 5)); do
  port_in_use "$port" && die "Port $port on 127.0.0.1 is taken (the probe's rate-limited apps use GAITLOOM_PROBE_PORT + 4 and + 5)."
  service_start "probe-limited-$port" "$LOG_DIR/limited-$port.log" env NODE_ENV=production HOST=127.0.0.1 PORT="$port" \
    bash -c 'cd "$1" && exec node "$2/server.js" build/server/index.js' serve "$SERVE_DIR" "$ROOT"
  service_wait_port "probe-limited-$port" "$port" "$LOG_DIR/limited-$port.log"
  LIMITED_APPS="${LIMITED_APPS:+$LIMITED_APPS,}http://127.0.0.1:$port"
done

say "probing $PUBLIC_URL (the app's log: $LOG_DIR/app.log)"
(cd "$ROOT" && GAITLOOM_PROBE_SESSION_SECRET="$SESSION_SECRET" npx tsx scripts/probe/run.ts --url "$PUBLIC_URL" \
  --app-log "$LOG_DIR/app.log" --report "$LOG_DIR/report.json" --limited-apps "$LIMITED_APPS" "$@")
