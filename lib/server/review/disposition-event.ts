import type { TransactionSql } from "postgres";

import type { DispositionKind } from "@/db/schema";
import { createId } from "@/lib/server/ids";
import type { MemberDispositionedPayload } from "@/lib/server/webhooks/events/simple-events";

import { toDispositionId } from "./carried-over";

export interface RecordedDisposition {
  rowId: string | number;
  organizationId: string;
  scheduleId: string;
  reference: string | null;
  mark: string;
  kind: DispositionKind;
  justification: string | null;
  decidedByName: string;
  decidedAt: string;
  bulkId: string | null;
}

/** The outbox payload of `member.dispositioned` for a recorded disposition. */
export function toDispositionedPayload(d: RecordedDisposition): MemberDispositionedPayload {
  return {
    dispositionId: toDispositionId(d.rowId),
    scheduleId: d.scheduleId,
    reference: d.reference,
    mark: d.mark,
    disposition: d.kind,
    by: d.decidedByName,
    note: d.justification,
    decidedAt: d.decidedAt,
    bulkId: d.bulkId,
  };
}

/** Writes one `member.dispositioned` outbox event per disposition, in the caller's transaction (one statement). */
export async function insertDispositionedEvents(tx: TransactionSql, recorded: readonly RecordedDisposition[]): Promise<void> {
  if (recorded.length === 0) return;
  const events = recorded.map((d) => ({ id: createId("evt"), organization_id: d.organizationId, payload: toDispositionedPayload(d) }));
  await tx`
    insert into outbox_events (id, organization_id, type, payload)
    select x.id, x.organization_id, 'member.dispositioned', x.payload
    from json_to_recordset(${JSON.stringify(events)}::json) as x(id text, organization_id text, payload jsonb)`;
}
