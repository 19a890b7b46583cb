import { SCHEDULE_FORMAT } from "../engine/intake";
import type { InputIssue } from "../engine/model";
import { isCsvDelimiter, type CsvDelimiter } from "./delimiters";
import { createCsvRowMapper, type CsvMapperOptions, type CsvRowError, type CsvRowMapper, type PublicMember } from "./row-mapper";
import { tokenizeCsv } from "./tokenize-csv";

export interface ParseScheduleCsvOptions extends CsvMapperOptions {
  /** Field delimiter, taken from the caller and never guessed. Default ",". */
  delimiter?: CsvDelimiter;
  /** Schedule-level fields a CSV cannot carry. */
  name: string;
  reference?: string;
  /** The public `limits` block, e.g. { preset: "ibc-2021-floor" }. */
  limits: unknown;
}

export interface CsvRowPlace {
  row: number;
  line: number;
  /** Public field path -> the CSV header it came from (see mapIssueToCsvRow). */
  sources?: Record<string, string>;
}

export type ParseScheduleCsvResult =
  | { ok: true; doc: Record<string, unknown>; places: CsvRowPlace[] }
  | { ok: false; errors: CsvRowError[] };

/**
 * Reads a whole CSV schedule into a public-format document (for parseSchedule), with the row and
 * line each member came from. Every row error is collected.
 */
export function parseScheduleCsv(text: string, options: ParseScheduleCsvOptions): ParseScheduleCsvResult {
  const delimiter = options.delimiter ?? ",";
  if (!isCsvDelimiter(delimiter)) {
    return { ok: false, errors: [{ row: 0, column: "", code: "invalid_delimiter", message: 'the delimiter must be ",", ";" or a tab' }] };
  }
  const tokens = tokenizeCsv(text, delimiter);
  if (!tokens.ok) return { ok: false, errors: [{ row: 0, line: tokens.line, column: "", code: "unterminated_quote", message: tokens.message }] };
  const [header, ...records] = tokens.records;
  if (!header) return { ok: false, errors: [{ row: 1, line: 1, column: "", code: "empty_file", message: "the file has no header row" }] };
  const created = createCsvRowMapper(header.fields, options);
  if (!created.ok) return { ok: false, errors: created.errors.map((e) => ({ ...e, line: header.line })) };
  const rows = records.map((record, index) => ({ fields: record.fields, row: index + 2, line: record.line }));
  return mapCsvRecordsToSchedule(rows, (record, where) => created.mapper.mapRow(record.fields, where), {
    name: options.name,
    reference: options.reference,
    units: options.units ?? {},
    limits: options.limits,
  });
}

/** One data record of a CSV schedule: its fields, spreadsheet row and starting line. */
export interface CsvMemberRecord {
  fields: readonly string[];
  row: number;
  line: number;
}

export type MapCsvRecord = (record: CsvMemberRecord, where: { row: number; line: number }) => ReturnType<CsvRowMapper["mapRow"]>;

export interface CsvScheduleFields {
  name: string;
  /** Left out of the document when undefined. */
  reference?: string;
  units: NonNullable<CsvMapperOptions["units"]>;
  limits: unknown;
}

/**
 * Maps every data record to a member (blank records give none) and writes the public-format
 * document around them. Every row error is collected before giving up; a file without a single
 * member is an error of its own. Shared by parseScheduleCsv and the upload page, whose
 * `mapRecord` first checks the record against the file as the person wrote it.
 */
export function mapCsvRecordsToSchedule(records: Iterable<CsvMemberRecord>, mapRecord: MapCsvRecord, schedule: CsvScheduleFields): ParseScheduleCsvResult {
  const members: PublicMember[] = [];
  const places: CsvRowPlace[] = [];
  const errors: CsvRowError[] = [];
  for (const record of records) {
    const where = { row: record.row, line: record.line };
    const mapped = mapRecord(record, where);
    if (!mapped.ok) errors.push(...mapped.errors);
    else if (mapped.member) {
      members.push(mapped.member);
      places.push(mapped.sources ? { ...where, sources: mapped.sources } : where);
    }
  }
  if (errors.length > 0) return { ok: false, errors };
  if (members.length === 0) return { ok: false, errors: [{ row: 2, column: "", code: "no_rows", message: "the file has no member rows" }] };
  const doc: Record<string, unknown> = {
    format: SCHEDULE_FORMAT,
    name: schedule.name,
    ...(schedule.reference === undefined ? {} : { reference: schedule.reference }),
    units: schedule.units,
    limits: schedule.limits,
    members,
  };
  return { ok: true, doc, places };
}

/**
 * Re-addresses an intake issue on `members[i]...` to the CSV row the member came from; issues
 * outside the members (limits, units) keep row 0.
 */
export function mapIssueToCsvRow(issue: InputIssue, places: readonly CsvRowPlace[]): CsvRowError {
  const match = /^members\[(\d+)\]\.?(.*)$/.exec(issue.path);
  const place = match ? places[Number(match[1])] : undefined;
  if (!match || !place) return { row: 0, column: issue.path, code: "invalid_value", message: issue.message };
  const field = match[2] ?? "";
  const column = findSourceColumn(field, place.sources ?? {});
  const message = column === null || column.exact ? issue.message : `${field}: ${issue.message}`;
  return { row: place.row, line: place.line, column: column?.header ?? field, code: "invalid_value", message };
}

/** The header of the longest recorded field path that `field` equals or lies inside. */
function findSourceColumn(field: string, sources: Record<string, string>): { header: string; exact: boolean } | null {
  let best: string | null = null;
  for (const path of Object.keys(sources)) {
    const inside = field === path || field.startsWith(`${path}.`) || field.startsWith(`${path}[`);
    if (inside && (best === null || path.length > best.length)) best = path;
  }
  if (best === null) return null;
  const header = sources[best] ?? best;
  // A column that feeds several fields (a list of point loads) keeps the field in the message.
  const shared = Object.values(sources).filter((h) => h === header).length > 1;
  return { header, exact: best === field && !shared };
}
