#!/usr/bin/env bash
# Gyrolux's local object store: s3rver (an S3-compatible fake) on 127.0.0.1 with its own folder,
# the stand-in for S3 in development, the demo and tests. Every command is idempotent.
#
#   bash scripts/s3.sh start    start in the background unless already running; creates the bucket
#   bash scripts/s3.sh stop     stop the server this folder's pid file names (no-op when not running)
#   bash scripts/s3.sh status   exit 0 when running, 3 when not
#
# Env: GYROLUX_S3_PORT (4568), GYROLUX_S3_DIR (/tmp/gyrolux-s3-$PORT), GYROLUX_S3_BUCKET
#      (gyrolux-measurements). The fake accepts the key pair S3RVER / S3RVER, the app's default.
set -euo pipefail
# Variables of the checkout's .env that the environment does not set (one loader for every program).
source "$(dirname "${BASH_SOURCE[0]}")/../scripts/env.sh"
cd "$(dirname "$0")/.."

PORT="${GYROLUX_S3_PORT:-4568}"
DIR="${GYROLUX_S3_DIR:-/tmp/gyrolux-s3-$PORT}"
BUCKET="${GYROLUX_S3_BUCKET:-gyrolux-measurements}"
PID_FILE="$DIR.pid"
LOG_FILE="$DIR.log"

log() { echo "[s3.sh] $*" >&2; }
die() { log "error: $*"; exit 1; }

[[ "$PORT" =~ ^[0-9]+$ ]] || die "GYROLUX_S3_PORT must be a number (got '$PORT')"

running() {
  [[ -f "$PID_FILE" ]] && kill -0 "$(cat "$PID_FILE")" 2>/dev/null
}

listening() {
  node -e 'const s=require("node:net").connect(Number(process.argv[1]),"127.0.0.1");s.on("connect",()=>process.exit(0));s.on("error",()=>process.exit(1))' "$PORT"
}

cmd_start() {
  if running; then
    log "already running on 127.0.0.1:$PORT ($DIR)"
    return 0
  fi
  if listening; then die "port $PORT is taken by another program; set GYROLUX_S3_PORT"; fi
  mkdir -p "$DIR"
  # setsid: its own process group, so the server outlives this script and stops cleanly on `stop`.
  setsid node node_modules/s3rver/bin/s3rver.js --directory "$DIR" --address 127.0.0.1 --port "$PORT" \
    --silent --no-vhost-buckets --configure-bucket "$BUCKET" >"$LOG_FILE" 2>&1 < /dev/null &
  echo $! >"$PID_FILE"
  for _ in $(seq 60); do
    if listening; then
      log "ready: http://127.0.0.1:$PORT bucket $BUCKET ($DIR)"
      return 0
    fi
    running || { tail -n 20 "$LOG_FILE" >&2 || true; die "s3rver exited"; }
    sleep 0.25
  done
  die "s3rver did not answer on port $PORT"
}

cmd_stop() {
  if ! running; then
    rm -f "$PID_FILE"
    log "not running ($DIR)"
    return 0
  fi
  kill -- "-$(cat "$PID_FILE")" 2>/dev/null || kill "$(cat "$PID_FILE")" 2>/dev/null || true
  rm -f "$PID_FILE"
  log "stopped ($DIR)"
}

cmd_status() {
  if running; then
    echo "running on 127.0.0.1:$PORT ($DIR)"
    return 0
  fi
  echo "not running ($DIR)"
  return 3
}

case "${1:-}" in
  start) cmd_start ;;
  stop) cmd_stop ;;
  status) cmd_status ;;
  *) echo "usage: bash scripts/s3.sh start|stop|status" >&2; exit 2 ;;
esac
