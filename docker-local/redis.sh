#!/usr/bin/env bash
# Starts (when down) the project's Redis on 127.0.0.1:$REDIS_PORT with its files under
# $LOCAL_DIR/redis. noeviction because BullMQ must never lose a job to memory pressure.
# Usage: redis.sh start | redis.sh stop
source "$(dirname "$0")/lib.sh"
RD="$LOCAL_DIR/redis"
redis_up() { redis-cli -h 127.0.0.1 -p "$REDIS_PORT" ping >/dev/null 2>&1; }
case "${1:-}" in
  start)
    mkdir -p "$RD"
    if ! redis_up; then
      log "starting Redis on 127.0.0.1:$REDIS_PORT"
      redis-server --port "$REDIS_PORT" --bind 127.0.0.1 --save '' --appendonly yes --appendfsync everysec \
        --maxmemory-policy noeviction --daemonize yes --dir "$RD" --pidfile "$RD/redis.pid" --logfile "$RD/redis.log"
      for _ in $(seq 1 50); do redis_up && break; sleep 0.1; done
      redis_up || { echo "Redis did not start; see $RD/redis.log" >&2; exit 1; }
    fi
    ;;
  stop)
    if redis_up; then log "stopping Redis"; redis-cli -h 127.0.0.1 -p "$REDIS_PORT" shutdown nosave >/dev/null 2>&1 || true; fi
    ;;
  *) echo "usage: redis.sh start | stop" >&2; exit 64 ;;
esac
