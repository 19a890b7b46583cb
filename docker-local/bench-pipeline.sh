#!/usr/bin/env bash
# npm run bench:pipeline: the same bootstrap as npm test on its own database and ports, then the
# pipeline benchmark (tests/bench/pipeline.bench.ts). Stops only what it started: its own web and
# worker processes always, PostgreSQL and Redis when they were not already running.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
source "$(dirname "$0")/bench-env.sh"
cd "$ROOT"
RUN="$LOCAL_DIR/run-bench"
mkdir -p "$RUN" "$LOCAL_DIR/logs"
cleanup() {
  for name in web worker worker-2; do stop_process "$name" "$RUN"; done
  bench_stop_services
}
trap cleanup EXIT
bench_start_services sagline_bench 7 sagline-bench
export SAGLINE_DIST_DIR=.next-bench
export SAGLINE_RUN_DIR="$RUN"
build_web_if_needed "$SAGLINE_DIST_DIR"
# Two worker processes, one per core, as README's scaling section describes.
start_process worker "$RUN" "$LOCAL_DIR/logs/bench-worker.log" npx tsx workers/index.ts
start_process worker-2 "$RUN" "$LOCAL_DIR/logs/bench-worker-2.log" npx tsx workers/index.ts
bench_start_web "$RUN" "$LOCAL_DIR/logs/bench-web.log"
npx tsx tests/bench/pipeline.bench.ts
