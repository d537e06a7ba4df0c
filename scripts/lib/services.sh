# Background services started by the scripts (the app, the local fakes), with
# pid files so a second run or a run after a crash finds its way.

SERVICES_STARTED=()

service_pid() { [ -f "$RUN_DIR/$1.pid" ] && cat "$RUN_DIR/$1.pid"; }

service_is_running() {
  local pid
  pid="$(service_pid "$1")" || return 1
  pid_alive "$pid"
}

# service_start NAME LOGFILE|- COMMAND...: "-" keeps the output on this terminal.
service_start() {
  local name="$1" log="$2"
  shift 2
  if service_is_running "$name"; then service_stop "$name"; fi
  rm -f "$RUN_DIR/$name.pid"
  # A session of its own: Ctrl-C reaches this script, which stops each service once.
  if [ "$log" = "-" ]; then
    (cd "$ROOT" && exec setsid "$@") &
  else
    (cd "$ROOT" && exec setsid "$@") >"$log" 2>&1 &
  fi
  echo $! >"$RUN_DIR/$name.pid"
  SERVICES_STARTED+=("$name")
}

service_stop() {
  local name="$1" pid i
  pid="$(service_pid "$name")" || return 0
  if pid_alive "$pid"; then
    kill -TERM "$pid" 2>/dev/null || true
    for i in $(seq 1 50); do pid_alive "$pid" || break; sleep 0.1; done
    kill -KILL "$pid" 2>/dev/null || true
  fi
  rm -f "$RUN_DIR/$name.pid"
}

services_stop_all() {
  local name
  for name in "${SERVICES_STARTED[@]+"${SERVICES_STARTED[@]}"}"; do service_stop "$name"; done
  SERVICES_STARTED=()
}

# Waits until NAME listens on 127.0.0.1:PORT; fails with its log when it dies first.
service_wait_port() {
  local name="$1" port="$2" log="${3:-}" i
  for i in $(seq 1 300); do
    port_in_use "$port" && return 0
    if ! service_is_running "$name"; then
      die "$name stopped before it listened on 127.0.0.1:$port." ${log:+"Last lines of $log:" "$(tail -n 20 "$log")"}
    fi
    sleep 0.2
  done
  die "$name did not listen on 127.0.0.1:$port within 60 s." ${log:+"Last lines of $log:" "$(tail -n 20 "$log")"}
}

# The local fakes of hosted services, and the settings that point the app at them.
# services_start_fakes GITHUB_PORT SMTP_PORT MAIL_API_PORT
services_start_fakes() {
  local github_port="$1" smtp_port="$2" mail_port="$3" port
  for port in "$github_port" "$smtp_port" "$mail_port"; do
    port_in_use "$port" && die "Port $port on 127.0.0.1 is taken; the local fakes need it." \
      "Stop the program using it (an earlier run?), or change GAITLOOM_FAKE_PORT_BASE."
  done
  export GITHUB_CLIENT_ID="gaitloom-local" GITHUB_CLIENT_SECRET="gaitloom-local-secret"
  export GITHUB_OAUTH_URL="http://127.0.0.1:$github_port" GITHUB_API_URL="http://127.0.0.1:$github_port"
  export SMTP_URL="smtp://127.0.0.1:$smtp_port" MAIL_INBOX_URL="http://127.0.0.1:$mail_port"
  service_start fake-github "$LOG_DIR/fake-github.log" node_modules/.bin/tsx scripts/fakes/github.ts \
    --port "$github_port" --client-id "$GITHUB_CLIENT_ID" --client-secret "$GITHUB_CLIENT_SECRET"
  service_start fake-smtp "$LOG_DIR/fake-smtp.log" node_modules/.bin/tsx scripts/fakes/smtp.ts \
    --smtp-port "$smtp_port" --api-port "$mail_port"
  service_wait_port fake-github "$github_port" "$LOG_DIR/fake-github.log"
  service_wait_port fake-smtp "$mail_port" "$LOG_DIR/fake-smtp.log"
}

# Waits until NAME's LOGFILE holds a line matching PATTERN (grep -E); fails with the log when it dies first.
service_wait_log() {
  local name="$1" log="$2" pattern="$3" i
  for i in $(seq 1 300); do
    grep -qE "$pattern" "$log" 2>/dev/null && return 0
    service_is_running "$name" || die "$name stopped before it was ready." "Last lines of $log:" "$(tail -n 20 "$log")"
    sleep 0.2
  done
  die "$name was not ready within 60 s." "Last lines of $log:" "$(tail -n 20 "$log")"
}

# The job runner (app/jobs): delivers the mail outbox and works the other
# queues, on $DATABASE_URL, mailing through $SMTP_URL. From a build when one is
# given (its folder holding server/job-runner.js), else from the source with
# tsx. Wait for it with: service_wait_log NAME LOGFILE "$JOB_RUNNER_READY"
# services_start_job_runner NAME LOGFILE [BUILD_DIR]
JOB_RUNNER_READY='^\[jobs\] ready'
services_start_job_runner() {
  local name="$1" log="$2" build="${3:-}"
  # Emptied first: the ready line of an earlier run must not count.
  : >"$log"
  if [ -n "$build" ]; then
    service_start "$name" "$log" node "$build/server/job-runner.js"
  else
    # tsx's loader in the one process: the tsx command would SIGKILL it when slow to confirm a SIGTERM.
    service_start "$name" "$log" node --import tsx app/jobs/job-runner.ts
  fi
}

# A session secret of this checkout's own, made once and kept in .data.
local_session_secret() {
  local file="$DATA_DIR/session-secret"
  [ -s "$file" ] || { head -c 32 /dev/urandom | od -An -tx1 | tr -d ' \n' >"$file"; chmod 600 "$file"; }
  cat "$file"
}
