#!/usr/bin/env bash
# Creates (once) and starts (when down) the project's PostgreSQL cluster on 127.0.0.1:$PG_PORT,
# with its data under $LOCAL_DIR/postgres (or the folder resolve_pg_dir in lib.sh names), then
# ensures the named databases exist. Idempotent.
# Usage: postgres.sh start DB [DB...] | postgres.sh stop | postgres.sh dir
source "$(dirname "$0")/lib.sh"
PGD="$(resolve_pg_dir)"
DB_USER="${SAGLINE_DB_USER:-sagline}"
DB_PASSWORD="${SAGLINE_DB_PASSWORD:-sagline-local}"

pg_running() { as_postgres "$PG_BIN/pg_ctl" -D "$PGD/data" status >/dev/null 2>&1; }

case "${1:-}" in
  start)
    shift
    mkdir -p "$PGD"
    if [ "$(id -u)" = "0" ]; then chown postgres:postgres "$PGD"; fi
    [ "$PGD" = "$LOCAL_DIR/postgres" ] || printf '%s\n' "$ROOT" > "$(dirname "$PGD")/checkout"
    printf '%s\n' "$PGD" > "$LOCAL_DIR/postgres-location"
    if [ ! -f "$PGD/data/PG_VERSION" ]; then
      log "creating PostgreSQL cluster in $PGD"
      [ "$PGD" = "$LOCAL_DIR/postgres" ] || log "(the postgres user cannot enter $LOCAL_DIR, so the cluster lives outside the checkout)"
      as_postgres "$PG_BIN/initdb" -D "$PGD/data" -U postgres --auth-local=trust --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    running_port="$(sed -n 4p "$PGD/data/postmaster.pid" 2>/dev/null || true)"
    if pg_running && [ -n "$running_port" ] && [ "$running_port" != "$PG_PORT" ]; then
      echo "PostgreSQL: this checkout's cluster is already running on port $running_port, not $PG_PORT." >&2
      echo "Use SAGLINE_PG_PORT=$running_port, or stop it first with SAGLINE_PG_PORT=$running_port npm run stop." >&2
      exit 1
    fi
    if ! pg_running; then
      if port_taken "$PG_PORT"; then
        echo "PostgreSQL: port $PG_PORT on 127.0.0.1 is taken by another program (another checkout's PostgreSQL?)." >&2
        echo "Set SAGLINE_PG_PORT to a free port, e.g. SAGLINE_PG_PORT=$(free_port_near "$PG_PORT") npm start (and the same for npm run stop and npm test)." >&2
        exit 1
      fi
      log "starting PostgreSQL on 127.0.0.1:$PG_PORT"
      if ! as_postgres "$PG_BIN/pg_ctl" -D "$PGD/data" -l "$PGD/server.log" -w -t 60 \
        -o "-c listen_addresses=127.0.0.1 -p $PG_PORT -k $PGD -c max_connections=200 -c shared_buffers=256MB -c synchronous_commit=on" start >/dev/null; then
        echo "PostgreSQL did not start; the end of $PGD/server.log:" >&2
        tail -n 15 "$PGD/server.log" >&2 || true
        exit 1
      fi
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
  dir) echo "$PGD" ;;
  *) echo "usage: postgres.sh start DB... | stop | dir" >&2; exit 64 ;;
esac
