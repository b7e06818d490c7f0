#!/usr/bin/env bash
# npm run ledger:verify [-- --incremental] [--json]    the whole ledger verified (exit 1 on any problem)
# npm run ledger:rotate-key                             a new signing key; the old public key stays trusted
# Against DATABASE_URL, or our own cluster (started for the command when it is not running).
source "$(dirname "$0")/lib/common.sh"
COMMAND="${1:-}"; [ $# -gt 0 ] && shift
with_local_database
case "$COMMAND" in
  verify) npx tsx scripts/ledger-verify.ts "$@" ;;
  rotate-key) npx tsx scripts/ledger-rotate-key.ts "$@" ;;
  *) echo "usage: scripts/ledger.sh verify|rotate-key"; exit 2 ;;
esac
