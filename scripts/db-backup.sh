#!/usr/bin/env bash
# npm run db:backup [-- DIR]: the database (pg_dump, custom format, as its owner), the uploaded files
# it names (each checked against its recorded sha256) and the public keys that verify its ledger,
# into backups/<UTC time>/ or DIR, with their SHA-256 sums. The signing key is not in it (it never
# is in the database): keep .secrets/ledger-signing-key apart.
source "$(dirname "$0")/lib/common.sh"
with_local_database
with_local_storage
DIR="${1:-backups/$(date -u +%Y%m%dT%H%M%SZ)}"
URL="${DATABASE_OWNER_URL:-$DATABASE_URL}"
mkdir -p "$DIR"
"$(pg_bin)/pg_dump" --format=custom --file="$DIR/database.dump" "$URL"
# The public keys: the active one and the retired ones kept outside the database, so the backup
# verifies on another machine (compare their names with those shown to the auditors).
DATABASE_OWNER_URL="$URL" node_modules/.bin/tsx scripts/storage-files.ts backup "$DIR"
node_modules/.bin/tsx scripts/ledger-public-keys.ts > "$DIR/ledger-public-keys"
(cd "$DIR" && sha256sum database.dump files.json ledger-public-keys > SHA256SUMS)
log "backup written to $DIR"
