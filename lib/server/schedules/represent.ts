import type { ResultPageRow } from "@/db/queries/results";
import type { ScheduleRow } from "@/db/queries/schedules";
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

export function representResult(r: ResultPageRow) {
  return {
    mark: r.mark,
    category: r.category,
    status: r.status,
    governingCheck: r.governingCheck,
    utilization: r.utilization,
    factorOfSafety: r.factorOfSafety,
    limitRatio: r.limitRatio,
    achievedRatio: r.achievedRatio,
    /** Signed (+ downward) and allowed deflection of the governing check, mm. */
    deflectionMm: r.governingDeflectionMm,
    allowedDeflectionMm: r.allowedDeflectionMm,
    section: r.section,
    material: r.material,
    quantity: r.quantity,
    spansMm: r.spansMm,
    review: r.review ? { state: r.review.state } : null,
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

// limit_ratio, achieved_ratio (l/N) and notes follow the older columns, and the figures added since
// follow notes, so readers that go by position keep working. Lengths carry their unit in the name.
export const RESULT_CSV_HEADER = [
  "mark",
  "category",
  "status",
  "governing_check",
  "utilization",
  "factor_of_safety",
  "limit_ratio",
  "achieved_ratio",
  "notes",
  "deflection_mm",
  "allowed_deflection_mm",
  "section",
  "material",
  "quantity",
  "spans_mm",
  "review_state",
];

/** Rounded for reading, never for deciding: the stored figures stay full precision. */
function round(value: number | null, digits: number): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const factor = 10 ** digits;
  return Math.round(value * factor) / factor;
}

/** One results row as CSV (utilization 3 decimals, factor of safety 2, l/N whole, deflections 0.01 mm). */
export function formatResultCsvLine(r: ResultPageRow): string {
  return [
    r.mark,
    r.category,
    r.status,
    r.governingCheck,
    round(r.utilization, 3),
    round(r.factorOfSafety, 2),
    round(r.limitRatio, 0),
    round(r.achievedRatio, 0),
    r.notes.join("; "),
    round(r.governingDeflectionMm, 2),
    round(r.allowedDeflectionMm, 2),
    r.section,
    r.material,
    r.quantity,
    r.spansMm.map((mm) => round(mm, 1)).join(" "),
    r.review?.state ?? null,
  ]
    .map(formatCsvCell)
    .join(",");
}

/** The last line of every results CSV: the caution travels with the figures. */
export const RESULT_CSV_CAUTION_LINE = formatCsvCell(`# ${SAFETY_CAUTION}`);

export function resultsToCsv(rows: ResultPageRow[], withHeader: boolean): string {
  const lines = rows.map(formatResultCsvLine);
  return [...(withHeader ? [RESULT_CSV_HEADER.join(",")] : []), ...lines, RESULT_CSV_CAUTION_LINE].join("\r\n") + "\r\n";
}
