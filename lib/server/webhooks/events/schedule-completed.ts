import { createEnvelope, type WebhookEnvelope } from "./event-types";

/** Rows carried in the event itself; beyond this the receiver follows resultsUrl. */
export const RESULT_ROWS_CAP = 1_000;

export interface ResultRow {
  mark: string;
  /** `combinationId@spanIndex`, or "frequency" when the frequency governs. */
  governingCheck: string | null;
  utilization: number | null;
  factorOfSafety: number | null;
  /** The governing deflection check's limit l/N and achieved l/N; null when the frequency governs. */
  limitRatio: number | null;
  achievedRatio: number | null;
  pass: boolean;
  /** Engine remarks (e.g. "gross section: cracking not included"), only when there are any. */
  notes?: string[];
}

export interface ScheduleCompletedData {
  scheduleId: string;
  name: string;
  reference: string | null;
  status: "completed";
  completedAt: string | null;
  counts: { members: number; checked: number; passed: number; failed: number; errors: number };
  rows: ResultRow[];
  rowLimit: number;
  truncated: boolean;
  resultsUrl: string;
}

export interface CompletedScheduleInput {
  id: string;
  name: string;
  reference: string | null;
  completedAt: Date | null;
  memberCount: number;
  checkedCount: number;
  passCount: number;
  failCount: number;
  errorCount: number;
}

// JSON has no Infinity or NaN; a non-finite ratio (e.g. a factor of safety with zero deflection) is sent as null.
function toFiniteOrNull(value: number | null): number | null {
  return value !== null && Number.isFinite(value) ? value : null;
}

/**
 * schedule.completed: summary counts and up to RESULT_ROWS_CAP pass/fail rows in member order;
 * `rows` may hold one more than the cap (the caller reads cap + 1 to learn whether there are more).
 */
export function buildScheduleCompletedEvent(input: {
  schedule: CompletedScheduleInput;
  rows: ResultRow[];
  appUrl: string;
  occurredAt: Date;
}): WebhookEnvelope<ScheduleCompletedData> {
  const { schedule } = input;
  const truncated = input.rows.length > RESULT_ROWS_CAP || schedule.memberCount > RESULT_ROWS_CAP;
  const rows = input.rows.slice(0, RESULT_ROWS_CAP).map((r) => ({
    mark: r.mark,
    governingCheck: r.governingCheck,
    utilization: toFiniteOrNull(r.utilization),
    factorOfSafety: toFiniteOrNull(r.factorOfSafety),
    limitRatio: toFiniteOrNull(r.limitRatio),
    achievedRatio: toFiniteOrNull(r.achievedRatio),
    pass: r.pass,
    ...(r.notes !== undefined && r.notes.length > 0 ? { notes: r.notes } : {}),
  }));
  return createEnvelope("schedule.completed", input.occurredAt, {
    scheduleId: schedule.id,
    name: schedule.name,
    reference: schedule.reference,
    status: "completed",
    completedAt: schedule.completedAt ? schedule.completedAt.toISOString() : null,
    counts: {
      members: schedule.memberCount,
      checked: schedule.checkedCount,
      passed: schedule.passCount,
      failed: schedule.failCount,
      errors: schedule.errorCount,
    },
    rows,
    rowLimit: RESULT_ROWS_CAP,
    truncated,
    resultsUrl: new URL(`/api/v1/schedules/${encodeURIComponent(schedule.id)}/results`, input.appUrl).toString(),
  });
}
