#!/usr/bin/env bash
# npm test: typecheck, lint, format, unit, integration (real PostgreSQL), e2e
# (Debian's Chromium) and a seeded sample of the probe (scripts/probe), each set
# up from scratch, ending with one "N passed, N failed" line.
set -uo pipefail
source "$(dirname "$0")/lib/common.sh"
source "$(dirname "$0")/lib/postgres.sh"
source "$(dirname "$0")/lib/services.sh"
set -e

export GAITLOOM_ENV=test
APP_PORT="${GAITLOOM_TEST_PORT:-3100}"
REPORTS="$DATA_DIR/reports"
TEMPLATE_DB="gaitloom_test_template"
E2E_DB="gaitloom_test_e2e"
STARTED_AT=$(date +%s)

require_free_disk "$ROOT" 800
ensure_debian_packages postgresql chromium gcc libc6-dev
ensure_node_modules
trap 'services_stop_all; [ -n "$PG_STARTED_HERE" ] && pg_stop' EXIT
pg_start
rm -rf "$REPORTS" && mkdir -p "$REPORTS"

say "preparing the test template database"
pg_recreate_database "$TEMPLATE_DB"
(cd "$ROOT" && DATABASE_URL="$(pg_url "$TEMPLATE_DB")" npx tsx db/migrate.ts >/dev/null)
export GAITLOOM_TEST_ADMIN_URL="$(pg_url postgres)"
export GAITLOOM_TEST_TEMPLATE_DB="$TEMPLATE_DB"
export GAITLOOM_TEST_DATABASE_URL_PREFIX="$(pg_url gaitloom_test_w)"
services_start_fakes $((APP_PORT + 1)) $((APP_PORT + 2)) $((APP_PORT + 3))
set +e

say "typecheck (react-router typegen && tsc)"
(cd "$ROOT" && npx react-router typegen >/dev/null 2>&1 && npx tsc -p tsconfig.json) >"$REPORTS/typecheck.log" 2>&1
TYPECHECK_RC=$?
[ $TYPECHECK_RC -eq 0 ] && say "typecheck passed" || { cat "$REPORTS/typecheck.log"; warn "typecheck failed"; }

say "lint (eslint)"
(cd "$ROOT" && npx eslint --max-warnings=0 .) >"$REPORTS/lint.log" 2>&1
LINT_RC=$?
[ $LINT_RC -eq 0 ] && say "lint passed" || { cat "$REPORTS/lint.log"; warn "lint failed"; }

say "format (prettier --check)"
(cd "$ROOT" && npx prettier --check .) >"$REPORTS/format.log" 2>&1
FORMAT_RC=$?
[ $FORMAT_RC -eq 0 ] && say "format passed" || { cat "$REPORTS/format.log"; warn "format failed: npx prettier --write <file> fixes a file"; }

say "unit and integration tests (vitest)"
(cd "$ROOT" && npx vitest run --reporter=default --reporter=json --outputFile.json="$REPORTS/vitest.json")
VITEST_RC=$?

say "building the app for the browser tests"
E2E_RC=1
PROBE_RC=""
if (cd "$ROOT" && npx react-router build >"$REPORTS/build.log" 2>&1); then
  pg_recreate_database "$E2E_DB" "$TEMPLATE_DB"
  export DATABASE_URL="$(pg_url "$E2E_DB")"
  (cd "$ROOT" && npx tsx db/seed.ts >/dev/null)
  export PUBLIC_URL="http://127.0.0.1:$APP_PORT"
  export SESSION_SECRET="test-session-secret-$RANDOM$RANDOM"
  if port_in_use "$APP_PORT"; then
    warn "port $APP_PORT is taken; set GAITLOOM_TEST_PORT to a free one"
  else
    # Serve a copy, so a build started elsewhere meanwhile cannot swap the assets under the tests.
    # (The server finds its assets at build/client relative to its working folder.)
    SERVE_DIR="$DATA_DIR/test-serve-$APP_PORT"
    rm -rf "$SERVE_DIR" && mkdir -p "$SERVE_DIR" && cp -r "$ROOT/build" "$SERVE_DIR/build"
    # The job runner of the same build, delivering the browser tests' mail to the SMTP fake.
    services_start_job_runner test-jobs "$REPORTS/jobs.log" "$SERVE_DIR/build"
    ( service_wait_log test-jobs "$REPORTS/jobs.log" "$JOB_RUNNER_READY" ) || warn "the job runner did not start; the browser tests' mail stays queued"
    # The probe's switches (scripts/probe.sh), honoured for loopback requests only.
    service_start test-app "$REPORTS/app.log" env NODE_ENV=production HOST=127.0.0.1 PORT="$APP_PORT" \
      GAITLOOM_PROBE_COUNTS=1 GAITLOOM_RATE_LIMITS=off \
      bash -c 'cd "$1" && exec node "$2/server.js" build/server/index.js' serve "$SERVE_DIR" "$ROOT"
    ( service_wait_port test-app "$APP_PORT" "$REPORTS/app.log" ) && {
      say "browser tests (Playwright driving /usr/bin/chromium)"
      (cd "$ROOT" && GAITLOOM_E2E_URL="$PUBLIC_URL" PLAYWRIGHT_JSON_OUTPUT_NAME="$REPORTS/e2e.json" \
        npx playwright test -c e2e/playwright.config.ts --reporter=list,json)
      E2E_RC=$?
      # After the browser tests, as it writes to their database: 600 hostile requests from seed 1.
      say "probe sample (600 malformed and hostile requests across every route, seed 1)"
      (cd "$ROOT" && GAITLOOM_PROBE_SESSION_SECRET="$SESSION_SECRET" npx tsx scripts/probe/run.ts --url "$PUBLIC_URL" \
        --seed 1 --count 600 --seconds 90 --app-log "$REPORTS/app.log" --report "$REPORTS/probe.json") >"$REPORTS/probe.log" 2>&1
      PROBE_RC=$?
      [ $PROBE_RC -eq 0 ] && say "probe sample passed: $(tail -n 1 "$REPORTS/probe.log")" || { tail -n 80 "$REPORTS/probe.log"; warn "probe sample failed"; }
    }
  fi
else
  tail -n 30 "$REPORTS/build.log"
  warn "the build failed, so the browser tests did not run"
fi

services_stop_all
if [ -n "$PG_STARTED_HERE" ]; then pg_stop; PG_STARTED_HERE=""; fi
say "finished in $(( $(date +%s) - STARTED_AT )) s"
node "$ROOT/scripts/lib/summarize.mjs" "$REPORTS" "$TYPECHECK_RC" "$LINT_RC" "$FORMAT_RC" "$PROBE_RC"
SUMMARY_RC=$?
[ $TYPECHECK_RC -eq 0 ] && [ $LINT_RC -eq 0 ] && [ $FORMAT_RC -eq 0 ] && [ $VITEST_RC -eq 0 ] && [ $E2E_RC -eq 0 ] && [ "$PROBE_RC" = 0 ] && [ $SUMMARY_RC -eq 0 ]
