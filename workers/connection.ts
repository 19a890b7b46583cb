import { Redis } from "ioredis";

import { getEnv } from "@/lib/env";

/** Worker connections block on Redis commands, so BullMQ needs maxRetriesPerRequest: null. */
export function createWorkerConnection(): Redis {
  return new Redis(getEnv().REDIS_URL, { maxRetriesPerRequest: null });
}

/** Producer connections fail fast instead of queueing commands while Redis is away. */
export function createProducerConnection(): Redis {
  return new Redis(getEnv().REDIS_URL, { maxRetriesPerRequest: 1, enableOfflineQueue: false });
}
