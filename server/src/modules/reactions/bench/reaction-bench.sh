#!/usr/bin/env bash
# npm run bench:reactions: a throw-away PostgreSQL cluster with the starter release, then the
# reaction-enthalpy benchmark against it. Prints figures; asserts nothing.
set -euo pipefail
source "$(dirname "$0")/../../../../../scripts/lib.sh"
cd "$ROOT"

ensure_node_modules
ensure_postgres
cluster_start "bench-$$" "$(free_port)" -c fsync=off -c synchronous_commit=off -c full_page_writes=off
cluster_discard() { cluster_stop; rm -rf "$CLUSTER_DIR" "$PGPASSWORD_FILE"; }
trap cluster_discard EXIT
psql_admin -c 'drop database if exists thalpos_bench' -c 'create database thalpos_bench'
export DATABASE_URL; DATABASE_URL="$(database_url thalpos_bench)"
DEMO_DATA=0 npx tsx server/src/db/migrate-cli.ts
npx tsx server/src/modules/reactions/bench/reaction-bench.ts
