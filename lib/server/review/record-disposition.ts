import { getSql } from "@/db/client";
import type { DispositionKind } from "@/db/schema";
import { DomainError } from "@/lib/server/errors";

import { toDispositionId } from "./carried-over";
import { describeActor, type DispositionActor, type DispositionInput } from "./disposition-input";
import { insertDispositionedEvents, type RecordedDisposition } from "./disposition-event";
import { timestampKey } from "./queue-sql";

export interface DispositionRecord {
  id: string;
  scheduleId: string;
  mark: string;
  kind: DispositionKind;
  justification: string | null;
  decidedByName: string;
  decidedAt: string;
  bulkId: string | null;
}

const SCHEDULE_ID = /^sch_[0-9a-z]{1,40}$/;
/** Marks are stored text: one PostgreSQL cannot hold (a NUL) or longer than intake allows cannot exist. */
const isPossibleMark = (mark: string) => mark.length > 0 && mark.length <= 1_000 && !mark.includes("\u0000");

/**
 * 404 unless the organization has this schedule with this member: checked before a body is read,
 * so another organization's ids answer exactly like missing ones whatever the body holds.
 */
export async function assertMemberExists(organizationId: string, scheduleId: string, mark: string): Promise<void> {
  if (!SCHEDULE_ID.test(scheduleId)) throw new DomainError("not_found", "The schedule was not found.");
  if (!isPossibleMark(mark)) throw new DomainError("not_found", "The member was not found.");
  const [schedule] = await getSql()`select exists (select 1 from schedule_chunks c where c.schedule_id = s.id and ${mark} = any(c.marks)) as has_member
    from schedules s where s.id = ${scheduleId} and s.organization_id = ${organizationId}`;
  if (!schedule) throw new DomainError("not_found", "The schedule was not found.");
  if (!schedule.has_member) throw new DomainError("not_found", `The schedule has no member "${mark.slice(0, 80)}".`);
}

/**
 * Records one disposition on a member of the organization's schedule: appends the decision (who,
 * when, what, why), moves the member's review state to it and writes `member.dispositioned` to the
 * outbox, all in one transaction. A member that passed has nothing to decide (409); another
 * organization's schedule reads as missing (404).
 */
export async function recordDisposition(organizationId: string, scheduleId: string, mark: string, input: DispositionInput, actor: DispositionActor): Promise<DispositionRecord> {
  if (!SCHEDULE_ID.test(scheduleId)) throw new DomainError("not_found", "The schedule was not found.");
  if (!isPossibleMark(mark)) throw new DomainError("not_found", "The member was not found.");
  const decidedByName = describeActor(actor);
  return getSql().begin(async (tx) => {
    const [review] = await tx`
      select r.member_index, r.reference from member_reviews r
      where r.organization_id = ${organizationId} and r.schedule_id = ${scheduleId} and r.mark = ${mark}
      for update of r`;
    if (!review) {
      const [schedule] = await tx`select status, exists (select 1 from schedule_chunks c where c.schedule_id = s.id and ${mark} = any(c.marks)) as has_member
        from schedules s where s.id = ${scheduleId} and s.organization_id = ${organizationId}`;
      if (!schedule) throw new DomainError("not_found", "The schedule was not found.");
      if (!schedule.has_member) throw new DomainError("not_found", `The schedule has no member "${mark.slice(0, 80)}".`);
      throw new DomainError("conflict", `Member "${mark.slice(0, 80)}" is not in review: it passed every check, or has not been checked yet.`);
    }
    const [row] = await tx`
      insert into member_dispositions (organization_id, schedule_id, member_index, mark, kind, justification, decided_by_user_id, decided_by_name, decided_by_api_key_id)
      values (${organizationId}, ${scheduleId}, ${review.member_index}, ${mark}, ${input.kind}, ${input.justification},
        ${actor.kind === "user" ? actor.userId : null}, ${decidedByName}, ${actor.kind === "api_key" ? actor.apiKeyId : null})
      returning id, ${tx.unsafe(timestampKey("created_at"))} as decided_at`;
    await tx`update member_reviews set state = ${input.kind}, latest_disposition_id = ${row!.id}, updated_at = now()
      where schedule_id = ${scheduleId} and member_index = ${review.member_index}`;
    const recorded: RecordedDisposition = {
      rowId: row!.id as string,
      organizationId,
      scheduleId,
      reference: (review.reference as string | null) ?? null,
      mark,
      kind: input.kind,
      justification: input.justification,
      decidedByName,
      decidedAt: row!.decided_at as string,
      bulkId: null,
    };
    await insertDispositionedEvents(tx, [recorded]);
    return { id: toDispositionId(recorded.rowId), scheduleId, mark, kind: input.kind, justification: input.justification, decidedByName, decidedAt: recorded.decidedAt, bulkId: null };
  });
}
