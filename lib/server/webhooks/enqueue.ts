import { getQueue, queueNames } from "@/workers/queues";

/** Natural job id: one job per delivery attempt, so queueing the same attempt twice queues it once. */
export function deliveryJobId(deliveryId: string, attemptNumber: number): string {
  return `${deliveryId}-${attemptNumber}`;
}

export interface DeliveryJob {
  deliveryId: string;
  attemptNumber: number;
  delayMs?: number;
}

// HTTP failures are scheduled by the handler itself (so Retry-After can be honoured); BullMQ's own
// retries only cover infrastructure errors such as a database restart during the handler.
const jobOptions = {
  attempts: 5,
  backoff: { type: "exponential" as const, delay: 2_000 },
  removeOnComplete: { age: 3_600, count: 10_000 },
  removeOnFail: { age: 7 * 24 * 3_600 },
};

/**
 * Queues delivery attempts. A job id BullMQ still holds would make the add a no-op, so an attempt
 * wanted now that waits as a delayed job is promoted, and a finished or failed one is cleared first.
 */
export async function enqueueDeliveries(jobs: DeliveryJob[]): Promise<void> {
  if (jobs.length === 0) return;
  const queue = getQueue(queueNames.deliverWebhook);
  // Callers pass distinct delivery ids, so the jobs' lookups are independent of each other.
  await Promise.all(
    jobs.map(async (job) => {
      const existing = await queue.getJob(deliveryJobId(job.deliveryId, job.attemptNumber));
      if (!existing) return;
      const state = await existing.getState();
      if (state === "delayed" && !job.delayMs) await existing.promote();
      else if (state === "completed" || state === "failed") await existing.remove();
    }),
  );
  await queue.addBulk(
    jobs.map((job) => ({
      name: "deliver-webhook",
      data: { deliveryId: job.deliveryId, attemptNumber: job.attemptNumber },
      opts: { ...jobOptions, jobId: deliveryJobId(job.deliveryId, job.attemptNumber), delay: job.delayMs ?? 0 },
    })),
  );
}
