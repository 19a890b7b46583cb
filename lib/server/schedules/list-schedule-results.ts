import { countResults, findPagePosition, getSortKey, listResultPage, type ResultPageRow } from "@/db/queries/results";
import type { ScheduleRow } from "@/db/queries/schedules";

import { encodeResultCursor, hasResultFilters, type ResultQuery } from "./result-query";

export interface ScheduleResultsPage {
  rows: ResultPageRow[];
  /** 1-based number of this page; approximate while the schedule runs (rows arrive in between). */
  page: number;
  pageCount: number;
  total: number;
  next: string | null;
  previous: string | null;
}

/**
 * Members matching a query: the schedule's own totals when nothing or only the outcome narrows it
 * (no count at all), otherwise one count over the schedule's rows.
 */
async function countMatching(schedule: ScheduleRow, query: ResultQuery): Promise<number> {
  const f = query.filters;
  if (!hasResultFilters(f)) return schedule.checkedCount;
  const onlyStatus = f.category === undefined && !f.awaitingReview && f.utilizationAbove === undefined && f.markPrefix === undefined;
  if (onlyStatus && f.status === "pass") return schedule.passCount;
  if (onlyStatus && f.status === "fail") return schedule.failCount;
  if (onlyStatus && f.status === "error") return schedule.errorCount;
  return countResults(schedule.id, f);
}

/** One page of a schedule's results with its neighbours' cursors and the page count. */
export async function listScheduleResults(schedule: ScheduleRow, query: ResultQuery, limit: number): Promise<ScheduleResultsPage> {
  const position = query.position ?? (query.page ? await findPagePosition(schedule.id, { sort: query.sort, filters: query.filters, limit, page: query.page }) : undefined);
  const [{ rows, hasMore }, total] = await Promise.all([
    listResultPage(schedule.id, { sort: query.sort, filters: query.filters, limit, position }),
    countMatching(schedule, query),
  ]);
  const pageCount = Math.max(1, Math.ceil(total / limit));
  const page = Math.min(position?.page ?? 1, pageCount);
  const first = rows[0];
  const last = rows.at(-1);
  // Read forwards, more rows means a next page; read backwards, it means a previous one.
  const back = position?.back === true;
  const moreAfter = back ? true : hasMore;
  const moreBefore = back ? hasMore : position !== undefined;
  const next = moreAfter && last ? encodeResultCursor({ sort: query.sort, key: getSortKey(last, query.sort), index: last.memberIndex, back: false, page: page + 1 }) : null;
  const previous =
    moreBefore && first && page > 1 ? encodeResultCursor({ sort: query.sort, key: getSortKey(first, query.sort), index: first.memberIndex, back: true, page: page - 1 }) : null;
  return { rows, page, pageCount, total, next, previous };
}
