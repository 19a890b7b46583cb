#!/usr/bin/env bash
# npm run bench:dashboard: the same bootstrap as npm test on its own database and ports (no
# workers: the benchmark seeds a checked schedule itself), then tests/bench/dashboard.bench.ts.
# Stops only what it started: its own web process always, PostgreSQL and Redis when they were not
# already running.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
source "$(dirname "$0")/bench-env.sh"
cd "$ROOT"
RUN="$LOCAL_DIR/run-bench-dashboard"
mkdir -p "$RUN" "$LOCAL_DIR/logs"
cleanup() {
  stop_process web "$RUN"
  bench_stop_services
}
trap cleanup EXIT
bench_start_services sagline_bench_dashboard 8 sagline-bench-dashboard
export SAGLINE_DIST_DIR="${SAGLINE_DIST_DIR:-.next-bench}"
export SAGLINE_RUN_DIR="$RUN"
build_web_if_needed "$SAGLINE_DIST_DIR"
bench_start_web "$RUN" "$LOCAL_DIR/logs/bench-dashboard-web.log"
npx tsx tests/bench/dashboard.bench.ts
