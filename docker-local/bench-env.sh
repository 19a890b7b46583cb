# Shared by the bench:* scripts: the same bootstrap as npm test, on the benchmark's own database,
# Redis database and web port. Source after lib.sh and processes.sh, from the project root.
#   bench_start_services DB REDIS_DB NAME  ensure packages, start PostgreSQL and Redis, export the
#                                          app's settings, and reset, migrate and seed DB
#   bench_start_web RUN LOG                start `next start` on the bench port and wait for health
#   bench_stop_services                    stop PostgreSQL and Redis unless they were already up
BENCH_APP_PORT="${SAGLINE_BENCH_APP_PORT:-3796}"
# Until bench_start_services has looked, assume both were already up: a failure before then stops nothing.
bench_redis_was_up=1; bench_pg_was_up=1

bench_start_services() {
  local db="$1" redis_db="$2" name="$3"
  bash docker-local/ensure-packages.sh
  bash docker-local/ensure-node-modules.sh
  bench_redis_was_up=0; bench_pg_was_up=0
  redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1 && bench_redis_was_up=1
  [ -f "$(resolve_pg_dir)/data/postmaster.pid" ] && bench_pg_was_up=1
  bash docker-local/postgres.sh start "$db"
  bash docker-local/redis.sh start
  unset NEXTAUTH_SECRET; export_app_env "$db" "$redis_db" "$name" "http://127.0.0.1:$BENCH_APP_PORT" nextauth-bench
  export SAGLINE_FAKES=0 SMTP_HOST=127.0.0.1 SMTP_PORT=2599
  PGOPTIONS="--client-min-messages=warning" psql -X -q -v ON_ERROR_STOP=1 "$DATABASE_URL" -c "drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;"
  redis-cli -h 127.0.0.1 -p "$REDIS_PORT" -n "$redis_db" flushdb >/dev/null
  npx tsx db/migrate.ts
  npx tsx db/seed.ts >/dev/null
}

bench_start_web() {
  local run="$1" logfile="$2"
  START_PORT="$BENCH_APP_PORT" START_PORT_VAR=SAGLINE_BENCH_APP_PORT start_process web "$run" "$logfile" node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$BENCH_APP_PORT"
  wait_for_url "$APP_URL/api/health" 60 || { log "the web app did not become healthy; see $logfile"; tail -30 "$logfile"; exit 1; }
}

bench_stop_services() {
  if [ "${bench_redis_was_up:-0}" = 1 ]; then log "Redis on port $REDIS_PORT was already running; left running"; else bash docker-local/redis.sh stop; fi
  if [ "${bench_pg_was_up:-0}" = 1 ]; then log "PostgreSQL on port $PG_PORT was already running; left running"; else bash docker-local/postgres.sh stop; fi
}
