import { Redis } from "ioredis";

import { getEnv } from "@/lib/env";

const globalForRedis = globalThis as unknown as { saglineRedis?: Redis };

/**
 * The web process's Redis connection (a producer): commands fail fast while Redis is down
 * instead of queueing in memory, so a request answers 503 rather than hanging.
 */
export function getRedis(): Redis {
  globalForRedis.saglineRedis ??= new Redis(getEnv().REDIS_URL, {
    enableOfflineQueue: false,
    maxRetriesPerRequest: 1,
    connectTimeout: 2_000,
    lazyConnect: false,
  });
  return globalForRedis.saglineRedis;
}

/** Resolves once the connection is ready (the producer queues nothing offline), or rejects after ms. */
export function waitForRedis(redis: Redis, ms: number): Promise<void> {
  if (redis.status === "ready") return Promise.resolve();
  return new Promise((resolve, reject) => {
    const onReady = () => {
      clearTimeout(timer);
      resolve();
    };
    const timer = setTimeout(() => {
      redis.off("ready", onReady);
      reject(new Error("Redis is not reachable"));
    }, ms);
    redis.once("ready", onReady);
  });
}
