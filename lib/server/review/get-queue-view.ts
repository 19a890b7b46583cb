import { countUnfinishedSchedules } from "@/db/queries/schedules";

import { listReviewQueue, type QueueRow } from "./list-review-queue";
import type { QueueQuery } from "./queue-filters";

export interface QueueView {
  rows: QueueRow[];
  nextCursor: string | null;
  /** Schedules still being checked: while any are, members keep entering the queue. */
  unfinishedSchedules: number;
}

/** One page of the review queue with what the live view needs to know how often to look again. */
export async function getQueueView(organizationId: string, query: QueueQuery, options: { limit: number; cursor?: string | null }): Promise<QueueView> {
  const [page, unfinishedSchedules] = await Promise.all([listReviewQueue(organizationId, query, options), countUnfinishedSchedules(organizationId)]);
  return { ...page, unfinishedSchedules };
}
