import { getSql } from "@/db/client";
import { DomainError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import { describeActor, type DispositionActor, type DispositionInput } from "./disposition-input";
import { insertDispositionedEvents, type RecordedDisposition } from "./disposition-event";
import type { QueueFilter } from "./queue-filters";
import { queueWhere, timestampKey } from "./queue-sql";

/** One bulk action decides at most this many members: bounded work, and a number a person can vouch for. */
export const BULK_MAX_MEMBERS = 500;

/** How many members a bulk disposition over this filter would decide (only members awaiting review), up to BULK_MAX_MEMBERS + 1. */
export async function previewBulkDisposition(organizationId: string, filter: QueueFilter): Promise<{ count: number; overLimit: boolean }> {
  const sql = getSql();
  const [row] = await sql`
    select count(*)::int as count from (
      select 1 from member_reviews r where ${queueWhere(sql, organizationId, { ...filter, state: "awaiting_review" })} limit ${BULK_MAX_MEMBERS + 1}) x`;
  const count = row!.count as number;
  return { count: Math.min(count, BULK_MAX_MEMBERS), overLimit: count > BULK_MAX_MEMBERS };
}

/**
 * Decides every member awaiting review that matches the filter, in one transaction under one bulk
 * id: one disposition and one `member.dispositioned` event per member. `confirmedCount` is the
 * count the person saw in the preview; if the selection changed since (someone else decided a
 * member, a schedule finished), nothing is written and the answer is 409 with the new count.
 */
export async function applyBulkDisposition(
  organizationId: string,
  filter: QueueFilter,
  input: DispositionInput,
  actor: DispositionActor,
  confirmedCount: number,
): Promise<{ bulkId: string; count: number }> {
  const decidedByName = describeActor(actor);
  const bulkId = createId("bulk");
  return getSql().begin(async (tx) => {
    const selected = await tx`
      select r.schedule_id, r.member_index, r.mark, r.reference from member_reviews r
      where ${queueWhere(tx, organizationId, { ...filter, state: "awaiting_review" })}
      order by r.schedule_id, r.member_index
      limit ${BULK_MAX_MEMBERS + 1}
      for update of r`;
    if (selected.length > BULK_MAX_MEMBERS) {
      throw new DomainError("invalid_input", `A bulk disposition decides at most ${BULK_MAX_MEMBERS} members; narrow the filter.`, [{ pointer: "filter", message: `matches more than ${BULK_MAX_MEMBERS} members` }]);
    }
    if (selected.length === 0) throw new DomainError("conflict", "No member awaiting review matches this filter any more.");
    if (selected.length !== confirmedCount) {
      throw new DomainError("conflict", `The selection changed: it now holds ${selected.length} members, not the ${confirmedCount} you confirmed. Check the preview again.`, [], undefined, {
        currentCount: selected.length,
      });
    }
    const rows = selected.map((r) => ({ schedule_id: r.schedule_id as string, member_index: r.member_index as number, mark: r.mark as string }));
    const written = await tx`
      insert into member_dispositions (organization_id, schedule_id, member_index, mark, kind, justification, decided_by_user_id, decided_by_name, decided_by_api_key_id, bulk_id)
      select ${organizationId}, x.schedule_id, x.member_index, x.mark, ${input.kind}, ${input.justification},
        ${actor.kind === "user" ? actor.userId : null}, ${decidedByName}, ${actor.kind === "api_key" ? actor.apiKeyId : null}, ${bulkId}
      from json_to_recordset(${JSON.stringify(rows)}::json) as x(schedule_id text, member_index int, mark text)
      returning id, schedule_id, member_index, mark, ${tx.unsafe(timestampKey("created_at"))} as decided_at`;
    const decided = written.map((d) => ({ id: Number(d.id), schedule_id: d.schedule_id as string, member_index: d.member_index as number }));
    await tx`
      update member_reviews r set state = ${input.kind}, latest_disposition_id = x.id, updated_at = now()
      from json_to_recordset(${JSON.stringify(decided)}::json) as x(id bigint, schedule_id text, member_index int)
      where r.schedule_id = x.schedule_id and r.member_index = x.member_index`;
    const referenceOf = new Map(selected.map((r) => [`${r.schedule_id as string}\u0000${r.member_index as number}`, (r.reference as string | null) ?? null]));
    const recorded: RecordedDisposition[] = written.map((d) => ({
      rowId: d.id as string,
      organizationId,
      scheduleId: d.schedule_id as string,
      reference: referenceOf.get(`${d.schedule_id as string}\u0000${d.member_index as number}`) ?? null,
      mark: d.mark as string,
      kind: input.kind,
      justification: input.justification,
      decidedByName,
      decidedAt: d.decided_at as string,
      bulkId,
    }));
    await insertDispositionedEvents(tx, recorded);
    return { bulkId, count: recorded.length };
  });
}
