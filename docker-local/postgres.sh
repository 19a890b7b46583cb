#!/usr/bin/env bash
# Creates (once) and starts (when down) the project's PostgreSQL cluster on 127.0.0.1:$PG_PORT,
# with its data under $LOCAL_DIR/postgres, then ensures the named databases exist. Idempotent.
# Usage: postgres.sh start DB [DB...] | postgres.sh stop
source "$(dirname "$0")/lib.sh"
PGD="$LOCAL_DIR/postgres"
DB_USER="${SAGLINE_DB_USER:-sagline}"
DB_PASSWORD="${SAGLINE_DB_PASSWORD:-sagline-local}"

pg_running() { as_postgres "$PG_BIN/pg_ctl" -D "$PGD/data" status >/dev/null 2>&1; }

case "${1:-}" in
  start)
    shift
    mkdir -p "$PGD"
    [ "$(id -u)" = "0" ] && chown postgres:postgres "$PGD"
    if [ ! -f "$PGD/data/PG_VERSION" ]; then
      log "creating PostgreSQL cluster in $PGD"
      as_postgres "$PG_BIN/initdb" -D "$PGD/data" -U postgres --auth-local=trust --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    if ! pg_running; then
      log "starting PostgreSQL on 127.0.0.1:$PG_PORT"
      as_postgres "$PG_BIN/pg_ctl" -D "$PGD/data" -l "$PGD/server.log" -w -t 60 \
        -o "-c listen_addresses=127.0.0.1 -p $PG_PORT -k $PGD -c max_connections=200 -c shared_buffers=256MB -c synchronous_commit=on" start >/dev/null
    fi
    psql_admin() { as_postgres psql -X -q -v ON_ERROR_STOP=1 -h "$PGD" -p "$PG_PORT" -U postgres -d postgres "$@"; }
    if [ "$(psql_admin -tAc "select 1 from pg_roles where rolname='$DB_USER'")" != "1" ]; then
      psql_admin -c "create role $DB_USER login password '$DB_PASSWORD'"
    fi
    for db in "$@"; do
      if [ "$(psql_admin -tAc "select 1 from pg_database where datname='$db'")" != "1" ]; then
        log "creating database $db"
        psql_admin -c "create database $db owner $DB_USER"
      fi
    done
    ;;
  stop)
    if [ -f "$PGD/data/PG_VERSION" ] && pg_running; then
      log "stopping PostgreSQL"
      as_postgres "$PG_BIN/pg_ctl" -D "$PGD/data" -m fast -w stop >/dev/null
    fi
    ;;
  *) echo "usage: postgres.sh start DB... | stop" >&2; exit 64 ;;
esac
