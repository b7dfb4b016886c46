#!/usr/bin/env bash
# Private PostgreSQL cluster for Sheetsmith on 127.0.0.1, built from Debian's server packages.
#
#   bash scripts/postgres.sh [DATABASE ...]     start (or reuse) the cluster, create the databases
#   source scripts/postgres.sh                   define the functions only (pg_ensure_running, pg_ensure_database)
#
# Settings (environment):
#   SHEETSMITH_PGDATA   data directory (default /var/tmp/sheetsmith-pg; kept outside /root, which the
#                       postgres account cannot enter, and outside the repository)
#   SHEETSMITH_PGPORT   port (default 54329)
#
# Idempotent: first run, re-run while running (a quick no-op), after the server was killed (-9), and after
# the data directory was wiped. Runs the server binaries as the postgres account when called as root.

SHEETSMITH_PGDATA="${SHEETSMITH_PGDATA:-/var/tmp/sheetsmith-pg}"
SHEETSMITH_PGPORT="${SHEETSMITH_PGPORT:-54329}"

pg_log() { echo "postgres: $*" >&2; }

pg_find_bin() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
  [ -n "$dir" ] && [ -x "$dir/initdb" ] && echo "$dir"
}

# Installs Debian's PostgreSQL server when missing, without letting Debian create and start its own
# default cluster (ours is private and would only compete for memory and a port).
pg_install_if_missing() {
  if [ -n "$(pg_find_bin)" ]; then return 0; fi
  if [ "$(id -u)" -ne 0 ]; then
    pg_log "PostgreSQL server binaries are missing (/usr/lib/postgresql/*/bin) and this script is not root."
    pg_log "Install them with: sudo apt-get install -y postgresql   then run this command again."
    return 1
  fi
  pg_log "installing PostgreSQL from Debian's packages (once; about a minute)"
  mkdir -p /etc/postgresql-common/createcluster.d
  echo 'create_main_cluster = false' > /etc/postgresql-common/createcluster.d/sheetsmith.conf
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null || {
    pg_log "apt-get could not install postgresql; see the messages above"
    return 1
  }
}

# Runs a server binary as the postgres account when we are root (initdb refuses to run as root).
pg_as_owner() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

pg_answers() {
  "$PG_BIN/pg_isready" -q -h 127.0.0.1 -p "$SHEETSMITH_PGPORT" >/dev/null 2>&1
}

pg_ensure_running() {
  pg_install_if_missing || return 1
  PG_BIN=$(pg_find_bin)
  if pg_answers; then return 0; fi

  local owner=postgres
  [ "$(id -u)" -eq 0 ] || owner=$(id -un)
  if [ ! -s "$SHEETSMITH_PGDATA/PG_VERSION" ]; then
    pg_log "creating a private cluster in $SHEETSMITH_PGDATA"
    rm -rf "$SHEETSMITH_PGDATA"
    mkdir -p "$SHEETSMITH_PGDATA"
    chown "$owner" "$SHEETSMITH_PGDATA" && chmod 700 "$SHEETSMITH_PGDATA"
    pg_as_owner "$PG_BIN/initdb" -D "$SHEETSMITH_PGDATA" -U postgres --auth=trust -E UTF8 >"$SHEETSMITH_PGDATA.initdb.log" 2>&1 || {
      pg_log "initdb failed; its output is in $SHEETSMITH_PGDATA.initdb.log"
      return 1
    }
  fi

  # After a crash (kill -9) the old postmaster can take a moment to go away; only a lock file with
  # nothing answering on the port is stale.
  if [ -f "$SHEETSMITH_PGDATA/postmaster.pid" ]; then
    local i
    for i in 1 2 3 4 5 6 7 8 9 10; do
      pg_answers && return 0
      local pid
      pid=$(head -n 1 "$SHEETSMITH_PGDATA/postmaster.pid" 2>/dev/null)
      if [ -z "$pid" ] || ! kill -0 "$pid" 2>/dev/null; then break; fi
      sleep 0.5
    done
    if ! pg_answers; then
      pid=$(head -n 1 "$SHEETSMITH_PGDATA/postmaster.pid" 2>/dev/null)
      if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then
        pg_log "process $pid holds $SHEETSMITH_PGDATA but does not answer on port $SHEETSMITH_PGPORT; stop it and retry"
        return 1
      fi
      pg_log "removing a stale postmaster.pid left by a server that is gone"
      rm -f "$SHEETSMITH_PGDATA/postmaster.pid"
    fi
  fi

  pg_as_owner "$PG_BIN/pg_ctl" -D "$SHEETSMITH_PGDATA" -l "$SHEETSMITH_PGDATA/server.log" -w -t 60 start \
    -o "-p $SHEETSMITH_PGPORT -c listen_addresses=127.0.0.1 -k $SHEETSMITH_PGDATA" >/dev/null 2>&1 9>&- || {
    pg_log "the server did not start; the end of $SHEETSMITH_PGDATA/server.log says:"
    tail -n 15 "$SHEETSMITH_PGDATA/server.log" >&2
    return 1
  }
  local i
  for i in $(seq 1 40); do pg_answers && return 0; sleep 0.25; done
  pg_log "the server started but does not answer on 127.0.0.1:$SHEETSMITH_PGPORT"
  return 1
}

pg_psql() {
  "$PG_BIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$SHEETSMITH_PGPORT" -U postgres "$@"
}

# Creates the database when it does not exist yet. Names are limited to [a-z0-9_] so they need no quoting.
pg_ensure_database() {
  local name="$1"
  if ! [[ "$name" =~ ^[a-z_][a-z0-9_]*$ ]]; then
    pg_log "database name '$name' must use only a-z, 0-9 and _"
    return 1
  fi
  if [ "$(pg_psql -d postgres -tAc "SELECT 1 FROM pg_database WHERE datname = '$name'")" != "1" ]; then
    pg_psql -d postgres -c "CREATE DATABASE $name" || return 1
  fi
}

# Drops and recreates the database (used for the test database), ending any open connections first.
pg_recreate_database() {
  local name="$1"
  pg_ensure_database "$name" || return 1
  pg_psql -d postgres -c "DROP DATABASE IF EXISTS $name WITH (FORCE)" && pg_psql -d postgres -c "CREATE DATABASE $name"
}

pg_url() { echo "postgres://postgres@127.0.0.1:$SHEETSMITH_PGPORT/$1"; }

if [ "${BASH_SOURCE[0]}" = "$0" ]; then
  set -euo pipefail
  # One caller at a time: start.sh and test.sh may run together.
  exec 9>"/var/tmp/sheetsmith-pg.lock"
  flock 9
  pg_ensure_running
  for db in "${@:-sheetsmith}"; do pg_ensure_database "$db"; done
  echo "PostgreSQL is up on 127.0.0.1:$SHEETSMITH_PGPORT (data in $SHEETSMITH_PGDATA)" >&2
fi
