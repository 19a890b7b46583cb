#!/usr/bin/env bash
# npm run test:faults: the fault drills (tests/faults/**) against real PostgreSQL and Redis on
# loopback, with their own database and Redis database. Each drill starts, kills and stops its own
# worker and web processes (the built app, next start, on the test ports) on a private queue prefix,
# and restarts PostgreSQL or Redis where it says so. Stops only what it started. Extra arguments go
# to vitest.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
cd "$ROOT"
bash docker-local/ensure-packages.sh
bash docker-local/ensure-node-modules.sh

redis_was_up=0; pg_was_up=0
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1 && redis_was_up=1
[ -f "$(resolve_pg_dir)/data/postmaster.pid" ] && pg_was_up=1
FAULTS_DB="${SAGLINE_FAULTS_DB:-sagline_faults}"
FAULTS_REDIS_DB="${SAGLINE_FAULTS_REDIS_DB:-2}"
bash docker-local/postgres.sh start "$FAULTS_DB"
bash docker-local/redis.sh start

cleanup() {
  # The drills restart both services; whichever state they left, stop them only if we started them.
  [ "$redis_was_up" = 1 ] || bash docker-local/redis.sh stop
  [ "$pg_was_up" = 1 ] || bash docker-local/postgres.sh stop
}
trap cleanup EXIT

unset NEXTAUTH_SECRET; export_app_env "$FAULTS_DB" "$FAULTS_REDIS_DB" sagline-faults "http://127.0.0.1:${SAGLINE_TEST_APP_PORT:-3793}" nextauth-test
export SAGLINE_FAKES=1 SMTP_HOST=127.0.0.1 SMTP_PORT="${SAGLINE_TEST_SMTP_PORT:-2593}"
# The web drills run the app as npm test does (the same build folder, rebuilt only when sources
# changed), on the test port and the spare one; the webhook drill's receiver takes the partner port.
export SAGLINE_DIST_DIR="${SAGLINE_DIST_DIR:-.next-test}"
export SAGLINE_TEST_APP_PORT="${SAGLINE_TEST_APP_PORT:-3793}" SAGLINE_TEST_SPARE_PORT="${SAGLINE_TEST_SPARE_PORT:-3799}" SAGLINE_TEST_PARTNER_PORT="${SAGLINE_TEST_PARTNER_PORT:-3795}"
PGOPTIONS="--client-min-messages=warning" psql -X -q -v ON_ERROR_STOP=1 "$DATABASE_URL" -c "drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;"
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" -n "$FAULTS_REDIS_DB" flushdb >/dev/null
npx tsx db/migrate.ts
npx tsx db/seed.ts >/dev/null
build_web_if_needed "$SAGLINE_DIST_DIR"

log "fault drills"
SAGLINE_FAULTS=1 npx vitest run --project faults "$@"
