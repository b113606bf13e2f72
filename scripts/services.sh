#!/usr/bin/env bash
# Starting and stopping the local fake SMTP server. Sourced by start.sh and test.sh.

start_fake_smtp() {
  # start_fake_smtp PORT MAILBOX_DIR PIDFILE
  local port="$1" dir="$2" pidfile="$3"
  if [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then
    log "Fake SMTP server already running on 127.0.0.1:$port (reused)"
    return 0
  fi
  mkdir -p "$dir" "$(dirname "$pidfile")"
  FAKE_SMTP_PORT="$port" MAILBOX_DIR="$dir" setsid "$ROOT/node_modules/.bin/tsx" "$ROOT/scripts/fake-smtp.ts" \
    >"$(dirname "$pidfile")/fake-smtp.log" 2>&1 </dev/null &
  echo $! >"$pidfile"
  for _ in $(seq 1 40); do
    (echo >"/dev/tcp/127.0.0.1/$port") 2>/dev/null && return 0
    sleep 0.25
  done
  log "The fake SMTP server did not start; see $(dirname "$pidfile")/fake-smtp.log"
  exit 1
}

stop_pidfile() {
  local pidfile="$1"
  if [ -f "$pidfile" ]; then
    local pid
    pid="$(cat "$pidfile")"
    kill -- "-$pid" 2>/dev/null || kill "$pid" 2>/dev/null || true
    rm -f "$pidfile"
  fi
}

wait_http() {
  # wait_http URL SECONDS : until the URL answers (any status).
  local url="$1" secs="$2"
  for _ in $(seq 1 $((secs * 4))); do
    curl -s -o /dev/null "$url" && return 0
    sleep 0.25
  done
  return 1
}
