# Shared shell helpers for scripts/start.sh, scripts/test.sh and scripts/stop.sh.
# Every failure ends with one line "sealpitch: <reason>" and a non-zero exit, never a trace.

PROJECT_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
PG_BIN="${PG_BIN:-/usr/lib/postgresql/15/bin}"
export NEXT_TELEMETRY_DISABLED=1

die() { echo "sealpitch: $*" >&2; exit 1; }
say() { echo "sealpitch: $*"; }

is_root() { [ "$(id -u)" = "0" ]; }

# Runs a command as the PostgreSQL owner: the `postgres` system user when we are root
# (initdb refuses root), ourselves otherwise.
as_pg_owner() {
  if is_root; then runuser -u postgres -- "$@"; else "$@"; fi
}

apt_install() {
  is_root || die "missing system packages ($*); install them with: sudo apt-get install -y $*"
  say "installing system packages: $*"
  if [ ! -f /tmp/.sealpitch-apt-updated ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null 2>&1 || die "apt-get update failed"
    touch /tmp/.sealpitch-apt-updated
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null 2>&1 \
    || die "apt-get install $* failed"
}

ensure_node() {
  command -v node >/dev/null || die "Node.js 20.9 or newer is required"
  node -e 'const [a,b]=process.versions.node.split(".").map(Number); process.exit(a>20||(a===20&&b>=9)?0:1)' \
    || die "Node.js 20.9 or newer is required (found $(node -v))"
}

# Installs npm dependencies from the lock file when node_modules is missing or was installed from another one.
ensure_node_modules() {
  cd "$PROJECT_ROOT"
  # The stamp holds the digest of the lock file the tree was installed from: a content check, so
  # a fresh checkout or worktree (whose lock file is newer than a copied node_modules) is not
  # reinstalled for nothing, and an edited lock file always is.
  local stamp="node_modules/.sealpitch-lock.sha256" want
  want=$(sha256sum package-lock.json | cut -d' ' -f1)
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing dependencies (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error >/tmp/sealpitch-npm-ci.log 2>&1 \
      || { tail -20 /tmp/sealpitch-npm-ci.log >&2; die "npm ci failed (log: /tmp/sealpitch-npm-ci.log)"; }
    echo "$want" >"$stamp"
  fi
}

ensure_postgres() {
  [ -x "$PG_BIN/initdb" ] || apt_install postgresql-15
  [ -x "$PG_BIN/initdb" ] || die "PostgreSQL 15 binaries not found in $PG_BIN"
  id postgres >/dev/null 2>&1 || ! is_root || die "the postgres system user is missing"
}

ensure_chromium() {
  command -v chromium >/dev/null || apt_install chromium
  command -v pdftoppm >/dev/null || apt_install poppler-utils
}

# CalculiX (the FE engine of features/fe-check and npm run calibrate): Debian's calculix-ccx;
# Gmsh (the plate mesher of the gasket path check): Debian's gmsh.
ensure_fe_tools() {
  [ -x /usr/bin/ccx ] || apt_install calculix-ccx
  [ -x /usr/bin/ccx ] || die "CalculiX (/usr/bin/ccx) not found after installing calculix-ccx"
  [ -x /usr/bin/gmsh ] || apt_install gmsh
  [ -x /usr/bin/gmsh ] || die "Gmsh (/usr/bin/gmsh) not found after installing gmsh"
}

# port_free PORT: exits 0 when nothing listens on 127.0.0.1:PORT.
port_free() {
  node -e 'const s=require("net").createServer();s.once("error",()=>process.exit(1));s.listen(Number(process.argv[1]),"127.0.0.1",()=>s.close(()=>process.exit(0)))' "$1"
}

# stop_group PID: stops a background service started with `setsid` together with its children
# (npx and tsx run the real server as a child process, so killing the first pid is not enough).
stop_group() {
  local pid="$1"
  [ -n "$pid" ] || return 0
  kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
  for _ in 1 2 3 4 5 6 7 8 9 10; do kill -0 -- "-$pid" 2>/dev/null || return 0; sleep 0.3; done
  kill -KILL -- "-$pid" 2>/dev/null || true
}

# http_ok URL: exits 0 when the URL answers 2xx (Node's fetch; no curl on a bare machine).
http_ok() {
  node -e 'fetch(process.argv[1]).then((r)=>process.exit(r.ok?0:1),()=>process.exit(1))' "$1"
}

require_port() {
  port_free "$1" || die "port $1 on 127.0.0.1 is already in use ($2); stop whatever holds it (or 'npm run stop') and try again"
}

# A folder the postgres user can reach: under the project when every parent is traversable,
# otherwise under /tmp (a clone in /root, for example, is not reachable by postgres).
pg_reachable_dir() {
  local wanted="$1" fallback="$2"
  mkdir -p "$(dirname "$wanted")"
  if ! is_root || runuser -u postgres -- test -x "$(dirname "$wanted")"; then echo "$wanted"; else echo "$fallback"; fi
}

# pg_start DATA_DIR PORT EXTRA_OPTS: initialises the cluster when new and starts it on loopback.
pg_start() {
  local data="$1" port="$2" extra="${3:-}" log="$1.log"
  if [ ! -f "$data/PG_VERSION" ]; then
    mkdir -p "$data"
    is_root && chown postgres "$data" "$(dirname "$data")"
    chmod 700 "$data"
    as_pg_owner "$PG_BIN/initdb" -D "$data" -U postgres --auth-local=trust --auth-host=scram-sha-256 \
      -E UTF8 --locale=C.UTF-8 >"$data.initdb.log" 2>&1 || die "initdb failed (log: $data.initdb.log)"
  fi
  if as_pg_owner "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    return 0
  fi
  require_port "$port" "PostgreSQL for Sealpitch"
  is_root && touch "$log" && chown postgres "$log"
  as_pg_owner "$PG_BIN/pg_ctl" -D "$data" -l "$log" -w -t 30 \
    -o "-c listen_addresses=127.0.0.1 -p $port -k /tmp -c unix_socket_permissions=0700 $extra" start >/dev/null \
    || die "PostgreSQL did not start (log: $log)"
}

pg_stop() {
  local data="$1"
  [ -f "$data/postmaster.pid" ] || return 0
  as_pg_owner "$PG_BIN/pg_ctl" -D "$data" -m fast -w -t 30 stop >/dev/null 2>&1 || true
}

# The database roles (README "Security"). RUNTIME_GROUP is the NOLOGIN role that migrations grant
# the application's privileges to (db/runtime-grants.ts); the app's login role is a member of it.
RUNTIME_GROUP=sealpitch_runtime

pg_psql() {
  local port="$1"
  shift
  PGOPTIONS="-c client_min_messages=warning" as_pg_owner "$PG_BIN/psql" -h /tmp -p "$port" -U postgres -v ON_ERROR_STOP=1 -qtA "$@"
}

# pg_ensure_database PORT DBNAME OWNER OWNER_PASSWORD RUNTIME RUNTIME_PASSWORD [--recreate]
# Creates (or brings up to date) the two login roles and the database, as the cluster's superuser:
#   OWNER   owns the database, its schemas and every table; migrations run as it
#           (MIGRATION_DATABASE_URL). It is not a superuser and cannot create roles or databases.
#   RUNTIME the app's DATABASE_URL: no ownership, no CREATE anywhere, only what the migrations grant
#           to sealpitch_runtime (db/runtime-grants.ts).
# A database made before the split (owned by the RUNTIME role) is handed over to OWNER. Idempotent:
# the ops scripts (backup restore, upgrade test) call it too.
pg_ensure_database() {
  local port="$1" name="$2" owner="$3" owner_password="$4" runtime="$5" runtime_password="$6" recreate="${7:-}"
  pg_psql "$port" -d postgres -c "do \$\$ begin
      if not exists (select from pg_roles where rolname = '$owner') then
        create role $owner login password '$owner_password';
      end if;
      if not exists (select from pg_roles where rolname = '$runtime') then
        create role $runtime login password '$runtime_password';
      end if;
      if not exists (select from pg_roles where rolname = '$RUNTIME_GROUP') then
        create role $RUNTIME_GROUP nologin;
      end if;
    end \$\$;
    alter role $owner nosuperuser nocreatedb nocreaterole noreplication nobypassrls;
    alter role $runtime nosuperuser nocreatedb nocreaterole noreplication nobypassrls inherit;
    grant $RUNTIME_GROUP to $runtime;" >/dev/null || die "could not create the database roles $owner and $runtime"
  if [ "$recreate" = "--recreate" ]; then
    pg_psql "$port" -d postgres -c "drop database if exists $name with (force)" >/dev/null || die "could not drop $name"
  fi
  if [ -z "$(pg_psql "$port" -d postgres -c "select 1 from pg_database where datname = '$name'")" ]; then
    pg_psql "$port" -d postgres -c "create database $name owner $owner" >/dev/null || die "could not create database $name"
  fi
  # Objects the runtime role owns (a database from before the split) move to the owner; then the
  # runtime role may connect and use the schemas, nothing more (no CREATE, no TEMP).
  pg_psql "$port" -d "$name" -c "alter database $name owner to $owner;
    reassign owned by $runtime to $owner;
    revoke all on database $name from public;
    grant connect on database $name to $RUNTIME_GROUP;
    alter schema public owner to $owner;
    revoke create on schema public from public;
    grant usage on schema public to $RUNTIME_GROUP;" >/dev/null || die "could not set the owner and privileges of $name"
}
