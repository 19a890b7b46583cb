import { getSql } from "@/db/client";

import { enqueueChunks } from "./enqueue-chunks";
import { completeScheduleIfDone } from "./finish-schedule";

export const RECONCILE_AFTER_SECONDS = Number(process.env.RECONCILE_AFTER_SECONDS ?? 30);

/**
 * PostgreSQL is the source of truth: any unfinished schedule that has not moved for a while (no
 * chunk finished, not re-queued) gets its undone chunks queued again (natural job ids make this
 * harmless when they are still queued), so a flushed or restarted Redis never strands a schedule.
 * One whose chunks are all done but that is not completed (its last worker died between the
 * chunk's commit and the completion) is completed here.
 */
export async function reconcileSchedules(): Promise<number> {
  const sql = getSql();
  const stalled = sql`
    select s.id from schedules s
    where s.status in ('received', 'queued', 'checking')
      and greatest(s.updated_at, (select max(done_at) from schedule_chunks where schedule_id = s.id)) < now() - make_interval(secs => ${RECONCILE_AFTER_SECONDS})`;
  const finished = await sql<{ id: string }[]>`
    select id from (${stalled}) t where not exists (select 1 from schedule_chunks c where c.schedule_id = t.id and c.done_at is null)`;
  for (const { id } of finished) await completeScheduleIfDone(id);
  const rows = await sql<{ schedule_id: string; chunk_index: number }[]>`
    select c.schedule_id, c.chunk_index
    from schedule_chunks c join schedules s on s.id = c.schedule_id
    where c.schedule_id in (${stalled}) and c.done_at is null
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
