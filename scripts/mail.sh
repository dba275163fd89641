#!/usr/bin/env bash
# Gyrolux's local SMTP stand-in (scripts/mail-server.ts): catches every message on 127.0.0.1 and
# stores it in a folder instead of delivering it. Every command is idempotent.
#
#   bash scripts/mail.sh start    start in the background (no-op when already running)
#   bash scripts/mail.sh stop     stop (no-op when not running)
#   bash scripts/mail.sh status   exit 0 when running, 3 when not
#   bash scripts/mail.sh clear    delete the caught messages
#
# Env: GYROLUX_SMTP_PORT (2525), GYROLUX_MAIL_DIR (/tmp/gyrolux-mail-$GYROLUX_SMTP_PORT).
set -euo pipefail
# Variables of the checkout's .env that the environment does not set (one loader for every program).
source "$(dirname "${BASH_SOURCE[0]}")/../scripts/env.sh"
cd "$(dirname "$0")/.."

PORT="${GYROLUX_SMTP_PORT:-2525}"
DIR="${GYROLUX_MAIL_DIR:-/tmp/gyrolux-mail-$PORT}"
PIDFILE="$DIR/.server.pid"
LOGFILE="$DIR/.server.log"
export GYROLUX_SMTP_PORT="$PORT" GYROLUX_MAIL_DIR="$DIR"

log() { echo "[mail.sh] $*" >&2; }
[[ "$PORT" =~ ^[0-9]+$ ]] || { log "error: GYROLUX_SMTP_PORT must be a number (got '$PORT')"; exit 1; }

running() { [[ -f "$PIDFILE" ]] && kill -0 "$(cat "$PIDFILE")" 2>/dev/null; }

listening() { node -e 'const s=require("node:net").connect(+process.argv[1],"127.0.0.1");s.on("connect",()=>process.exit(0));s.on("error",()=>process.exit(1))' "$PORT"; }

case "${1:-}" in
  start)
    mkdir -p "$DIR"
    if running; then log "already running on 127.0.0.1:$PORT ($DIR)"; exit 0; fi
    # Another program (another checkout's catcher) holds the port: mail would land elsewhere.
    if listening; then log "error: 127.0.0.1:$PORT is already in use by another program; set GYROLUX_SMTP_PORT"; exit 1; fi
    setsid node_modules/.bin/tsx scripts/mail-server.ts >"$LOGFILE" 2>&1 < /dev/null &
    echo $! >"$PIDFILE"
    for _ in $(seq 60); do
      if listening; then log "catching mail on 127.0.0.1:$PORT, stored in $DIR"; exit 0; fi
      running || break
      sleep 0.25
    done
    cat "$LOGFILE" >&2 || true
    log "error: the mail stand-in did not start"
    exit 1
    ;;
  stop)
    if running; then
      kill -- "-$(cat "$PIDFILE")" 2>/dev/null || kill "$(cat "$PIDFILE")" 2>/dev/null || true
      rm -f "$PIDFILE"
      log "stopped"
    else
      log "not running"
    fi
    ;;
  status)
    if running; then echo "running on 127.0.0.1:$PORT ($DIR)"; else echo "not running ($DIR)"; exit 3; fi
    ;;
  clear)
    find "$DIR" -maxdepth 1 \( -name '*.json' -o -name '*.eml' \) -delete 2>/dev/null || true
    log "cleared $DIR"
    ;;
  *)
    echo "usage: bash scripts/mail.sh start|stop|status|clear" >&2
    exit 2
    ;;
esac
