import { getSql } from "@/db/client";
import type { DispositionKind } from "@/db/schema";

import { timestampKey } from "./queue-sql";

/** An earlier decision on the same, unchanged member in an earlier submission of the same reference. */
export interface CarriedOver {
  dispositionId: string;
  kind: DispositionKind;
  justification: string | null;
  decidedByName: string;
  decidedAt: string;
  /** The earlier submission the decision was recorded on. */
  fromScheduleId: string;
  fromScheduleName: string;
}

export interface CarryOverProbe {
  scheduleId: string;
  mark: string;
  reference: string | null;
  inputHash: string | null;
  /** When this member's review row was written: only earlier submissions count. */
  queuedAt: string;
}

/** The public id of a disposition (its row id with the type prefix). */
export const toDispositionId = (rowId: number | string): string => `dsp_${rowId}`;

/**
 * For each probe, the latest disposition of the same mark with the same input hash in another,
 * earlier schedule of the same reference (or null). It is only shown, marked "carried over":
 * the member itself stays awaiting review until someone records a decision on it.
 * One query for the whole page; each lookup is an index probe (member_reviews_carry_over_idx).
 */
export async function readCarriedOver(organizationId: string, probes: readonly CarryOverProbe[]): Promise<(CarriedOver | null)[]> {
  const wanted = probes.map((p, n) => ({ n, schedule_id: p.scheduleId, mark: p.mark, reference: p.reference, input_hash: p.inputHash, queued_at: p.queuedAt }));
  if (!wanted.some((p) => p.reference !== null && p.input_hash !== null)) return probes.map(() => null);
  const sql = getSql();
  const rows = await sql`
    select x.n, d.id, d.kind, d.justification, d.decided_by_name, ${sql.unsafe(timestampKey("d.created_at"))} as decided_at, d.schedule_id, s.name as schedule_name
    from json_to_recordset(${JSON.stringify(wanted)}::json) as x(n int, schedule_id text, mark text, reference text, input_hash text, queued_at text)
    cross join lateral (
      select e.latest_disposition_id from member_reviews e
      where e.organization_id = ${organizationId} and x.reference is not null and e.reference = x.reference and e.mark = x.mark
        and e.input_hash = x.input_hash and e.schedule_id <> x.schedule_id and e.created_at < x.queued_at::timestamptz
        and e.latest_disposition_id is not null
      order by e.created_at desc limit 1) prior
    join member_dispositions d on d.id = prior.latest_disposition_id
    join schedules s on s.id = d.schedule_id`;
  const byProbe = new Map<number, CarriedOver>();
  for (const r of rows) {
    byProbe.set(r.n as number, {
      dispositionId: toDispositionId(r.id as string | number),
      kind: r.kind as DispositionKind,
      justification: (r.justification as string | null) ?? null,
      decidedByName: r.decided_by_name as string,
      decidedAt: r.decided_at as string,
      fromScheduleId: r.schedule_id as string,
      fromScheduleName: r.schedule_name as string,
    });
  }
  return probes.map((_, n) => byProbe.get(n) ?? null);
}
