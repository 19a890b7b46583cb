import { createOutcomeCounts, type Outcome, type OutcomeCounts } from "@/lib/vocabulary";

import { createEnvelope, type WebhookEnvelope } from "./event-types";

/** Rows carried in the event itself; beyond this the receiver follows the download link (or resultsUrl). */
export const RESULT_ROWS_CAP = 1_000;

export interface ResultRow {
  mark: string;
  /** The outcome: pass, fail, or error (the engine could not check the member; failureReason says why). */
  status: Outcome;
  /** The check's name ("live, span 1", "total, left overhang"), or "frequency" when the frequency governs. */
  governingCheck: string | null;
  utilization: number | null;
  factorOfSafety: number | null;
  /** The governing deflection check's limit l/N and achieved l/N; null when the frequency governs. */
  limitRatio: number | null;
  achievedRatio: number | null;
  /** Only on an errored row: why the check stopped. */
  failureReason?: string;
  /** Engine remarks (e.g. "gross section: cracking not included"), only when there are any. */
  notes?: string[];
}

export interface ScheduleCompletedData {
  scheduleId: string;
  name: string;
  reference: string | null;
  status: "completed";
  completedAt: string | null;
  counts: { members: number; checked: number } & OutcomeCounts;
  /** Failing and errored rows first (member order), then passing ones, up to rowLimit. */
  rows: ResultRow[];
  rowLimit: number;
  truncated: boolean;
  resultsUrl: string;
  /** Signed, expiring links to the full result table, no API key needed (result-download-link.ts). */
  download: ResultDownloadLinks;
}

export interface ResultDownloadLinks {
  csv: string;
  ndjson: string;
  expiresAt: string;
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

const OUTCOME_ORDER: Record<Outcome, number> = { fail: 0, error: 0, pass: 1 };

/**
 * schedule.completed: summary counts and up to RESULT_ROWS_CAP rows, every failing and errored row
 * before any passing one (member order within each), so a capped event never drops a failure for
 * a pass. `rows` may hold one more than the cap (the caller reads cap + 1 to learn whether there
 * are more) and should come in that order; they are put in it here regardless (a stable sort).
 */
export function buildScheduleCompletedEvent(input: {
  schedule: CompletedScheduleInput;
  rows: ResultRow[];
  appUrl: string;
  occurredAt: Date;
  download: ResultDownloadLinks;
}): WebhookEnvelope<ScheduleCompletedData> {
  const { schedule } = input;
  const truncated = input.rows.length > RESULT_ROWS_CAP || schedule.memberCount > RESULT_ROWS_CAP;
  const ordered = [...input.rows].sort((a, b) => OUTCOME_ORDER[a.status] - OUTCOME_ORDER[b.status]);
  const rows = ordered.slice(0, RESULT_ROWS_CAP).map((r) => ({
    mark: r.mark,
    status: r.status,
    governingCheck: r.governingCheck,
    utilization: toFiniteOrNull(r.utilization),
    factorOfSafety: toFiniteOrNull(r.factorOfSafety),
    limitRatio: toFiniteOrNull(r.limitRatio),
    achievedRatio: toFiniteOrNull(r.achievedRatio),
    ...(r.status === "error" && r.failureReason !== undefined ? { failureReason: r.failureReason } : {}),
    ...(r.notes !== undefined && r.notes.length > 0 ? { notes: r.notes } : {}),
  }));
  return createEnvelope("schedule.completed", input.occurredAt, {
    scheduleId: schedule.id,
    name: schedule.name,
    reference: schedule.reference,
    status: "completed",
    completedAt: schedule.completedAt ? schedule.completedAt.toISOString() : null,
    counts: { members: schedule.memberCount, checked: schedule.checkedCount, ...createOutcomeCounts(schedule.passCount, schedule.failCount, schedule.errorCount) },
    rows,
    rowLimit: RESULT_ROWS_CAP,
    truncated,
    resultsUrl: new URL(`/api/v1/schedules/${encodeURIComponent(schedule.id)}/results`, input.appUrl).toString(),
    download: input.download,
  });
}
