import { getSql } from "@/db/client";

import { enqueueChunks } from "./enqueue-chunks";

export const RECONCILE_AFTER_SECONDS = Number(process.env.RECONCILE_AFTER_SECONDS ?? 30);

/**
 * PostgreSQL is the source of truth: any unfinished schedule that has not moved for a while gets
 * its undone chunks queued again (natural job ids make this harmless when they are still queued),
 * so a flushed or restarted Redis never strands a schedule.
 */
export async function reconcileSchedules(): Promise<number> {
  const rows = await getSql()<{ schedule_id: string; chunk_index: number }[]>`
    select c.schedule_id, c.chunk_index
    from schedules s join schedule_chunks c on c.schedule_id = s.id
    where s.status in ('received', 'queued', 'checking') and c.done_at is null
      and s.updated_at < now() - make_interval(secs => ${RECONCILE_AFTER_SECONDS})
    order by s.created_at
    limit 5000`;
  const bySchedule = new Map<string, number[]>();
  for (const r of rows) bySchedule.set(r.schedule_id, [...(bySchedule.get(r.schedule_id) ?? []), r.chunk_index]);
  for (const [scheduleId, chunks] of bySchedule) {
    await enqueueChunks(scheduleId, chunks);
    await getSql()`update schedules set updated_at = now() where id = ${scheduleId}`;
  }
  return rows.length;
}
