import { defaultJobOptions, getQueue, queueNames } from "@/workers/queues";

/** Natural job ids (schedule and chunk), so queueing the same chunk twice queues it once. */
export function chunkJobId(scheduleId: string, chunkIndex: number): string {
  return `${scheduleId}-${chunkIndex}`;
}

export async function enqueueChunks(scheduleId: string, chunkIndexes: number[]): Promise<void> {
  if (chunkIndexes.length === 0) return;
  await getQueue(queueNames.checkMembers).addBulk(
    chunkIndexes.map((chunkIndex) => ({
      name: "check-members",
      data: { scheduleId, chunkIndex },
      // A chunk whose retries ran out is dropped from Redis, so the reconciler can queue it again;
      // PostgreSQL counts its attempts and fails the schedule past the limit.
      opts: { ...defaultJobOptions, attempts: 5, removeOnFail: true, jobId: chunkJobId(scheduleId, chunkIndex) },
    })),
  );
}
