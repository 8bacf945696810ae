#!/usr/bin/env bash
# npm start: set up whatever is missing, then run Thalpos on http://127.0.0.1:${PORT:-3000}.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
if [ -z "${DATABASE_URL:-}" ]; then
  ensure_postgres
  cluster_start dev "${THALPOS_PG_PORT:-54329}"
  [ "$CLUSTER_STARTED" = 1 ] && trap cluster_stop EXIT
  ensure_database thalpos
  ensure_app_role
  grant_app_role thalpos
  # Migrations run as the schema owner; the app itself connects with the least-privileged role.
  export MIGRATION_DATABASE_URL; MIGRATION_DATABASE_URL="$(database_url thalpos)"
  export DATABASE_URL; DATABASE_URL="$(app_database_url thalpos)"
fi
ensure_client_build

# The server applies migrations and the demo data itself, then starts the fake sign-in provider.
set +e
"$ROOT/node_modules/.bin/tsx" server/src/main.ts &
server_pid=$!
trap 'kill -TERM $server_pid 2>/dev/null' INT TERM
wait $server_pid
wait $server_pid 2>/dev/null
status=$?
exit $status
