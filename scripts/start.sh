#!/usr/bin/env bash
# `npm start`: everything Sheetsmith needs on one machine, then the API server (which also serves the web
# app) and a worker.
#
#   npm start                 run in the foreground; Ctrl-C stops the server and the worker
#   npm start -- --detach     run in the background (pids and logs under .data/), then return
#   npm start -- --stop       stop a detached run
#
# Steps, each skipped when already done: npm packages, PostgreSQL (Debian's packages, a private cluster on
# 127.0.0.1:54329), migrations, demo data (only into an empty database), the web build (only when its sources
# changed), then the processes: the local services (scripts/local-services.ts: mail catcher on 8471/8472,
# payment fake on 8473, s3rver on 8474 when STORAGE=s3), the API server and a worker. Settings: PORT (8470),
# HOST (127.0.0.1), SESSION_SECRET, LOG_LEVEL, STORAGE (disk or s3), and DATABASE_URL (when set, that database
# is used and no local cluster is started), SHEETSMITH_PGDATA and SHEETSMITH_PGPORT (the local cluster's
# directory and port, see scripts/postgres.sh). SMTP_URL and PAY_API_URL, when set, point at real services and
# the local stand-in for each is not used.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/setup.sh

PORT="${PORT:-8470}"
HOST="${HOST:-127.0.0.1}"
URL="http://$HOST:$PORT"
RUN_DIR=.data/run
LOG_DIR=.data/logs
mode=foreground
case "${1:-}" in
  --detach) mode=detach ;;
  --stop) mode=stop ;;
  "") ;;
  *) echo "start: unknown option '$1' (use --detach or --stop)" >&2; exit 2 ;;
esac

stop_detached() {
  local name pid stopped=0
  for name in api worker services; do
    [ -f "$RUN_DIR/$name.pid" ] || continue
    pid=$(cat "$RUN_DIR/$name.pid")
    if kill -0 "$pid" 2>/dev/null; then kill -TERM "$pid" && stopped=1; fi
    rm -f "$RUN_DIR/$name.pid"
  done
  if [ "$stopped" = 1 ]; then echo "start: stopped the detached server, worker and local services"; else echo "start: nothing was running"; fi
}

if [ "$mode" = stop ]; then stop_detached; exit 0; fi

api_answers() {
  node -e "fetch('$URL/api/health').then(r => r.json()).then(j => process.exit(j.status === 'ok' ? 0 : 1), () => process.exit(1))" 2>/dev/null
}

print_welcome() {
  echo
  echo "Sheetsmith is running at $URL"
  sed -n '/^Demo sign-ins/,$p' <<<"$db_report"
  if [ -n "${MAIL_CATCHER_URL:-}" ]; then echo "Caught e-mail: $MAIL_CATCHER_URL/messages (or the admin Mail page)"; fi
  if [ "$local_pay" = 1 ]; then echo "Payment fake: $PAY_API_URL (checkout pages there; events go to $URL/api/pay/webhook)"; fi
  if [ "${STORAGE:-disk}" = s3 ]; then echo "Files: S3-compatible store at $S3_ENDPOINT, bucket $S3_BUCKET"; fi
  echo "Logs: $LOG_DIR/api.log, $LOG_DIR/worker.log and $LOG_DIR/local-services.log"
}

# The local stand-ins and the settings that point the API and the worker at them.
configure_local_services() {
  ensure_local_secrets
  if [ -z "${SMTP_URL:-}" ]; then
    export SMTP_URL="smtp://127.0.0.1:${LOCAL_SMTP_PORT:-8471}"
    export MAIL_CATCHER_URL="${MAIL_CATCHER_URL:-http://127.0.0.1:${LOCAL_MAIL_HTTP_PORT:-8472}}"
  fi
  local_pay=0
  if [ -z "${PAY_API_URL:-}" ]; then
    export PAY_API_URL="http://127.0.0.1:${LOCAL_PAY_PORT:-8473}"
    local_pay=1
  fi
  if [ "${STORAGE:-disk}" = s3 ] && [ -z "${S3_ENDPOINT:-}" ]; then
    export S3_ENDPOINT="http://127.0.0.1:${LOCAL_S3_PORT:-8474}" S3_BUCKET="${S3_BUCKET:-sheetsmith}"
    export S3_ACCESS_KEY_ID="${S3_ACCESS_KEY_ID:-S3RVER}" S3_SECRET_ACCESS_KEY="${S3_SECRET_ACCESS_KEY:-S3RVER}"
  fi
  export STORAGE="${STORAGE:-disk}"
}

# Starts scripts/local-services.ts in the background and waits (up to 30 s) until it reports ready.
start_local_services() {
  local state=.data/run/local-services.json
  rm -f "$state"
  services_log_from=1
  [ -f "$LOG_DIR/local-services.log" ] && services_log_from=$(( $(wc -l < "$LOG_DIR/local-services.log") + 1 ))
  node --import tsx scripts/local-services.ts >>"$LOG_DIR/local-services.log" 2>&1 &
  services_pid=$!
  for _ in $(seq 1 120); do
    [ -s "$state" ] && return 0
    if ! kill -0 "$services_pid" 2>/dev/null; then
      echo "start: the local services stopped during start-up; the end of $LOG_DIR/local-services.log says:" >&2
      tail -n 20 "$LOG_DIR/local-services.log" >&2
      return 1
    fi
    sleep 0.25
  done
  echo "start: the local services did not report ready within 30 s; see $LOG_DIR/local-services.log" >&2
  return 1
}

ensure_node_deps
if [ -n "${DATABASE_URL:-}" ]; then
  echo "start: using DATABASE_URL from the environment; not starting the local PostgreSQL cluster" >&2
else
  bash scripts/postgres.sh sheetsmith
  DATABASE_URL="postgres://postgres@127.0.0.1:${SHEETSMITH_PGPORT:-54329}/sheetsmith"
fi
export DATABASE_URL
db_report=$(node --import tsx db/seed.ts --migrate --print-sign-ins)
sed '/^Demo sign-ins/,$d' <<<"$db_report"
ensure_session_secret
configure_local_services
ensure_web_build || echo "start: continuing without a fresh web build" >&2

if api_answers; then
  echo "start: Sheetsmith already answers at $URL (stop it with Ctrl-C in its terminal, or npm start -- --stop)"
  print_welcome
  exit 0
fi

mkdir -p "$RUN_DIR" "$LOG_DIR"
export PORT HOST
if ! start_local_services; then
  kill -TERM "$services_pid" 2>/dev/null || true
  exit 1
fi
tail -n +"$services_log_from" "$LOG_DIR/local-services.log" | grep 'WARNING' | sed 's/^.*local-services: /start: /' >&2 || true
node --import tsx server/index.ts >>"$LOG_DIR/api.log" 2>&1 &
api_pid=$!
node --import tsx server/worker.ts >>"$LOG_DIR/worker.log" 2>&1 &
worker_pid=$!

for _ in $(seq 1 120); do
  api_answers && break
  if ! kill -0 "$api_pid" 2>/dev/null; then
    echo "start: the API server stopped during start-up; the end of $LOG_DIR/api.log says:" >&2
    tail -n 20 "$LOG_DIR/api.log" >&2
    kill -TERM "$worker_pid" "$services_pid" 2>/dev/null || true
    exit 1
  fi
  sleep 0.25
done
if ! api_answers; then
  echo "start: the API server did not answer at $URL within 30 s; see $LOG_DIR/api.log" >&2
  kill -TERM "$api_pid" "$worker_pid" "$services_pid" 2>/dev/null || true
  exit 1
fi

if [ "$mode" = detach ]; then
  echo "$api_pid" > "$RUN_DIR/api.pid"
  echo "$worker_pid" > "$RUN_DIR/worker.pid"
  echo "$services_pid" > "$RUN_DIR/services.pid"
  print_welcome
  echo "Running in the background; stop with: npm start -- --stop"
  exit 0
fi

shutdown() {
  trap - INT TERM
  echo
  echo "start: stopping the server, the worker and the local services"
  kill -TERM "$api_pid" "$worker_pid" 2>/dev/null || true
  wait "$api_pid" "$worker_pid" 2>/dev/null || true
  kill -TERM "$services_pid" 2>/dev/null || true
  wait "$services_pid" 2>/dev/null || true
  exit 0
}
trap shutdown INT TERM
print_welcome
echo "Press Ctrl-C to stop."
set +e
wait -n "$api_pid" "$worker_pid" "$services_pid"
status=$?
echo "start: a process stopped unexpectedly (exit $status); see $LOG_DIR/" >&2
kill -TERM "$api_pid" "$worker_pid" "$services_pid" 2>/dev/null
wait
exit 1
