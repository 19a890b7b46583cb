#!/usr/bin/env bash
# npm run bench:workers: member throughput of one worker process at check concurrency 1 and 2
# (tests/bench/check-throughput.bench.ts), on its own database and Redis database. Stops only what
# it started. BENCH_CONCURRENCY (e.g. "1,2,4") and BENCH_MEMBERS change the run.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
cd "$ROOT"
bash docker-local/ensure-packages.sh
bash docker-local/ensure-node-modules.sh
redis_was_up=0; pg_was_up=0
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1 && redis_was_up=1
[ -f "$(resolve_pg_dir)/data/postmaster.pid" ] && pg_was_up=1
bash docker-local/postgres.sh start sagline_bench_workers
bash docker-local/redis.sh start
cleanup() {
  [ "$redis_was_up" = 1 ] || bash docker-local/redis.sh stop
  [ "$pg_was_up" = 1 ] || bash docker-local/postgres.sh stop
}
trap cleanup EXIT
unset NEXTAUTH_SECRET; export_app_env sagline_bench_workers 9 sagline-bench-workers "http://127.0.0.1:${SAGLINE_BENCH_APP_PORT:-3796}" nextauth-bench
export SAGLINE_FAKES=0 SMTP_HOST=127.0.0.1 SMTP_PORT=2599
PGOPTIONS="--client-min-messages=warning" psql -X -q -v ON_ERROR_STOP=1 "$DATABASE_URL" -c "drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;"
redis-cli -h 127.0.0.1 -p "$REDIS_PORT" -n 9 flushdb >/dev/null
npx tsx db/migrate.ts
npx tsx db/seed.ts >/dev/null
npx tsx tests/bench/check-throughput.bench.ts
