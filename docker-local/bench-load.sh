#!/usr/bin/env bash
# npm run bench:load: the same bootstrap as npm test on its own database, Redis database and port,
# then the load benchmark (tests/bench/load.bench.ts): two worker processes (one per core) and the
# web app. The API rate limits are raised for the run, so the figures show the pipeline's capacity,
# not the throttle. Stops only what it started.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
source "$(dirname "$0")/bench-env.sh"
cd "$ROOT"
RUN="$LOCAL_DIR/run-bench-load"
mkdir -p "$RUN" "$LOCAL_DIR/logs"
cleanup() {
  for name in web worker worker-2; do stop_process "$name" "$RUN"; done
  bench_stop_services
}
trap cleanup EXIT
bench_start_services sagline_bench_load 8 sagline-bench-load
export SAGLINE_DIST_DIR=.next-bench
export API_RATE_LIMIT_PER_KEY=1000000 API_RATE_LIMIT_PER_ORGANIZATION=1000000
build_web_if_needed "$SAGLINE_DIST_DIR"
start_process worker "$RUN" "$LOCAL_DIR/logs/bench-load-worker.log" node --import tsx workers/index.ts
start_process worker-2 "$RUN" "$LOCAL_DIR/logs/bench-load-worker-2.log" node --import tsx workers/index.ts
bench_start_web "$RUN" "$LOCAL_DIR/logs/bench-load-web.log"
npx tsx tests/bench/load.bench.ts
