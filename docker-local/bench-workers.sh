#!/usr/bin/env bash
# npm run bench:workers: member throughput of one worker process at check concurrency 1 and 2
# (tests/bench/check-throughput.bench.ts), on its own database and Redis database. Stops only what
# it started. BENCH_CONCURRENCY (e.g. "1,2,4") and BENCH_MEMBERS change the run.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
source "$(dirname "$0")/bench-env.sh"
cd "$ROOT"
trap bench_stop_services EXIT
bench_start_services sagline_bench_workers 9 sagline-bench-workers
npx tsx tests/bench/check-throughput.bench.ts
