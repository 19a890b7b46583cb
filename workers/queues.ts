import { Queue, type JobsOptions } from "bullmq";

import { getEnv } from "@/lib/env";

import { createProducerConnection } from "./connection";

/** One queue per workload class, each with its own concurrency. */
export const queueNames = {
  checkMembers: "check-members",
  deliverWebhook: "deliver-webhook",
  accountMail: "account-mail",
} as const;

export type QueueName = (typeof queueNames)[keyof typeof queueNames];

const globalForQueues = globalThis as unknown as { saglineQueues?: Map<string, Queue> };

/** The producer side of a queue, shared per process. */
export function getQueue(name: QueueName): Queue {
  globalForQueues.saglineQueues ??= new Map();
  let queue = globalForQueues.saglineQueues.get(name);
  if (!queue) {
    queue = new Queue(name, { connection: createProducerConnection(), prefix: getEnv().REDIS_PREFIX });
    queue.on("error", (error) => console.error(`[sagline] queue ${name}:`, error.message));
    globalForQueues.saglineQueues.set(name, queue);
  }
  return queue;
}

export const defaultJobOptions: JobsOptions = {
  attempts: 8,
  backoff: { type: "exponential", delay: 1_000 },
  removeOnComplete: { age: 3_600, count: 10_000 },
  removeOnFail: { age: 7 * 24 * 3_600 },
};

export async function closeQueues(): Promise<void> {
  const queues = [...(globalForQueues.saglineQueues?.values() ?? [])];
  globalForQueues.saglineQueues = undefined;
  await Promise.all(queues.map((q) => q.close()));
}
