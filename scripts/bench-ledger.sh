#!/usr/bin/env bash
# npm run bench:ledger [-- DECISIONS]: the ledger at scale on a throwaway cluster (its own folder and
# port, removed after; PostgreSQL's default durability, so commits wait for the disk as in service).
source "$(dirname "$0")/lib/common.sh"
ensure_apt_packages postgresql
ensure_node_modules
PG_DIR="$(pg_home ".pg-bench$SLOT_SUFFIX")"
PG_PORT="$(free_port)"
stop_cluster "$PG_DIR"; rm -rf "$PG_DIR"
trap 'stop_cluster "$PG_DIR"; rm -rf "$PG_DIR"' EXIT INT TERM
start_cluster "$PG_DIR" "$PG_PORT"
ensure_database "$PG_PORT" eddyledger_bench
local_database_urls "$PG_PORT" eddyledger_bench
npx tsx scripts/migrate.ts
BENCH_DECISIONS="${1:-100000}" npx tsx bench/ledger.bench.ts
