import type { QueueRow } from "./list-review-queue";

/** A queue row as the public API answers it (api-schemas/v1/review-queue-page.schema.json). */
export function representQueueRow(row: QueueRow) {
  const { memberIndex: _memberIndex, ...rest } = row;
  return { ...rest, memberUrl: `/api/v1/schedules/${encodeURIComponent(row.scheduleId)}/members/${encodeURIComponent(row.mark)}` };
}
