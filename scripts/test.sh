#!/usr/bin/env bash
# npm test: install what is missing, start a MariaDB instance and a fake SMTP
# server of the tests' own, run lint, type-check, unit and integration tests,
# build the app, run the HTTP and browser tests against it, stop everything,
# and end with one line "N passed, N failed".
source "$(dirname "$0")/common.sh"
source "$ROOT/scripts/services.sh"
cd "$ROOT"
set +e

# The tests' own instance, apart from the demo data (never DATABASE_URL).
unset DATABASE_URL SMTP_URL S3_ENDPOINT
export GELWRIGHT_DB_DIR="$ROOT/.data/mariadb-test"
export GELWRIGHT_DB_PORT="${GELWRIGHT_TEST_DB_PORT:-3317}"
export GELWRIGHT_DB_NAME="gelwright_test"
export FAKE_SMTP_PORT="${GELWRIGHT_TEST_SMTP_PORT:-2526}"
export SMTP_URL="smtp://127.0.0.1:$FAKE_SMTP_PORT"
export MAILBOX_DIR="$ROOT/.data/mailbox-test"
export FAKE_S3_PORT="${GELWRIGHT_TEST_S3_PORT:-4570}"
export S3_ENDPOINT="http://127.0.0.1:$FAKE_S3_PORT" S3_BUCKET=gelwright S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER S3_REGION=us-east-1 S3_FORCE_PATH_STYLE=true
export TEST_APP_PORT="${GELWRIGHT_TEST_APP_PORT:-3100}"
# A second instance of the same build on the same database, for the scale-out test.
export TEST_APP_PORT2="$((TEST_APP_PORT + 1))"
export BETTER_AUTH_URL="http://localhost:$TEST_APP_PORT"
export BETTER_AUTH_SECRET="gelwright-test-secret-not-for-production-0001"
export CHROMIUM_PATH="${CHROMIUM_PATH:-/usr/bin/chromium}"
OUT="$ROOT/.tmp/test"
rm -rf "$OUT" "$MAILBOX_DIR" "$ROOT/.data/s3-test"
mkdir -p "$OUT" "$MAILBOX_DIR"

passed=0
failed=0
failures=()
check() {
  # check NAME COMMAND... : one pass or fail for a whole command.
  local name="$1"; shift
  log "── $name"
  if "$@"; then passed=$((passed + 1)); else failed=$((failed + 1)); failures+=("$name"); fi
}
vitest_run() {
  # vitest_run NAME CONFIG : adds every test's result to the counts.
  local name="$1" cfg="$2" json="$OUT/$1.json"
  log "── $name tests"
  # GELWRIGHT_TEST_ONLY="tests/e2e/a.test.ts …" runs only those files (a contributor's quick loop, never CI).
  # shellcheck disable=SC2086
  npx vitest run --config "$cfg" ${GELWRIGHT_TEST_ONLY:-} --reporter=default --reporter=json --outputFile.json="$json"
  local rc=$?
  if [ -f "$json" ]; then
    read -r p f < <(node -e 'const r=require(process.argv[1]);console.log(r.numPassedTests, r.numFailedTests + (r.numRuntimeErrorTestSuites||0) + (r.numFailedTestSuites&&!r.numFailedTests?r.numFailedTestSuites:0))' "$json")
    passed=$((passed + p)); failed=$((failed + f))
    [ "$rc" -ne 0 ] && [ "$f" -eq 0 ] && { failed=$((failed + 1)); failures+=("$name (runner exited $rc)"); }
    [ "$f" -gt 0 ] && failures+=("$name ($f)")
  else
    failed=$((failed + 1)); failures+=("$name (no report)")
  fi
}

cleanup() {
  [ -n "${APP_PID:-}" ] && { kill -- "-$APP_PID" 2>/dev/null; wait "$APP_PID" 2>/dev/null; APP_PID=""; }
  [ -n "${APP2_PID:-}" ] && { kill -- "-$APP2_PID" 2>/dev/null; wait "$APP2_PID" 2>/dev/null; APP2_PID=""; }
  stop_pidfile "$ROOT/.data/test-fake-smtp.pid"
  stop_pidfile "$ROOT/.data/test-fake-s3.pid"
  bash scripts/db.sh stop >/dev/null 2>&1
}
trap cleanup EXIT

set -e
apt_install curl mariadb-server mariadb-client chromium fonts-liberation
ensure_node_modules
bash scripts/db.sh start
set +e
start_fake_smtp "$FAKE_SMTP_PORT" "$MAILBOX_DIR" "$ROOT/.data/test-fake-smtp.pid"
start_fake_s3 "$FAKE_S3_PORT" "$ROOT/.data/s3-test" "$ROOT/.data/test-fake-s3.pid"
bash scripts/db.sh drop "$GELWRIGHT_DB_NAME" && bash scripts/db.sh create "$GELWRIGHT_DB_NAME"
check "migrate the test database" npx tsx db/migrate.ts
check "seed the test database" npx tsx db/seed.ts

if [ -z "${GELWRIGHT_TEST_ONLY:-}" ]; then
  check "lint" npx eslint . --max-warnings=0
  check "type-check" npx tsc --noEmit
  vitest_run "unit-and-integration" vitest.config.ts
fi

log "── build"
if npx next build >"$OUT/build.log" 2>&1; then
  passed=$((passed + 1))
  tail -25 "$OUT/build.log"
  if (echo >"/dev/tcp/127.0.0.1/$TEST_APP_PORT") 2>/dev/null || (echo >"/dev/tcp/127.0.0.1/$TEST_APP_PORT2") 2>/dev/null; then
    log "Port $TEST_APP_PORT or $TEST_APP_PORT2 is already in use; stop what runs there (or set GELWRIGHT_TEST_APP_PORT)."
    failed=$((failed + 1)); failures+=("port $TEST_APP_PORT busy")
  else
    # The tests stand for many clients behind one proxy on 127.0.0.1 (each sends
    # its own X-Forwarded-For); a client on any other loopback address is not a proxy.
    export GELWRIGHT_TRUSTED_PROXIES="127.0.0.1"
    GELWRIGHT_SIGNIN_RATE_LIMIT=5 setsid npx tsx scripts/server.ts -H localhost -p "$TEST_APP_PORT" >"$OUT/app.log" 2>&1 &
    APP_PID=$!
    GELWRIGHT_SIGNIN_RATE_LIMIT=5 setsid npx tsx scripts/server.ts -H localhost -p "$TEST_APP_PORT2" >"$OUT/app2.log" 2>&1 &
    APP2_PID=$!
    if wait_http "http://localhost:$TEST_APP_PORT/api/health" 60 && wait_http "http://localhost:$TEST_APP_PORT2/api/health" 60; then
      vitest_run "http-and-browser" vitest.e2e.config.ts
    else
      failed=$((failed + 1)); failures+=("app did not start (see .tmp/test/app.log)")
    fi
  fi
else
  cat "$OUT/build.log"
  failed=$((failed + 1)); failures+=("build")
fi

cleanup
trap - EXIT
[ ${#failures[@]} -gt 0 ] && log "Failed: ${failures[*]}"
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
