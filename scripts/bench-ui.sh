#!/usr/bin/env bash
# npm run bench:ui: the editor's scrub speed in Debian's Chromium, against the
# built app on loopback with its own database and the local GitHub stand-in
# for signing in. Not part of npm test. GAITLOOM_BENCH_UI_KEEP=1 leaves the
# app running afterwards (for a look in a browser); Ctrl-C stops it.
set -euo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/postgres.sh"
source "$(dirname "$0")/lib/services.sh"

# Pid files of our own: other runs in this checkout start services under the same names.
RUN_DIR="$DATA_DIR/run/bench-ui"
mkdir -p "$RUN_DIR"
export GAITLOOM_ENV=test
APP_PORT="${GAITLOOM_BENCH_UI_PORT:-3350}"
FAKE_BASE="${GAITLOOM_BENCH_UI_FAKE_PORT:-3351}"
# The server finds its client assets at ./build/client from its working directory: it runs in here.
APP_DIR="$DATA_DIR/bench-ui"
ensure_debian_packages chromium
ensure_node_modules
trap 'services_stop_all; [ -n "$PG_STARTED_HERE" ] && pg_stop' EXIT
port_in_use "$APP_PORT" && die "Port $APP_PORT on 127.0.0.1 is taken." "Set GAITLOOM_BENCH_UI_PORT to a free one."
pg_start
pg_recreate_database gaitloom_bench_ui
export DATABASE_URL="$(pg_url gaitloom_bench_ui)"
(cd "$ROOT" && npx tsx db/migrate.ts >/dev/null && npx tsx db/seed.ts >/dev/null)
say "building the app"
(cd "$ROOT" && npx react-router build >"$LOG_DIR/bench-ui-build.log" 2>&1) || die "The build failed." "$(tail -n 20 "$LOG_DIR/bench-ui-build.log")"
# A copy of our own: another run's build must not swap the assets under the running app.
rm -rf "$APP_DIR" && mkdir -p "$APP_DIR" && cp -r "$ROOT/build" "$APP_DIR/build"
services_start_fakes "$FAKE_BASE" "$((FAKE_BASE + 1))" "$((FAKE_BASE + 2))"
export PUBLIC_URL="http://127.0.0.1:$APP_PORT" SESSION_SECRET="bench-ui-$RANDOM$RANDOM"
service_start bench-ui-app "$LOG_DIR/bench-ui-app.log" env -C "$APP_DIR" NODE_ENV=production HOST=127.0.0.1 PORT="$APP_PORT" \
  node "$ROOT/server.js" build/server/index.js
service_wait_port bench-ui-app "$APP_PORT" "$LOG_DIR/bench-ui-app.log"
BENCH_RC=0
(cd "$ROOT" && GAITLOOM_BENCH_URL="$PUBLIC_URL" npx tsx scripts/bench/ui.ts) || BENCH_RC=$?
if [ -n "${GAITLOOM_BENCH_UI_KEEP:-}" ]; then
  say "the app stays up at $PUBLIC_URL (Ctrl-C stops it)"
  wait "$(cat "$RUN_DIR/bench-ui-app.pid")" || true
fi
exit "$BENCH_RC"
