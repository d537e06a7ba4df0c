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
