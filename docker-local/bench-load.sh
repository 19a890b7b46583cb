#!/usr/bin/env bash
# npm run bench:load: the same bootstrap as npm test on its own database, Redis database and port,
# then the load benchmark (tests/bench/load.bench.ts): two worker processes (one per core) and the
# web app. The API rate limits are raised for the run, so the figures show the pipeline's capacity,
# not the throttle. Stops only what it started.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
cd "$ROOT"
bash docker-local/ensure-packages.sh
bash docker-local/ensure-node-modules.sh
redis_was_up=0; pg_was_up=0
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1 && redis_was_up=1
[ -f "$(resolve_pg_dir)/data/postmaster.pid" ] && pg_was_up=1
bash docker-local/postgres.sh start sagline_bench_load
bash docker-local/redis.sh start

RUN="$LOCAL_DIR/run-bench-load"
mkdir -p "$RUN" "$LOCAL_DIR/logs"
BENCH_APP_PORT="${SAGLINE_BENCH_APP_PORT:-3796}"
unset NEXTAUTH_SECRET; export_app_env sagline_bench_load 8 sagline-bench-load "http://127.0.0.1:$BENCH_APP_PORT" nextauth-bench
export SAGLINE_FAKES=0 SMTP_HOST=127.0.0.1 SMTP_PORT=2599
export SAGLINE_DIST_DIR=.next-bench
export API_RATE_LIMIT_PER_KEY=1000000 API_RATE_LIMIT_PER_ORGANIZATION=1000000

cleanup() {
  for name in web worker worker-2; do stop_process "$name" "$RUN"; done
  if [ "$redis_was_up" = 1 ]; then log "Redis on port $REDIS_PORT was already running; left running"; else bash docker-local/redis.sh stop; fi
  if [ "$pg_was_up" = 1 ]; then log "PostgreSQL on port $PG_PORT was already running; left running"; else bash docker-local/postgres.sh stop; fi
}
trap cleanup EXIT

PGOPTIONS="--client-min-messages=warning" psql -X -q -v ON_ERROR_STOP=1 "$DATABASE_URL" -c "drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;"
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" -n 8 flushdb >/dev/null
npx tsx db/migrate.ts
npx tsx db/seed.ts >/dev/null
build_web_if_needed "$SAGLINE_DIST_DIR"
start_process worker "$RUN" "$LOCAL_DIR/logs/bench-load-worker.log" node --import tsx workers/index.ts
start_process worker-2 "$RUN" "$LOCAL_DIR/logs/bench-load-worker-2.log" node --import tsx workers/index.ts
START_PORT="$BENCH_APP_PORT" START_PORT_VAR=SAGLINE_BENCH_APP_PORT start_process web "$RUN" "$LOCAL_DIR/logs/bench-load-web.log" node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$BENCH_APP_PORT"
wait_for_url "$APP_URL/api/health" 60 || { log "the web app did not become healthy; see $LOCAL_DIR/logs/bench-load-web.log"; tail -30 "$LOCAL_DIR/logs/bench-load-web.log"; exit 1; }
npx tsx tests/bench/load.bench.ts
