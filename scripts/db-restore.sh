#!/usr/bin/env bash
# npm run db:restore -- DIR [--database NAME] [--replace] [--no-files]
# Restores a backup (npm run db:backup) into a new database NAME on the same server (default
# eddyledger_restored_<UTC time>), as the owner; puts its stored files back into the object store
# (unless --no-files), each checked against its recorded sha256; then verifies the ledger in full:
# the exit status is non-zero on any problem. --replace restores over the configured database
# instead (stop the server first). To serve a restored database, point DATABASE_URL and
# DATABASE_OWNER_URL at it.
source "$(dirname "$0")/lib/common.sh"
DIR="${1:-}"; [ $# -gt 0 ] && shift
NAME=""; REPLACE=""; FILES=1
while [ $# -gt 0 ]; do
  case "$1" in
    --database) NAME="$2"; shift 2 ;;
    --replace) REPLACE=1; shift ;;
    --no-files) FILES=""; shift ;;
    *) echo "unknown option: $1"; exit 2 ;;
  esac
done
[ -n "$DIR" ] && [ -f "$DIR/database.dump" ] || { echo "usage: npm run db:restore -- BACKUP_DIR [--database NAME] [--replace] [--no-files]"; exit 2; }
with_local_database
[ -n "$FILES" ] && with_local_storage
(cd "$DIR" && sha256sum --quiet -c SHA256SUMS) || { echo "[eddyledger] the backup's files do not match their SHA-256 sums"; exit 1; }
OWNER_URL="${DATABASE_OWNER_URL:-$DATABASE_URL}"
CURRENT="$(node -e "console.log(new URL(process.argv[1]).pathname.slice(1))" "$OWNER_URL")"
if [ -n "$REPLACE" ]; then NAME="$CURRENT"; fi
NAME="${NAME:-eddyledger_restored_$(date -u +%Y%m%dT%H%M%SZ | tr 'A-Z' 'a-z')}"
[[ "$NAME" =~ ^[a-z_][a-z0-9_]*$ ]] || { echo "a database name is lower-case letters, digits and _"; exit 2; }
ADMIN_URL="$(database_url_named "$OWNER_URL" postgres)"
PSQL=("$(pg_bin)/psql" -v ON_ERROR_STOP=1 -qtA)
if [ -n "$REPLACE" ]; then
  "${PSQL[@]}" "$ADMIN_URL" -c "DROP DATABASE IF EXISTS $NAME WITH (FORCE)"
elif [ -n "$("${PSQL[@]}" "$ADMIN_URL" -c "SELECT 1 FROM pg_database WHERE datname = '$NAME'")" ]; then
  echo "[eddyledger] the database $NAME exists already; choose another name or --replace"; exit 2
fi
"${PSQL[@]}" "$ADMIN_URL" -c "CREATE DATABASE $NAME"
"$(pg_bin)/pg_restore" --no-owner --exit-on-error --dbname="$(database_url_named "$OWNER_URL" "$NAME")" "$DIR/database.dump"
if [ -n "$FILES" ]; then
  DATABASE_OWNER_URL="$(database_url_named "$OWNER_URL" "$NAME")" node_modules/.bin/tsx scripts/storage-files.ts restore "$DIR"
fi
log "restored into the database $NAME; verifying its ledger"
DATABASE_URL="$(database_url_named "$DATABASE_URL" "$NAME")" \
  NUXT_LEDGER_TRUSTED_KEYS="${NUXT_LEDGER_TRUSTED_KEYS:-}
$(cat "$DIR/ledger-public-keys" 2>/dev/null)" \
  node_modules/.bin/tsx scripts/ledger-verify.ts
