#!/usr/bin/env bash
# npm run bench: engine and HTTP benchmarks on a MariaDB instance and app of their own.
# Prints figures; asserts nothing.
source "$(dirname "$0")/common.sh"
source "$ROOT/scripts/services.sh"
cd "$ROOT"
unset DATABASE_URL SMTP_URL
export GELWRIGHT_DB_DIR="$ROOT/.data/mariadb-bench" GELWRIGHT_DB_PORT=3337 GELWRIGHT_DB_NAME=gelwright_bench
export FAKE_SMTP_PORT=2546 SMTP_URL="smtp://127.0.0.1:2546" MAILBOX_DIR="$ROOT/.data/mailbox-bench"
export BETTER_AUTH_URL="http://localhost:3120" BENCH_BASE="http://localhost:3120" BETTER_AUTH_SECRET="gelwright-bench-secret-0000000000000001"
apt_install curl mariadb-server mariadb-client chromium
ensure_node_modules
cleanup() {
  set +e
  [ -n "${APP_PID:-}" ] && kill -- "-$APP_PID" 2>/dev/null
  stop_pidfile "$ROOT/.data/bench-fake-smtp.pid"
  stop_pidfile "$ROOT/.data/bench-fake-s3.pid"
  bash scripts/db.sh stop >/dev/null 2>&1
}
trap cleanup EXIT
bash scripts/db.sh start
start_fake_smtp "$FAKE_SMTP_PORT" "$MAILBOX_DIR" "$ROOT/.data/bench-fake-smtp.pid"
export FAKE_S3_PORT=4580 S3_ENDPOINT="http://127.0.0.1:4580"
start_fake_s3 "$FAKE_S3_PORT" "$ROOT/.data/s3-bench" "$ROOT/.data/bench-fake-s3.pid"
npx tsx db/migrate.ts && npx tsx db/seed.ts && npx tsx scripts/bench-data.ts 10000
echo; npx tsx scripts/bench-engine.ts
echo; npx tsx scripts/bench-explore.ts
npx tsx scripts/bench-import.ts
npx next build >"$ROOT/.data/bench-build.log"
GELWRIGHT_RATE_LIMIT=off setsid npx tsx scripts/server.ts -H localhost -p 3120 >"$ROOT/.data/bench-app.log" 2>&1 &
APP_PID=$!
wait_http "$BENCH_BASE/api/health" 60
npx tsx scripts/bench-http.ts
