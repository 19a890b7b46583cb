import { getSql } from "@/db/client";
import { defaultJobOptions, getQueue, queueNames } from "@/workers/queues";

/** BullMQ's largest job priority (lower runs first). */
const MAX_PRIORITY = 2_097_152;

/** Natural job ids (schedule and chunk), so queueing the same chunk twice queues it once. */
export function chunkJobId(scheduleId: string, chunkIndex: number): string {
  return `${scheduleId}-${chunkIndex}`;
}

/**
 * How many unchecked chunks the schedule's organization has queued ahead of it (its unfinished
 * schedules submitted earlier). Fairness between organizations rests on this: a chunk's priority
 * is the work its own organization queued before it, so an organization with a flood queued waits
 * behind its own flood, and another organization's small schedule goes to the front.
 */
async function countChunksAheadInOrganization(scheduleId: string): Promise<number> {
  const [row] = await getSql()`
    select count(c.chunk_index)::int as ahead
    from schedules s
    join schedules o on o.organization_id = s.organization_id and o.status in ('received', 'queued', 'checking')
      and (o.created_at, o.id) < (s.created_at, s.id)
    join schedule_chunks c on c.schedule_id = o.id and c.done_at is null
    where s.id = ${scheduleId}`;
  return (row?.ahead as number | undefined) ?? 0;
}

/**
 * Queues chunks with priority 1 + (the organization's chunks ahead) + (position in this schedule),
 * which serves organizations in turn by the work each has waiting (open-source BullMQ priorities,
 * no paid groups), and each organization's schedules in the order they came.
 */
export async function enqueueChunks(scheduleId: string, chunkIndexes: number[]): Promise<void> {
  if (chunkIndexes.length === 0) return;
  const ahead = await countChunksAheadInOrganization(scheduleId);
  await getQueue(queueNames.checkMembers).addBulk(
    chunkIndexes.map((chunkIndex, position) => ({
      name: "check-members",
      data: { scheduleId, chunkIndex },
      // A chunk whose retries ran out is dropped from Redis, so the reconciler can queue it again;
      // PostgreSQL counts its attempts and fails the schedule past the limit.
      opts: {
        ...defaultJobOptions,
        attempts: 5,
        removeOnFail: true,
        jobId: chunkJobId(scheduleId, chunkIndex),
        priority: Math.min(MAX_PRIORITY, 1 + ahead + position),
      },
    })),
  );
}
