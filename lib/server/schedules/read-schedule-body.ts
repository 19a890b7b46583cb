import { mapIssueToCsvRow, type CsvDelimiter } from "@/lib/schedule-csv";
import { CsvEncodingError, parseScheduleCsvBytes } from "@/lib/schedule-csv/parse-schedule-csv-stream";
import type { InputIssue } from "@/lib/engine/model";
import { MAX_MEMBERS } from "@/lib/engine/intake";
import { DomainError, type FieldError } from "@/lib/server/errors";
import { decodeUtf8 } from "@/lib/server/http/read-body";
import { getRetiredFormatMessage } from "@/lib/engine/intake";
import { DELIMITERS, SCHEDULE_FORMAT, isDelimiterName } from "@/lib/vocabulary";

import { MAX_LISTED_ERRORS } from "./issue-pointers";
import { MemberTextError, scanScheduleJson } from "./scan-schedule-json";
import { throwInvalidSchedule } from "./submit-schedule";
import { findScheduleSchemaErrors } from "./validate-schedule-schema";

/** Checks a JSON document against the public JSON Schema; 422 listing the problems with their JSON pointers. */
export function assertMatchesScheduleSchema(doc: unknown): void {
  // A retired format is named as such, before its fields are read with the current meanings.
  const retired = getRetiredFormatMessage(doc);
  if (retired !== null) throw new DomainError("schedule_format_retired", retired, [{ pointer: "/format", message: retired }], undefined, { currentFormat: SCHEDULE_FORMAT });
  const found = findScheduleSchemaErrors(doc);
  if (found) throwInvalidSchedule(found.listed, found.total);
}

/**
 * A JSON schedule body, checked against the public JSON Schema. A valid body keeps its members as
 * their text in the body (scan-schedule-json.ts), read one at a time; a body the scan does not
 * follow, or one with a member that does not parse, is parsed whole so the error reads as usual.
 */
export function readScheduleJson(bytes: Uint8Array, what: "body" | "file"): unknown {
  const scanned = scanScheduleJson(bytes, MAX_MEMBERS);
  if (scanned) {
    try {
      assertMatchesScheduleSchema(scanned);
      return scanned;
    } catch (error) {
      if (!(error instanceof MemberTextError)) throw error;
    }
  }
  const doc = parseJsonBody(decodeUtf8(bytes, what));
  assertMatchesScheduleSchema(doc);
  return doc;
}

export function parseJsonBody(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new DomainError("bad_request", `The body is not valid JSON: ${(error as Error).message}.`);
  }
}

export interface CsvParameters {
  name: string;
  reference?: string;
  profile: unknown;
  delimiter: CsvDelimiter;
  units?: { system?: "SI" | "US" };
}


/** Reads CSV options from query parameters or form fields, naming the parameter that is wrong. */
export function readCsvParameters(get: (name: string) => string | null, fallbackName: string): CsvParameters {
  const errors: FieldError[] = [];
  // The delimiter by its name only, as the CLI's --delimiter takes it (docs/glossary.md).
  const delimiterText = get("delimiter") ?? "comma";
  const delimiter = isDelimiterName(delimiterText) ? DELIMITERS[delimiterText] : null;
  if (delimiter === null) errors.push({ pointer: "/query/delimiter", message: 'must be "comma", "semicolon" or "tab"' });
  const profile = get("profile");
  if (get("limits") !== null) errors.push({ pointer: "/query/limits", message: "was renamed: name the limit profile with profile=..., e.g. profile=ibc-2021-floor (CHANGELOG.md)" });
  else if (!profile) errors.push({ pointer: "/query/profile", message: "name the limit profile for the CSV schedule, e.g. profile=ibc-2021-floor, or an organization profile, profile=lp_..." });
  const system = get("units");
  if (system !== null && system !== "SI" && system !== "US") errors.push({ pointer: "/query/units", message: 'must be "SI" or "US"' });
  const name = (get("name") ?? fallbackName).trim();
  if (name.length === 0 || name.length > 200) errors.push({ pointer: "/query/name", message: "must be 1 to 200 characters" });
  if (errors.length > 0) throw new DomainError("bad_request", "Some CSV parameters are missing or wrong.", errors);
  const reference = get("reference") ?? undefined;
  // an organization profile's id (lp_...) or a preset's
  const named = profile!.startsWith("lp_") ? { id: profile! } : { preset: profile! };
  return { name, reference, profile: named, delimiter: delimiter!, units: system ? { system: system as "SI" | "US" } : undefined };
}

/**
 * Turns CSV bytes into a public-format document, read as a stream (bounded memory, row limits
 * enforced while reading); row errors carry row, line, column and a code.
 */
export async function readScheduleCsv(bytes: Uint8Array, parameters: CsvParameters) {
  let parsed: Awaited<ReturnType<typeof parseScheduleCsvBytes>>;
  try {
    parsed = await parseScheduleCsvBytes(bytes, { ...parameters, units: parameters.units ?? {} });
  } catch (error) {
    if (error instanceof CsvEncodingError) throw new DomainError("bad_request", error.message, [{ pointer: "/file", message: error.message }]);
    throw error;
  }
  if (!parsed.ok) {
    const errors: FieldError[] = parsed.errors.map((e) => ({ row: e.row, ...(e.line === undefined ? {} : { line: e.line }), column: e.column, code: e.code, message: e.message }));
    throwInvalidSchedule(errors.slice(0, MAX_LISTED_ERRORS), parsed.errorCount ?? errors.length);
  }
  const toFieldErrors = (issues: InputIssue[]): FieldError[] =>
    issues.map((issue) => {
      const e = mapIssueToCsvRow(issue, parsed.places);
      return { row: e.row, ...(e.line === undefined ? {} : { line: e.line }), column: e.column, code: e.code, message: e.message };
    });
  return { doc: parsed.doc, toFieldErrors };
}
