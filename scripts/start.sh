#!/usr/bin/env bash
# npm start: set up what is missing, start PostgreSQL and the mail catcher, migrate, seed when
# empty, build, serve. Ctrl-C stops the app; the data stays in .pg/.
source "$(dirname "$0")/lib/common.sh"

PORT="${PORT:-3000}"
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
export NUXT_DATABASE_URL="$DATABASE_URL"
export DEMO_PASSWORD="${DEMO_PASSWORD:-$DEMO_PASSWORD_DEFAULT}"

npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts

pids=()
cleanup() {
  for p in "${pids[@]}"; do kill "$p" 2>/dev/null || true; done
  [ -n "${PG_DIR:-}" ] && stop_cluster "$PG_DIR"
}
trap cleanup EXIT INT TERM

if [ -z "${NUXT_SMTP_HOST:-}" ]; then
  node_modules/.bin/maildev --ip 127.0.0.1 --smtp "$MAIL_SMTP_PORT" --web-ip 127.0.0.1 --web "$MAIL_WEB_PORT" --silent >/tmp/eddyledger-maildev.log 2>&1 &
  pids+=($!)
  wait_for_port "$MAIL_SMTP_PORT" "$!" "the mail catcher" /tmp/eddyledger-maildev.log
  export NUXT_SMTP_PORT="$MAIL_SMTP_PORT"
  MAIL_NOTE="development inbox: http://127.0.0.1:$MAIL_WEB_PORT"
fi

# Uploads: a real bucket when NUXT_STORAGE_BUCKET is set, else the local fake object store.
if [ -z "${NUXT_STORAGE_BUCKET:-}" ]; then
  start_fake_s3 "$ROOT/.s3" "$S3_PORT"
  pids+=("$FAKE_S3_PID")
  S3_NOTE="object store: http://127.0.0.1:$S3_PORT (local fake)"
fi

ensure_build
export NUXT_APP_URL="${NUXT_APP_URL:-http://127.0.0.1:$PORT}"
log "Eddyledger at http://127.0.0.1:$PORT  ${MAIL_NOTE:-}  ${S3_NOTE:-}"
log "demo sign-ins (password: $DEMO_PASSWORD): engineer@ engineer2@ reviewer@ reviewer2@ auditor@ lead@ admin@ eddyledger.test"
# The server gets the app role's credentials only, never the owner's.
# Node's heap options as everywhere the server runs (package.json config.serverNodeArgs, see
# scripts/lib/server-node.ts).
# shellcheck disable=SC2046
env -u DATABASE_OWNER_URL HOST=127.0.0.1 PORT="$PORT" node $(server_node_args) "$EDDY_OUTPUT_DIR/server/index.mjs" &
pids+=($!)
wait "${pids[-1]}"
