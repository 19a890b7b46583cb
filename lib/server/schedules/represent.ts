import type { ResultRow, ScheduleRow } from "@/db/queries/schedules";
import { SAFETY_CAUTION } from "@/lib/safety";
import { createOutcomeCounts } from "@/lib/vocabulary";

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
    profile: s.profile,
    progress: { members: s.memberCount, checked: s.checkedCount, fraction: s.memberCount === 0 ? 0 : s.checkedCount / s.memberCount },
    counts: createOutcomeCounts(s.passCount, s.failCount, s.errorCount),
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
    notes: r.notes,
  };
}

/**
 * OWASP CSV injection: text a spreadsheet could read as a formula (= + - @, tab, CR) is prefixed
 * with '. Not only at the cell's start: a reader that splits on ; or tab, or ignores quoted line
 * breaks, starts a cell after any of those, so a trigger after one is prefixed too.
 */
export function neutraliseFormulaText(text: string): string {
  let out = "";
  let cellStart = true;
  for (const char of text) {
    if (cellStart && FORMULA_TRIGGERS.has(char)) out += "'";
    out += char;
    cellStart = CELL_STARTERS.has(char);
  }
  return out;
}

const FORMULA_TRIGGERS = new Set(["=", "+", "-", "@", "\t", "\r"]);
// After these, some reader starts a new cell: the delimiters and line breaks.
const CELL_STARTERS = new Set([",", ";", "\t", "\r", "\n"]);

/** One exported cell: numbers as written, text neutralised and quoted when it holds , ; tab, quote or a line break. */
export function formatCsvCell(value: string | number | boolean | null): string {
  if (value === null) return "";
  const text = typeof value === "string" ? neutraliseFormulaText(value) : String(value);
  return /[",;\t\n\r]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

// limit_ratio, achieved_ratio (l/N) and notes follow the older columns, so readers that go by position keep working.
export const RESULT_CSV_HEADER = ["mark", "category", "status", "governing_check", "utilization", "factor_of_safety", "limit_ratio", "achieved_ratio", "notes"];

export function resultsToCsv(rows: ResultRow[], withHeader: boolean): string {
  const lines = rows.map((r) => [r.mark, r.category, r.status, r.governingCheck, r.utilization, r.factorOfSafety, r.limitRatio, r.achievedRatio, r.notes.join("; ")].map(formatCsvCell).join(","));
  return (withHeader ? [RESULT_CSV_HEADER.join(","), ...lines] : lines).join("\r\n") + "\r\n";
}
