import type { TransactionSql } from "postgres";

import { nameGoverningCheck, type Outcome } from "@/lib/server/schedules/check-chunk";

/**
 * Puts every member of a checked chunk that did not pass (failed or errored) in the review queue,
 * inside the transaction that writes its outcomes: the queue is complete exactly when results are.
 * One statement per chunk. `inputs` are the chunk's members as stored, in outcome order.
 *
 * The input hash covers what the member was checked with: its input (normalised through jsonb),
 * the schedule's units and limits, and the resolved profile. Name and reference are left out, so
 * a revision that only renames the schedule still finds its unchanged members.
 */
export async function insertMemberReviews(tx: TransactionSql, scheduleId: string, firstMember: number, outcomes: readonly Outcome[], inputs: readonly unknown[]): Promise<number> {
  const rows = outcomes
    .filter((o) => o.error !== null || o.result?.pass !== true)
    .map((o) => ({
      member_index: o.index,
      mark: o.mark,
      category: o.category,
      outcome: o.error !== null || !o.result ? "error" : "fail",
      governing_check: nameGoverningCheck(o),
      // JSON has no Infinity; a non-finite utilization is stored as null (sorted last, like errors).
      utilization: Number.isFinite(o.result?.governingCheck?.utilization) ? o.result!.governingCheck!.utilization : null,
      input: inputs[o.index - firstMember] ?? null,
    }));
  if (rows.length === 0) return 0;
  const written = await tx`
    insert into member_reviews (schedule_id, member_index, organization_id, project_id, reference, mark, category, outcome, governing_check, utilization, input_hash)
    select s.id, x.member_index, s.organization_id, s.project_id, s.reference, x.mark, x.category, x.outcome, x.governing_check, x.utilization,
      encode(sha256(convert_to(((s.header - 'name' - 'reference')::text || s.profile::text || (x.input::jsonb)::text), 'UTF8')), 'hex')
    from schedules s
    cross join json_to_recordset(${JSON.stringify(rows)}::json)
      as x(member_index int, mark text, category text, outcome text, governing_check text, utilization double precision, input json)
    where s.id = ${scheduleId}
    on conflict (schedule_id, member_index) do nothing`;
  return written.count;
}
