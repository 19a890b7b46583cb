import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";
import { getChunkTotals } from "@/db/queries/schedules";
import { createId } from "@/lib/server/ids";

/** Writes the chunk totals onto the schedule's row (inside the transaction that ends it). */
async function writeFinalTotals(tx: TransactionSql, scheduleId: string) {
  const totals = await getChunkTotals(tx, scheduleId);
  await tx`
    update schedules set chunks_done = ${totals.chunks_done}, checked_count = ${totals.checked_count}, pass_count = ${totals.pass_count},
      fail_count = ${totals.fail_count}, error_count = ${totals.error_count}
    where id = ${scheduleId}`;
  return totals;
}

/**
 * Marks the schedule completed once every chunk is in, with its totals, and writes
 * `schedule.completed` to the outbox in the same transaction, so the event exists exactly when
 * the results do. Called after each chunk commits; only the caller that finds no open chunk
 * locks the schedule's row, and the lock lets one of two racing last chunks complete it.
 */
export async function completeScheduleIfDone(scheduleId: string): Promise<boolean> {
  const sql = getSql();
  // Cheap first look, without a lock: most chunks are not the last one.
  const [open] = await sql`select exists (select 1 from schedule_chunks where schedule_id = ${scheduleId} and done_at is null) as any_open`;
  if (open!.any_open) return false;
  return sql.begin(async (tx) => {
    const [s] = await tx`select organization_id, status, member_count from schedules where id = ${scheduleId} for no key update`;
    if (!s || s.status === "completed" || s.status === "failed") return false;
    const totals = await writeFinalTotals(tx, scheduleId);
    await tx`update schedules set status = 'completed', completed_at = now(), updated_at = now() where id = ${scheduleId}`;
    const payload = {
      scheduleId,
      status: "completed",
      counts: { members: s.member_count, checked: totals.checked_count, passed: totals.pass_count, failed: totals.fail_count, errors: totals.error_count },
    };
    await tx`insert into outbox_events (id, organization_id, type, payload) values (${createId("evt")}, ${s.organization_id}, 'schedule.completed', ${JSON.stringify(payload)}::jsonb)`;
    return true;
  });
}

/** Ends a schedule with a reason, once, and writes `schedule.failed` to the outbox with it. */
export async function failSchedule(scheduleId: string, reason: string): Promise<void> {
  await getSql().begin(async (tx) => {
    const [s] = await tx`select organization_id, status from schedules where id = ${scheduleId} for no key update`;
    if (!s || s.status === "completed" || s.status === "failed") return;
    await writeFinalTotals(tx, scheduleId);
    await tx`update schedules set status = 'failed', failure_reason = ${reason}, completed_at = now(), updated_at = now() where id = ${scheduleId}`;
    await tx`insert into outbox_events (id, organization_id, type, payload)
      values (${createId("evt")}, ${s.organization_id}, 'schedule.failed', ${JSON.stringify({ scheduleId, status: "failed", reason })}::jsonb)`;
  });
}
