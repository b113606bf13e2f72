#!/usr/bin/env bash
# npm run dev: like npm start, but with the Next.js development server.
source "$(dirname "$0")/common.sh"
source "$ROOT/scripts/services.sh"
load_env
cd "$ROOT"
export MAILBOX_DIR="${MAILBOX_DIR:-$ROOT/.data/mailbox}"
ensure_node_modules
bash scripts/db.sh start
start_fake_smtp "${FAKE_SMTP_PORT:-2525}" "$MAILBOX_DIR" .data/fake-smtp.pid
start_fake_s3 "${FAKE_S3_PORT:-4569}" "$ROOT/.data/s3" .data/fake-s3.pid
npx tsx db/migrate.ts
npx tsx db/seed.ts
trap 'stop_pidfile .data/fake-smtp.pid; stop_pidfile .data/fake-s3.pid; bash scripts/db.sh stop' INT TERM EXIT
npx tsx scripts/server.ts --dev -H localhost -p "${PORT:-3000}"
