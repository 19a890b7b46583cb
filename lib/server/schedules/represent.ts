import type { ResultRow, ScheduleRow } from "@/db/queries/schedules";
import { SAFETY_CAUTION } from "@/lib/safety";

export function scheduleLinks(id: string) {
  return { self: `/api/v1/schedules/${id}`, results: `/api/v1/schedules/${id}/results` };
}

/** The public JSON of a schedule: status, progress and counts. */
export function representSchedule(s: ScheduleRow) {
  return {
    id: s.id,
    name: s.name,
    reference: s.reference,
    status: s.status,
    failureReason: s.failureReason,
    source: s.source,
    limits: s.profile,
    progress: { members: s.memberCount, checked: s.checkedCount, fraction: s.memberCount === 0 ? 0 : s.checkedCount / s.memberCount },
    counts: { passed: s.passCount, failed: s.failCount, errors: s.errorCount },
    createdAt: s.createdAt.toISOString(),
    completedAt: s.completedAt?.toISOString() ?? null,
    links: scheduleLinks(s.id),
    caution: SAFETY_CAUTION,
  };
}

export function representResult(r: ResultRow) {
  return {
    mark: r.mark,
    category: r.category,
    status: r.status,
    governingCheck: r.governingCheck,
    utilization: r.utilization,
    factorOfSafety: r.factorOfSafety,
    limitRatio: r.limitRatio,
    achievedRatio: r.achievedRatio,
    pass: r.status === "pass",
    notes: r.notes,
  };
}

// OWASP CSV injection: a cell that a spreadsheet would read as a formula is prefixed with '.
function neutralise(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

function csvCell(value: string | number | boolean | null): string {
  if (value === null) return "";
  const text = typeof value === "string" ? neutralise(value) : String(value);
  return /[",\n\r]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

// limit_ratio, achieved_ratio (l/N) and notes follow the older columns, so readers that go by position keep working.
export const RESULT_CSV_HEADER = ["mark", "category", "status", "governing_check", "utilization", "factor_of_safety", "limit_ratio", "achieved_ratio", "notes"];

export function resultsToCsv(rows: ResultRow[], withHeader: boolean): string {
  const lines = rows.map((r) => [r.mark, r.category, r.status, r.governingCheck, r.utilization, r.factorOfSafety, r.limitRatio, r.achievedRatio, r.notes.join("; ")].map(csvCell).join(","));
  return (withHeader ? [RESULT_CSV_HEADER.join(","), ...lines] : lines).join("\r\n") + "\r\n";
}
