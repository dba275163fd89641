#!/usr/bin/env bash
# One lab-run worker beside the demo or test server (workers/lab-runs; `npm run worker` is the same
# program in the foreground). Other machines start theirs with `npm run worker` and DATABASE_URL.
#
#   bash scripts/worker.sh start    build if stale, start in the background, wait until it serves
#   bash scripts/worker.sh stop     stop it gracefully (SIGTERM to its process group: its run goes back
#                                   to the queue with its saved chunks; no-op when not running)
#   bash scripts/worker.sh status   exit 0 when running, 3 when not
#
# Env: DATABASE_URL (the app's database), GYROLUX_WORKER_ID (default gyrolux-worker-$PORT),
#      GYROLUX_WORKER_THREADS and the GYROLUX_RUN_* queue settings (README, "Lab runs"),
#      GYROLUX_WORKER_STATE (pid/log folder, default /tmp/gyrolux-worker-$GYROLUX_PG_PORT).
set -euo pipefail
# Variables of the checkout's .env that the environment does not set (one loader for every program).
source "$(dirname "${BASH_SOURCE[0]}")/../scripts/env.sh"
cd "$(dirname "$0")/.."

STATE="${GYROLUX_WORKER_STATE:-/tmp/gyrolux-worker-${GYROLUX_PG_PORT:-54329}}"
PID_FILE="$STATE/worker.pid"
LOG_FILE="$STATE/worker.log"
export GYROLUX_WORKER_ID="${GYROLUX_WORKER_ID:-gyrolux-worker-${GYROLUX_PG_PORT:-54329}}"

log() { echo "[worker.sh] $*" >&2; }
running() { [[ -f "$PID_FILE" ]] && kill -0 "$(cat "$PID_FILE")" 2>/dev/null; }

case "${1:-}" in
  start)
    if running; then log "already running (pid $(cat "$PID_FILE"))"; exit 0; fi
    mkdir -p "$STATE"
    node scripts/build-cli.mjs lab-worker lab-worker-thread
    setsid node dist/lab-worker.mjs >"$LOG_FILE" 2>&1 &
    echo $! >"$PID_FILE"
    for _ in $(seq 60); do
      if grep -q "serving queue" "$LOG_FILE" 2>/dev/null; then log "worker $GYROLUX_WORKER_ID serving (pid $(cat "$PID_FILE"), log $LOG_FILE)"; exit 0; fi
      running || { tail -n 20 "$LOG_FILE" >&2; log "the worker stopped"; exit 1; }
      sleep 0.5
    done
    log "the worker did not start in 30 s"; tail -n 20 "$LOG_FILE" >&2; exit 1 ;;
  stop)
    if running; then
      pid="$(cat "$PID_FILE")"
      kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
      # A graceful stop lets the chunks in flight finish and hands the job back (at most 30 s).
      for _ in $(seq 70); do kill -0 "$pid" 2>/dev/null || break; sleep 0.5; done
      kill -KILL -- "-$pid" 2>/dev/null || true
      log "stopped"
    fi
    rm -f "$PID_FILE" ;;
  status)
    if running; then echo "running (pid $(cat "$PID_FILE"))"; else echo "not running"; exit 3; fi ;;
  *) echo "usage: bash scripts/worker.sh start|stop|status" >&2; exit 2 ;;
esac
