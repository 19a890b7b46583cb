#!/usr/bin/env bash
# npm run stop:production: stops the web and worker processes npm run start:production started
# (by pid file); the operator's PostgreSQL and Redis are left alone.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
RUN="${SAGLINE_RUN_DIR:-$LOCAL_DIR/run-production}"
for name in web worker; do stop_process "$name" "$RUN"; done
log "stopped the production web and worker processes"
