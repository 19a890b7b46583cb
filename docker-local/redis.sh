#!/usr/bin/env bash
# Starts (when down) the project's Redis on 127.0.0.1:$REDIS_PORT with its files under
# $LOCAL_DIR/redis. noeviction because BullMQ must never lose a job to memory pressure.
# A Redis already on the port is used only if it is this checkout's (its data folder is ours).
# Usage: redis.sh start | redis.sh stop
source "$(dirname "$0")/lib.sh"
RD="$LOCAL_DIR/redis"
redis_up() { timeout 3 redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1; }
redis_dir() { timeout 3 redis-cli -h 127.0.0.1 -p "$REDIS_PORT" config get dir 2>/dev/null | sed -n 2p; }
redis_is_ours() { [ "$(redis_dir)" = "$(cd "$RD" 2>/dev/null && pwd -P)" ]; }
taken() {
  echo "Redis: port $REDIS_PORT on 127.0.0.1 is taken by $1." >&2
  echo "Set SAGLINE_REDIS_PORT to a free port, e.g. SAGLINE_REDIS_PORT=$(free_port_near "$REDIS_PORT") npm start (and the same for npm run stop and npm test)." >&2
  exit 1
}
case "${1:-}" in
  start)
    mkdir -p "$RD"
    if redis_up; then
      redis_is_ours || taken "another Redis (data folder $(redis_dir || echo unknown); another checkout's?)"
    else
      port_taken "$REDIS_PORT" && taken "another program"
      log "starting Redis on 127.0.0.1:$REDIS_PORT"
      redis-server --port "$REDIS_PORT" --bind 127.0.0.1 --save '' --appendonly yes --appendfsync everysec \
        --maxmemory-policy noeviction --daemonize yes --dir "$RD" --pidfile "$RD/redis.pid" --logfile "$RD/redis.log"
      for _ in $(seq 1 50); do redis_up && break; sleep 0.1; done
      redis_up || { echo "Redis did not start; the end of $RD/redis.log:" >&2; tail -n 15 "$RD/redis.log" >&2; exit 1; }
    fi
    ;;
  stop)
    if redis_up; then
      if redis_is_ours; then log "stopping Redis"; redis-cli -h 127.0.0.1 -p "$REDIS_PORT" shutdown nosave >/dev/null 2>&1 || true
      else log "the Redis on port $REDIS_PORT is not this checkout's; left running"; fi
    fi
    ;;
  *) echo "usage: redis.sh start | stop" >&2; exit 64 ;;
esac
