#!/usr/bin/env bash
# npm run stop: stops exactly what npm start started, by pid file and the servers' own commands.
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/processes.sh"
for name in web worker smtp-fake partner-fake; do stop_process "$name" "$LOCAL_DIR/run"; done
bash "$ROOT/docker-local/redis.sh" stop
bash "$ROOT/docker-local/postgres.sh" stop
log "stopped"
