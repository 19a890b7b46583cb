import type { ResultPageRow } from "@/db/queries/results";
import type { ScheduleRow } from "@/db/queries/schedules";

import { listScheduleResults } from "./list-schedule-results";
import type { ResultQuery } from "./result-query";

/** Rows a dashboard page shows at once. */
export const RESULTS_PAGE_SIZE = 50;

export interface ScheduleLiveState {
  status: string;
  failureReason: string | null;
  members: number;
  checked: number;
  passed: number;
  failed: number;
  errors: number;
}

/** What the results view renders, as plain JSON: the server page's first render and the live route give the same shape. */
export interface ResultsView {
  schedule: ScheduleLiveState;
  rows: ResultPageRow[];
  page: number;
  pageCount: number;
  total: number;
  next: string | null;
  previous: string | null;
}

export function toLiveState(s: ScheduleRow): ScheduleLiveState {
  return { status: s.status, failureReason: s.failureReason, members: s.memberCount, checked: s.checkedCount, passed: s.passCount, failed: s.failCount, errors: s.errorCount };
}

export async function getResultsView(schedule: ScheduleRow, query: ResultQuery): Promise<ResultsView> {
  const page = await listScheduleResults(schedule, query, RESULTS_PAGE_SIZE);
  return { schedule: toLiveState(schedule), ...page };
}
