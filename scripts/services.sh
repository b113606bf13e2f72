#!/usr/bin/env bash
# Starting and stopping the local fake SMTP server. Sourced by start.sh and test.sh.

start_local_service() {
  # start_local_service NAME PORT PIDFILE ENV=VALUE... -- SCRIPT : a tsx script in the background,
  # reused when already running; waits (bounded) until its port answers.
  local name="$1" port="$2" pidfile="$3"
  shift 3
  local envs=()
  while [ "$1" != "--" ]; do envs+=("$1"); shift; done
  shift
  if [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; then
    log "$name already running on 127.0.0.1:$port (reused)"
    return 0
  fi
  mkdir -p "$(dirname "$pidfile")"
  local logfile="${pidfile%.pid}.log"
  env "${envs[@]}" setsid "$ROOT/node_modules/.bin/tsx" "$@" >"$logfile" 2>&1 </dev/null &
  echo $! >"$pidfile"
  for _ in $(seq 1 60); do
    (echo >"/dev/tcp/127.0.0.1/$port") 2>/dev/null && return 0
    sleep 0.25
  done
  log "$name did not start; see $logfile"
  exit 1
}

start_fake_smtp() {
  # start_fake_smtp PORT MAILBOX_DIR PIDFILE
  mkdir -p "$2"
  start_local_service "Fake SMTP server" "$1" "$3" FAKE_SMTP_PORT="$1" MAILBOX_DIR="$2" -- "$ROOT/scripts/fake-smtp.ts"
}

start_fake_s3() {
  # start_fake_s3 PORT DATA_DIR PIDFILE
  start_local_service "Fake S3 server" "$1" "$3" FAKE_S3_PORT="$1" S3_DATA_DIR="$2" -- "$ROOT/scripts/fake-s3.ts"
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
