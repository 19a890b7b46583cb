/**
 * Sagline's one vocabulary: the display names and formatters every surface imports (dashboard,
 * API representations, CSV export, webhook payloads, CLI). docs/glossary.md explains each name;
 * tests/contract/glossary-contract.test.ts fails when a surface says something else.
 */
import { SCHEDULE_FORMAT } from "./engine/intake/schedule-format";

export { SCHEDULE_FORMAT };

/** One glossary entry: the words people read, and the names in JSON, CSV, query strings and the CLI. */
export interface Term {
  /** On screen and in the CLI's table (sentence case where a heading starts with it). */
  label: string;
  /** JSON member name in the API, webhook payloads and the CLI's --json document. */
  json: string;
  /** CSV export column, when the idea is a column. */
  csv?: string;
  /** Query parameter of the API, when it is one. */
  query?: string;
  /** Command-line option of `npm run check`, when it is one. */
  cli?: string;
}

export const TERMS = {
  profile: { label: "Limit profile", json: "profile", query: "profile", cli: "--profile" },
  outcome: { label: "Outcome", json: "status", csv: "status", query: "status" },
  governingCheck: { label: "Governing check", json: "governingCheck", csv: "governing_check" },
  utilization: { label: "Utilization", json: "utilization", csv: "utilization" },
  factorOfSafety: { label: "Factor of safety", json: "factorOfSafety", csv: "factor_of_safety" },
  limitRatio: { label: "Limit", json: "limitRatio", csv: "limit_ratio" },
  achievedRatio: { label: "Achieved", json: "achievedRatio", csv: "achieved_ratio" },
  failureReason: { label: "Failure reason", json: "failureReason" },
  delimiter: { label: "Delimiter", json: "delimiter", query: "delimiter", cli: "--delimiter" },
  notes: { label: "Notes", json: "notes", csv: "notes" },
} as const satisfies Record<string, Term>;

/** A member's outcome: the same three words in results, filters, counts, CSV, webhooks and the CLI. */
export const OUTCOMES = ["pass", "fail", "error"] as const;
export type Outcome = (typeof OUTCOMES)[number];

/** The outcome words on screen: the same words, capitalised where they stand alone. */
export const OUTCOME_LABELS: Record<Outcome, string> = { pass: "Pass", fail: "Fail", error: "Error" };

export function isOutcome(value: unknown): value is Outcome {
  return typeof value === "string" && (OUTCOMES as readonly string[]).includes(value);
}

/** Outcome of a stored member: errored (the engine could not check it) is neither pass nor fail. */
export function getOutcome(row: { pass: boolean; error?: string | null }): Outcome {
  if (row.error !== undefined && row.error !== null) return "error";
  return row.pass ? "pass" : "fail";
}

/** Counts of a schedule, keyed by the outcome words (`counts.pass`, never `passed`). */
export type OutcomeCounts = Record<Outcome, number>;

export function createOutcomeCounts(pass: number, fail: number, error: number): OutcomeCounts {
  return { pass, fail, error };
}

/** "12 pass", "1 fail", "0 error": a count with its outcome word, as on the schedule page and in the CLI. */
export function formatOutcomeCount(count: number, outcome: Outcome): string {
  return `${count.toLocaleString("en-GB")} ${outcome}`;
}

/** CSV delimiters by their one name, in the API's `delimiter` query and the CLI's --delimiter alike. */
export const DELIMITERS = { comma: ",", semicolon: ";", tab: "\t" } as const;
export type DelimiterName = keyof typeof DELIMITERS;

export function isDelimiterName(value: unknown): value is DelimiterName {
  return typeof value === "string" && Object.hasOwn(DELIMITERS, value);
}

/** The governing check's key when the first natural frequency governs. */
export const FREQUENCY_CHECK_NAME = "frequency";

/**
 * What a span is called, from the public path it came from (`members[3].spans[1]` is "span 2",
 * `members[3].overhangs.left` is "left overhang"): spans count from 1 as the user wrote them,
 * overhangs are never counted as spans.
 */
export function getSpanLabel(origin: string | undefined, engineSpanIndex: number): string {
  if (origin !== undefined) {
    if (origin.endsWith(".overhangs.left")) return "left overhang";
    if (origin.endsWith(".overhangs.right")) return "right overhang";
    const match = /\.spans\[(\d+)\]$/.exec(origin);
    if (match) return `span ${Number(match[1]) + 1}`;
  }
  // No origin (an engine member built in code): the engine's own order, still counted from 1.
  return `span ${engineSpanIndex + 1}`;
}

/** The name of a deflection check, the same on every surface: "live, span 1", "total, left overhang". */
export function formatCheckName(combinationId: string, spanLabel: string): string {
  return `${combinationId}, ${spanLabel}`;
}

/** The check name of the engine's deflection check on span `engineSpanIndex`, given the member's span origins. */
export function nameDeflectionCheck(combinationId: string, engineSpanIndex: number, spanOrigins: readonly string[] | undefined): string {
  return formatCheckName(combinationId, getSpanLabel(spanOrigins?.[engineSpanIndex], engineSpanIndex));
}

/** The span part of a check name ("left overhang" of "live, left overhang"); the whole name when it has none. */
export function getSpanLabelOfCheck(checkName: string): string {
  const comma = checkName.indexOf(", ");
  return comma < 0 ? checkName : checkName.slice(comma + 2);
}

/** The governing check as shown: its name, or a dash when nothing was checked. */
export function formatGoverningCheck(name: string | null | undefined, empty = "—"): string {
  return name === null || name === undefined || name === "" ? empty : name;
}

/**
 * Hollow rectangles: `b` and `h` are the OUTER width and depth in JSON and CSV alike, `t` the
 * wall (common practice for hollow sections).
 */
export const HOLLOW_RECTANGLE_DIMENSIONS = { b: "outer width", h: "outer depth", t: "wall thickness" } as const;

/** Pagination: every list answers `links.next` (null on the last page) and a Link rel="next" header. */
export const NEXT_PAGE_FIELD = "links.next";
