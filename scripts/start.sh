#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB and the fake SMTP server,
# migrate, seed the demo team, build, and serve on http://localhost:3000.
# Ctrl-C stops the app, the fake SMTP server and MariaDB. Data stays in .data/.
source "$(dirname "$0")/common.sh"
source "$ROOT/scripts/services.sh"
load_env
cd "$ROOT"

PORT="${PORT:-3000}"
export BETTER_AUTH_URL="${BETTER_AUTH_URL:-http://localhost:$PORT}"
mkdir -p .data
if [ -z "${BETTER_AUTH_SECRET:-}" ]; then
  [ -f .data/auth-secret ] || node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))' >.data/auth-secret
  BETTER_AUTH_SECRET="$(cat .data/auth-secret)"
  export BETTER_AUTH_SECRET
fi
if [ -z "${SMTP_URL:-}" ]; then
  export MAILBOX_DIR="${MAILBOX_DIR:-$ROOT/.data/mailbox}"
fi

apt_install curl
ensure_node_modules

cleanup() {
  trap - INT TERM EXIT
  set +e
  log "Stopping"
  [ -n "${APP_PID:-}" ] && { kill -- "-$APP_PID" 2>/dev/null; wait "$APP_PID" 2>/dev/null; }
  stop_pidfile .data/fake-smtp.pid
  stop_pidfile .data/fake-s3.pid
  bash scripts/db.sh stop
}
trap cleanup INT TERM EXIT

bash scripts/db.sh start
[ -z "${SMTP_URL:-}" ] && start_fake_smtp "${FAKE_SMTP_PORT:-2525}" "$MAILBOX_DIR" .data/fake-smtp.pid
if [ -z "${S3_ENDPOINT+x}" ]; then
  start_fake_s3 "${FAKE_S3_PORT:-4569}" "$ROOT/.data/s3" .data/fake-s3.pid
  export S3_ENDPOINT="http://127.0.0.1:${FAKE_S3_PORT:-4569}"
fi

npx tsx db/migrate.ts
npx tsx db/seed.ts

# Build only when the sources changed since the last build.
stamp=.next/BUILD_ID
if [ ! -f "$stamp" ] || [ -n "$(find app components db lib data public next.config.ts package-lock.json -newer "$stamp" -type f -print -quit 2>/dev/null)" ]; then
  log "Building the app"
  npx next build
else
  log "Build is up to date"
fi

cat <<MSG

  Gelwright is starting on http://localhost:$PORT
  Sign in at http://localhost:$PORT/sign-in with a demo account (password: larkspur-demo-2026):
    admin@larkspur.example        admin: members, roles, materials library
    formulator@larkspur.example   formulator: designs and submits formulations
    reviewer@larkspur.example     reviewer: approves or returns revisions
    production@larkspur.example   production: released work, batch sheets, batch records
  Captured mail (local mail catcher) is readable by the admin at http://localhost:$PORT/team/mail.
  Press Ctrl-C to stop the app and MariaDB.

MSG
setsid npx tsx scripts/server.ts -H localhost -p "$PORT" &
APP_PID=$!
wait "$APP_PID"
