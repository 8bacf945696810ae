# Shared set-up steps for start.sh and test.sh. Every step is idempotent.
# shellcheck shell=bash

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="$ROOT/.data"

log() { printf '\033[1;33m[thalpos]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[thalpos]\033[0m %s\n' "$*" >&2; exit 1; }

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

# Runs apt-get, waiting (up to APT_LOCK_WAIT seconds, default 600) while another apt or dpkg
# run holds Debian's package lock instead of failing at once.
apt_get() {
  local start=$SECONDS limit="${APT_LOCK_WAIT:-600}" said=0 err; err="$(mktemp)"
  while :; do
    if as_root env DEBIAN_FRONTEND=noninteractive apt-get -o DPkg::Lock::Timeout="$limit" "$@" 2>"$err"; then
      rm -f "$err"; return 0
    fi
    if grep -qiE 'could not get lock|unable to acquire|lock-frontend|is another process using it' "$err" \
      && [ $((SECONDS - start)) -lt "$limit" ]; then
      [ "$said" = 1 ] || log "another apt run holds the package lock; waiting for it to finish"
      said=1; sleep "${APT_LOCK_POLL:-5}"; continue
    fi
    cat "$err" >&2; rm -f "$err"; return 1
  done
}

apt_install() {
  command -v apt-get >/dev/null || die "apt-get not found: install $* by hand"
  log "installing $* from Debian (apt-get)"
  if [ -z "${THALPOS_APT_UPDATED:-}" ]; then apt_get update -qq || die "apt-get update failed"; THALPOS_APT_UPDATED=1; fi
  apt_get install -y -qq --no-install-recommends "$@" >/dev/null || die "apt-get install $* failed"
}

ensure_node_modules() {
  local stamp="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$stamp" ] || [ "$ROOT/package-lock.json" -nt "$stamp" ]; then
    log "installing npm dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  fi
}

pg_bin_dir() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

ensure_postgres() {
  if [ -z "$(pg_bin_dir)" ] || [ ! -x "$(pg_bin_dir)/initdb" ]; then
    # Debian's package also creates and starts its own cluster; ours is separate and project-local.
    apt_install postgresql
  fi
  PG_BIN="$(pg_bin_dir)"
  [ -x "$PG_BIN/initdb" ] || die "PostgreSQL server binaries not found after install"
  export PG_BIN
}

ensure_chromium() {
  if ! command -v chromium >/dev/null; then apt_install chromium fonts-dejavu-core; fi
  export CHROMIUM_PATH="${CHROMIUM_PATH:-$(command -v chromium)}"
}

free_port() {
  node -e "const s=require('net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})"
}

# PostgreSQL refuses to run as root: run its tools as the postgres user when we are root.
# From /, since the postgres user may not be allowed into the current directory.
pg_run() { if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi; }

# Where a cluster's data lives: inside the project when the postgres user can reach it,
# else under /var/tmp (e.g. a checkout under /root, which postgres cannot traverse).
cluster_dir() {
  local name="$1" dir="$DATA_DIR/$1"
  if [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
    dir="/var/tmp/thalpos-$(printf '%s' "$ROOT" | sha1sum | cut -c1-10)/$name"
  fi
  printf '%s' "$dir"
}

# cluster_start NAME PORT [extra postgres options]: initialises on first use, starts if stopped.
# Sets CLUSTER_DIR, CLUSTER_PORT, CLUSTER_STARTED (1 when this call started it), PGPASSWORD_FILE.
cluster_start() {
  local name="$1" port="$2"; shift 2
  CLUSTER_DIR="$(cluster_dir "$name")"
  PGPASSWORD_FILE="$(dirname "$CLUSTER_DIR")/$name.password"
  CLUSTER_STARTED=0
  mkdir -p "$(dirname "$CLUSTER_DIR")"
  if [ ! -s "$CLUSTER_DIR/PG_VERSION" ]; then
    log "creating PostgreSQL cluster $name in $CLUSTER_DIR"
    rm -rf "$CLUSTER_DIR"; mkdir -p "$CLUSTER_DIR"
    [ -s "$PGPASSWORD_FILE" ] || (umask 077; node -e "console.log(require('crypto').randomBytes(18).toString('hex'))" > "$PGPASSWORD_FILE")
    local pwfile; pwfile="$(mktemp)"; cp "$PGPASSWORD_FILE" "$pwfile"
    if [ "$(id -u)" = 0 ]; then chown postgres "$CLUSTER_DIR" "$pwfile"; fi
    chmod 700 "$CLUSTER_DIR"
    pg_run "$PG_BIN/initdb" -D "$CLUSTER_DIR" -U postgres --pwfile="$pwfile" \
      --auth-local=scram-sha-256 --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null \
      || { rm -f "$pwfile"; die "initdb failed"; }
    rm -f "$pwfile"
  fi
  if pg_run "$PG_BIN/pg_ctl" -D "$CLUSTER_DIR" status >/dev/null 2>&1; then
    CLUSTER_PORT="$(sed -n 4p "$CLUSTER_DIR/postmaster.pid")"
  else
    CLUSTER_PORT="$port"
    pg_run "$PG_BIN/pg_ctl" -D "$CLUSTER_DIR" -l "$CLUSTER_DIR/server.log" -w -t 60 start \
      -o "-c listen_addresses=127.0.0.1 -p $CLUSTER_PORT -k $CLUSTER_DIR $*" >/dev/null \
      || { tail -n 20 "$CLUSTER_DIR/server.log" >&2; die "PostgreSQL did not start"; }
    CLUSTER_STARTED=1
  fi
  export PGPASSWORD; PGPASSWORD="$(cat "$PGPASSWORD_FILE")"
}

cluster_stop() {
  [ -n "${CLUSTER_DIR:-}" ] && pg_run "$PG_BIN/pg_ctl" -D "$CLUSTER_DIR" -m fast -w stop >/dev/null 2>&1 || true
}

psql_admin() { PGOPTIONS='-c client_min_messages=warning' "$PG_BIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$CLUSTER_PORT" -U postgres -d postgres "$@"; }

ensure_database() {
  local db="$1"
  if [ "$(psql_admin -tAc "select 1 from pg_database where datname = '$db'")" != 1 ]; then
    psql_admin -c "create database \"$db\""
  fi
}

# The schema owner (postgres) runs migrations; the application connects as APP_ROLE, which owns
# nothing and holds only the rights it uses: read and write rows, use sequences. No DDL, no
# CREATE on the schema, no TRUNCATE; audit_log refuses UPDATE and DELETE by trigger as well.
APP_ROLE=thalpos_app

database_url() { printf 'postgres://postgres:%s@127.0.0.1:%s/%s' "$PGPASSWORD" "$CLUSTER_PORT" "$1"; }
app_database_url() { printf 'postgres://%s:%s@127.0.0.1:%s/%s' "$APP_ROLE" "$APP_PASSWORD" "$CLUSTER_PORT" "$1"; }

# Creates the application role in the running cluster (once); sets APP_PASSWORD.
ensure_app_role() {
  APP_PASSWORD_FILE="$(dirname "$CLUSTER_DIR")/$(basename "$CLUSTER_DIR").app-password"
  [ -s "$APP_PASSWORD_FILE" ] || (umask 077; node -e "console.log(require('crypto').randomBytes(18).toString('hex'))" > "$APP_PASSWORD_FILE")
  APP_PASSWORD="$(cat "$APP_PASSWORD_FILE")"
  if [ "$(psql_admin -tAc "select 1 from pg_roles where rolname = '$APP_ROLE'")" != 1 ]; then
    psql_admin -c "create role $APP_ROLE login nosuperuser nocreatedb nocreaterole noinherit password '$APP_PASSWORD'"
  else
    psql_admin -c "alter role $APP_ROLE login password '$APP_PASSWORD'"
  fi
}

# Grants the application role its rights in database $1: on what exists, and (default
# privileges) on every table and sequence that later migrations create as postgres.
grant_app_role() {
  psql_admin -d "$1" \
    -c "grant connect on database \"$1\" to $APP_ROLE" \
    -c "revoke create on schema public from public" \
    -c "grant usage on schema public to $APP_ROLE" \
    -c "grant select, insert, update, delete on all tables in schema public to $APP_ROLE" \
    -c "grant usage, select on all sequences in schema public to $APP_ROLE" \
    -c "alter default privileges for role postgres in schema public grant select, insert, update, delete on tables to $APP_ROLE" \
    -c "alter default privileges for role postgres in schema public grant usage, select on sequences to $APP_ROLE"
}

# Rebuilds the client only when its sources or config changed since the last build.
ensure_client_build() {
  local index="$ROOT/dist/client/browser/index.html"
  if [ ! -f "$index" ] || [ -n "$(find "$ROOT/client" "$ROOT/angular.json" "$ROOT/package-lock.json" -newer "$index" -type f -print -quit)" ]; then
    log "building the client"
    # One build at a time per checkout: two runs writing dist/ together would mix their files.
    (cd "$ROOT" && flock "$ROOT/.angular-build.lock" npx ng build --configuration production >/dev/null) || die "client build failed"
  fi
}
