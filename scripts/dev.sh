#!/usr/bin/env bash
# npm run dev: the same database and mail catcher as npm start, with Nuxt's dev server.
source "$(dirname "$0")/lib/common.sh"
PG_PORT="${PG_PORT:-54329}"
S3_PORT="${S3_PORT:-4569}"
MAIL_SMTP_PORT="${MAIL_SMTP_PORT:-1025}"
MAIL_WEB_PORT="${MAIL_WEB_PORT:-1080}"
ensure_apt_packages postgresql
ensure_node_modules
ensure_session_password
ensure_ledger_key
if [ -z "${DATABASE_URL:-}" ]; then
  PG_DIR="$(pg_home .pg)"
  start_cluster "$PG_DIR" "$PG_PORT"
  ensure_database "$PG_PORT" eddyledger
  local_database_urls "$PG_PORT" eddyledger
fi
warn_single_role
export NUXT_DATABASE_URL="$DATABASE_URL" DEMO_PASSWORD="${DEMO_PASSWORD:-$DEMO_PASSWORD_DEFAULT}"
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts
node_modules/.bin/maildev --ip 127.0.0.1 --smtp "$MAIL_SMTP_PORT" --web-ip 127.0.0.1 --web "$MAIL_WEB_PORT" --silent >/tmp/eddyledger-maildev.log 2>&1 &
MAILDEV_PID=$!
export NUXT_SMTP_PORT="$MAIL_SMTP_PORT"
FAKE_S3_PID=
[ -z "${NUXT_STORAGE_BUCKET:-}" ] && start_fake_s3 "$ROOT/.s3" "$S3_PORT"
trap 'kill $MAILDEV_PID ${FAKE_S3_PID:-} 2>/dev/null || true' EXIT
# The server gets the app role's credentials only, never the owner's.
env -u DATABASE_OWNER_URL npx nuxt dev --host 127.0.0.1
