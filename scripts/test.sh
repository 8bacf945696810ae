#!/usr/bin/env bash
# npm test: the same set-up against a separate test cluster, then every suite. Extra arguments
# go to Jest (e.g. `npm test -- --selectProjects api`).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
# The whole run (no arguments) also lints and type-checks; a focused run skips straight to Jest.
if [ $# -eq 0 ]; then
  log "format, lint and type-check"
  npx prettier --check . && npx eslint . && npm run --silent typecheck
fi
ensure_postgres
ensure_chromium

# A throw-away cluster of its own on a free port: never touches the dev database or port 3000,
# and two runs at once (e.g. in two checkouts' terminals) do not share one.
cluster_start "test-$$" "$(free_port)" -c fsync=off -c synchronous_commit=off -c full_page_writes=off
cluster_discard() { cluster_stop; rm -rf "$CLUSTER_DIR" "$PGPASSWORD_FILE" "${APP_PASSWORD_FILE:-}"; }
trap cluster_discard EXIT
psql_admin -c 'drop database if exists thalpos_template' -c 'create database thalpos_template'
ensure_app_role
# Before the migrations, so every table they create is granted to the app role; clones copy it.
grant_app_role thalpos_template
export TEMPLATE_DATABASE_URL; TEMPLATE_DATABASE_URL="$(database_url thalpos_template)"
# Each test database is reached as the application role (tests/support/test-db.ts).
export TEST_APP_DATABASE_URL; TEST_APP_DATABASE_URL="$(app_database_url thalpos_template)"
DATABASE_URL="$TEMPLATE_DATABASE_URL" DEMO_DATA=1 npx tsx server/src/db/migrate-cli.ts
export TEST_ADMIN_DATABASE_URL; TEST_ADMIN_DATABASE_URL="$(database_url postgres)"

# SKIP_CLIENT_BUILD=1 saves the build when only server-side suites are run.
[ "${SKIP_CLIENT_BUILD:-0}" = 1 ] || ensure_client_build
export CLIENT_DIST="$ROOT/dist/client/browser"

# The fakes of hosted services as their own process (some are ES modules, which CommonJS Jest
# cannot load). It prints `NAME=url` per fake, then `ready`; each becomes an exported variable.
fake_log="$(mktemp)"
FAKE_GITHUB_PORT=0 "$ROOT/node_modules/.bin/tsx" server/src/fakes/main.ts > "$fake_log" 2>&1 &
fake_pid=$!
trap 'kill $fake_pid 2>/dev/null; cluster_discard; rm -f "$fake_log"' EXIT
for _ in $(seq 1 300); do grep -q '^ready$' "$fake_log" && break; kill -0 "$fake_pid" 2>/dev/null || break; sleep 0.1; done
grep -q '^ready$' "$fake_log" || die "the local fakes did not start: $(cat "$fake_log")"
while IFS='=' read -r name url; do
  [[ "$name" =~ ^FAKE_[A-Z0-9_]+_URL$ ]] && export "$name=$url"
done < "$fake_log"

export NODE_ENV=test LOG_LEVEL=silent
# A focused run writes its own results file, so runs in parallel do not overwrite each other's.
results="$ROOT/artifacts/jest-results.json"
[ $# -eq 0 ] || results="$ROOT/artifacts/jest-results-$$.json"
mkdir -p "$(dirname "$results")"
set +e
npx jest --ci --json --outputFile="$results" "$@"
status=$?
set -e
# One plain summary line for tools that read the closing line of a run.
node -e "const r=require(process.argv[1]);console.log('Tests: '+r.numPassedTests+' passed, '+r.numFailedTests+' failed'+(r.numPendingTests?', '+r.numPendingTests+' skipped':''))" "$results" 2>/dev/null || true
exit $status
