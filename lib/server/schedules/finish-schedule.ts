import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";
import { createId } from "@/lib/server/ids";

/**
 * Marks the schedule completed once its last chunk is in, and writes `schedule.completed` to the
 * outbox in the same transaction, so the event exists exactly when the results do.
 */
export async function completeScheduleIfDone(tx: TransactionSql, scheduleId: string): Promise<boolean> {
  const [s] = await tx`
    select organization_id, status, chunks_done, chunk_count, member_count, checked_count, pass_count, fail_count, error_count
    from schedules where id = ${scheduleId} for no key update`;
  if (!s || s.status === "completed" || s.status === "failed" || s.chunks_done < s.chunk_count) return false;
  await tx`update schedules set status = 'completed', completed_at = now(), updated_at = now() where id = ${scheduleId}`;
  const payload = {
    scheduleId,
    status: "completed",
    counts: { members: s.member_count, checked: s.checked_count, passed: s.pass_count, failed: s.fail_count, errors: s.error_count },
  };
  await tx`insert into outbox_events (id, organization_id, type, payload) values (${createId("evt")}, ${s.organization_id}, 'schedule.completed', ${JSON.stringify(payload)}::jsonb)`;
  return true;
}

/** Ends a schedule with a reason, once, and writes `schedule.failed` to the outbox with it. */
export async function failSchedule(scheduleId: string, reason: string): Promise<void> {
  await getSql().begin(async (tx) => {
    const [s] = await tx`select organization_id, status from schedules where id = ${scheduleId} for no key update`;
    if (!s || s.status === "completed" || s.status === "failed") return;
    await tx`update schedules set status = 'failed', failure_reason = ${reason}, completed_at = now(), updated_at = now() where id = ${scheduleId}`;
    await tx`insert into outbox_events (id, organization_id, type, payload)
      values (${createId("evt")}, ${s.organization_id}, 'schedule.failed', ${JSON.stringify({ scheduleId, status: "failed", reason })}::jsonb)`;
  });
}
