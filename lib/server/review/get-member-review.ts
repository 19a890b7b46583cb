import { getSql } from "@/db/client";
import type { DispositionKind, ReviewState } from "@/db/schema";

import { readCarriedOver, toDispositionId, type CarriedOver } from "./carried-over";
import { timestampKey } from "./queue-sql";

/** Most decisions listed for one member; a member decided more often than this shows the latest ones. */
export const HISTORY_MAX_ENTRIES = 100;

export interface HistoryEntry {
  id: string;
  kind: DispositionKind;
  justification: string | null;
  decidedByName: string;
  decidedAt: string;
  bulkId: string | null;
  /** True for an entry from an earlier submission of the same reference (unchanged member): shown, not applied. */
  carriedOver: boolean;
  /** The schedule the decision was recorded on (another one when carried over). */
  scheduleId: string;
}

/** A member's review: "not_required" for a member that passed (or is not checked yet). */
export interface MemberReview {
  state: ReviewState | "not_required";
  /** Newest first: this member's own decisions, then the one carried over from an earlier submission, if any. */
  history: HistoryEntry[];
}

function toCarriedEntry(c: CarriedOver): HistoryEntry {
  return { id: c.dispositionId, kind: c.kind, justification: c.justification, decidedByName: c.decidedByName, decidedAt: c.decidedAt, bulkId: null, carriedOver: true, scheduleId: c.fromScheduleId };
}

/** The review state and append-only history of one member of a schedule the caller has already found in its organization. */
export async function getMemberReview(organizationId: string, scheduleId: string, mark: string): Promise<MemberReview> {
  const sql = getSql();
  const [review] = await sql`
    select r.member_index, r.state, r.reference, r.input_hash, ${sql.unsafe(timestampKey("r.created_at"))} as queued_at
    from member_reviews r where r.organization_id = ${organizationId} and r.schedule_id = ${scheduleId} and r.mark = ${mark}`;
  if (!review) return { state: "not_required", history: [] };
  const own = await sql`
    select id, kind, justification, decided_by_name, ${sql.unsafe(timestampKey("created_at"))} as decided_at, bulk_id
    from member_dispositions where schedule_id = ${scheduleId} and member_index = ${review.member_index}
    order by id desc limit ${HISTORY_MAX_ENTRIES}`;
  const [carried] = await readCarriedOver(organizationId, [
    { scheduleId, mark, reference: (review.reference as string | null) ?? null, inputHash: (review.input_hash as string | null) ?? null, queuedAt: review.queued_at as string },
  ]);
  const history: HistoryEntry[] = own.map((d) => ({
    id: toDispositionId(d.id as string),
    kind: d.kind as DispositionKind,
    justification: (d.justification as string | null) ?? null,
    decidedByName: d.decided_by_name as string,
    decidedAt: d.decided_at as string,
    bulkId: (d.bulk_id as string | null) ?? null,
    carriedOver: false,
    scheduleId,
  }));
  if (carried) history.push(toCarriedEntry(carried));
  return { state: review.state as ReviewState, history };
}
