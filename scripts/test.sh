#!/usr/bin/env bash
# npm test: the same set-up as npm start on a throwaway cluster (own folder and port, removed
# after), then unit, API (real server + PostgreSQL + fake SMTP over HTTP) and browser tests.
#   npm test               every suite
#   npm test -- unit       one suite (types | lint | unit | api | e2e), extra arguments go to its runner:
#   npm test -- api tests/api/auth.spec.ts
source "$(dirname "$0")/lib/common.sh"

SUITE="${1:-all}"; [ $# -gt 0 ] && shift
ensure_apt_packages postgresql chromium poppler-utils
ensure_node_modules

PG_DIR="$(pg_home ".pg-test$SLOT_SUFFIX")"
# Every port the run's services listen on, chosen at once so no two are the same.
read -r PG_PORT SMTP_PORT MAIL_WEB_PORT FREE_S3_PORT <<<"$(free_ports 4)"
stop_cluster "$PG_DIR"; rm -rf "$PG_DIR"
TEST_TMP="$(mktemp -d /tmp/eddyledger-test$SLOT_SUFFIX.XXXXXX)"
pids=()
cleanup() {
  for p in "${pids[@]}"; do kill "$p" 2>/dev/null || true; done
  stop_cluster "$PG_DIR"; rm -rf "$PG_DIR" "$TEST_TMP"
  if [ -n "${S3_DIR:-}" ]; then rm -rf "$S3_DIR" "$S3_DIR.log"; fi
}
trap cleanup EXIT INT TERM
start_cluster "$PG_DIR" "$PG_PORT" -c fsync=off -c synchronous_commit=off -c full_page_writes=off
ensure_roles "$PG_PORT"

export TEST_PG_ADMIN_URL="postgres://postgres@127.0.0.1:$PG_PORT/postgres"
export TEST_PG_HOST_PORT="127.0.0.1:$PG_PORT"
export NUXT_SESSION_PASSWORD="$(node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))")"
# A throwaway ledger key, and key files of the run's own, so tests never touch the developer's.
export NUXT_LEDGER_SIGNING_KEY="$(node -e "process.stdout.write(require('crypto').generateKeyPairSync('ed25519').privateKey.export({ type: 'pkcs8', format: 'pem' }))")"
export NUXT_LEDGER_KEY_FILE="$TEST_TMP/ledger-signing-key" NUXT_LEDGER_KEYRING_FILE="$TEST_TMP/ledger-public-keys"
export TEST_TMP_DIR="$TEST_TMP" TEST_PG_BIN="$(pg_bin)"
export DEMO_PASSWORD="${DEMO_PASSWORD:-$DEMO_PASSWORD_DEFAULT}"

MAILDEV_LOG="$TEST_TMP/maildev.log"
node_modules/.bin/maildev --ip 127.0.0.1 --smtp "$SMTP_PORT" --web-ip 127.0.0.1 --web "$MAIL_WEB_PORT" --silent >"$MAILDEV_LOG" 2>&1 &
pids+=($!)
wait_for_port "$SMTP_PORT" "$!" "the mail catcher (SMTP)" "$MAILDEV_LOG"
wait_for_port "$MAIL_WEB_PORT" "$!" "the mail catcher (web)" "$MAILDEV_LOG"
export TEST_SMTP_PORT="$SMTP_PORT" TEST_MAILDEV_URL="http://127.0.0.1:$MAIL_WEB_PORT"

# A throwaway local object store on its own port (S3_PORT when set), removed after.
S3_DIR="$ROOT/.s3-test$SLOT_SUFFIX"
rm -rf "$S3_DIR"
start_fake_s3 "$S3_DIR" "${S3_PORT:-$FREE_S3_PORT}"
pids+=("$FAKE_S3_PID")
export TEST_S3_URL="$NUXT_STORAGE_ENDPOINT"

ensure_build

# Type-checks app, server and shared code (vue-tsc through Nuxt); against .nuxt, so without a slot.
run_types() { log "type check"; EDDY_BUILD_SLOT= npx nuxt typecheck; }
run_lint() { log "lint"; [ -f .nuxt/eslint.config.mjs ] || EDDY_BUILD_SLOT= npx nuxt prepare >/dev/null; npx eslint "${@:-.}"; }
run_unit() { log "unit tests"; npx vitest run --project unit "$@"; }
run_api() { log "API tests (built server, PostgreSQL $PG_PORT)"; npx vitest run --project api "$@"; }
run_e2e() { log "browser tests (chromium)"; E2E_PORT="$(free_port)" npx playwright test "$@"; }

case "$SUITE" in
  types) run_types ;;
  lint) run_lint "$@" ;;
  unit) run_unit "$@" ;;
  api) run_api "$@" ;;
  e2e) run_e2e "$@" ;;
  all) run_types; run_lint; run_unit; run_api; run_e2e ;;
  *) echo "unknown suite: $SUITE (types | lint | unit | api | e2e | all)"; exit 2 ;;
esac
log "all requested suites passed"
