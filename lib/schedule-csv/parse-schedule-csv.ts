import { MAX_MEMBERS, SCHEDULE_FORMAT } from "../engine/intake";
import type { InputIssue } from "../engine/model";
import { createLazyMembers } from "../schedule-members/lazy-members";
import { CompactRows } from "./compact-rows";
import { isCsvDelimiter, type CsvDelimiter } from "./delimiters";
import { readCsvRecords, type CsvReadResult, type CsvRecordLimits, type CsvRecordSink } from "./read-csv-records";
import { createCsvRowMapper, type CsvMapperOptions, type CsvRowError, type CsvRowMapper, type PublicMember } from "./row-mapper";

export interface ParseScheduleCsvOptions extends CsvMapperOptions {
  /** Field delimiter, taken from the caller and never guessed. Default ",". */
  delimiter?: CsvDelimiter;
  /** Schedule-level fields a CSV cannot carry. */
  name: string;
  reference?: string;
  /** The public `profile` block, e.g. { preset: "ibc-2021-floor" }. */
  profile: unknown;
}

export interface CsvRowPlace {
  row: number;
  line: number;
  /** Public field path -> the CSV header it came from (see mapIssueToCsvRow). */
  sources?: Record<string, string>;
}

export type ParseScheduleCsvResult =
  | { ok: true; doc: Record<string, unknown>; places: CsvRowPlace[] }
  /** `errorCount` counts every error when `errors` keeps only the first MAX_KEPT_ROW_ERRORS. */
  | { ok: false; errors: CsvRowError[]; errorCount?: number };

/** Row errors kept in full; later ones are only counted. */
export const MAX_KEPT_ROW_ERRORS = 1000;

/** Rows a schedule CSV may have: the header, a member per row, and as many blank rows again. */
export const CSV_ROW_LIMITS: CsvRecordLimits = { maxRows: 2 * MAX_MEMBERS + 1, maxFilledRows: MAX_MEMBERS + 1 };

/**
 * Reads a whole CSV schedule into a public-format document (for parseSchedule), with the row and
 * line each member came from. Row errors are collected (the first MAX_KEPT_ROW_ERRORS kept).
 */
export function parseScheduleCsv(text: string, options: ParseScheduleCsvOptions): ParseScheduleCsvResult {
  const delimiter = options.delimiter ?? ",";
  if (!isCsvDelimiter(delimiter)) return invalidDelimiter();
  const reader = createScheduleCsvReader(options);
  return reader.finish(readCsvRecords(text, delimiter, CSV_ROW_LIMITS, reader.sink));
}

export function invalidDelimiter(): ParseScheduleCsvResult {
  return { ok: false, errors: [{ row: 0, column: "", code: "invalid_delimiter", message: 'the delimiter must be ",", ";" or a tab' }] };
}

/**
 * The record sink behind parseScheduleCsv and the streaming server reader: the first record is
 * the header (checked once), each later one becomes a member; only members and errors are kept.
 */
export function createScheduleCsvReader(options: ParseScheduleCsvOptions, keep: MemberKeeping = {}): { sink: CsvRecordSink; finish(read: CsvReadResult): ParseScheduleCsvResult } {
  let headerLine: number | null = null;
  let headerErrors: CsvRowError[] = [];
  let collector: ReturnType<typeof createScheduleCollector> | null = null;
  const sink: CsvRecordSink = (record) => {
    if (headerLine === null) {
      headerLine = record.line;
      if (record.fields.every((f) => f.trim() === "")) {
        headerErrors = [{ row: 1, line: record.line, column: "", code: "empty_file", message: "the file has no header row (the first row is blank)" }];
        return false;
      }
      const created = createCsvRowMapper(record.fields, options);
      if (!created.ok) {
        headerErrors = created.errors.map((e) => ({ ...e, line: record.line }));
        return false;
      }
      const mapper = created.mapper;
      collector = createScheduleCollector((r, where) => mapper.mapRow(r.fields, where), { name: options.name, reference: options.reference, units: options.units ?? {}, profile: options.profile }, keep);
      return true;
    }
    collector?.add(record);
    return true;
  };
  const finish = (read: CsvReadResult): ParseScheduleCsvResult => {
    if (!read.ok) return { ok: false, errors: [read.error] };
    if (headerLine === null) return { ok: false, errors: [{ row: 1, line: 1, column: "", code: "empty_file", message: "the file has no header row" }] };
    if (headerErrors.length > 0 || !collector) return { ok: false, errors: headerErrors };
    return collector.finish();
  };
  return { sink, finish };
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
  profile: unknown;
}

/**
 * How members are kept until intake. By default as objects; with `compactCapacityBytes` (the
 * body's byte length) as their CSV fields in a byte arena (compact-rows.ts), handed out as a lazy
 * array that maps a row again whenever its member is read, so a valid body costs about its own
 * size again rather than a tree of member objects.
 */
export interface MemberKeeping {
  compactCapacityBytes?: number;
}

/**
 * Maps data records to members one at a time (blank records give none) and writes the
 * public-format document around them. Once a row has failed, members are no longer kept, only
 * errors (the first MAX_KEPT_ROW_ERRORS) and their count; a file without a single member is an
 * error of its own.
 */
export function createScheduleCollector(mapRecord: MapCsvRecord, schedule: CsvScheduleFields, keep: MemberKeeping = {}) {
  let members: PublicMember[] = [];
  const compact = keep.compactCapacityBytes === undefined ? null : new CompactRows(keep.compactCapacityBytes);
  let places: CsvRowPlace[] = [];
  const errors: CsvRowError[] = [];
  let errorCount = 0;
  // Rows with the same filled columns have equal field->header maps: keep one of each, not one per row.
  const sharedSources = new Map<string, Record<string, string>>();
  const share = (sources: Record<string, string>) => {
    const key = JSON.stringify(sources);
    const known = sharedSources.get(key);
    if (known) return known;
    sharedSources.set(key, sources);
    return sources;
  };
  return {
    add(record: CsvMemberRecord): void {
      const where = { row: record.row, line: record.line };
      const mapped = mapRecord(record, where);
      if (!mapped.ok) {
        errorCount += mapped.errors.length;
        errors.push(...mapped.errors.slice(0, Math.max(0, MAX_KEPT_ROW_ERRORS - errors.length)));
        members = [];
        places = [];
        compact?.clear();
      } else if (mapped.member && errorCount === 0) {
        if (compact) compact.push(record.fields);
        else members.push(mapped.member);
        places.push(mapped.sources ? { ...where, sources: share(mapped.sources) } : where);
      }
    },
    finish(): ParseScheduleCsvResult {
      if (errorCount > 0) return { ok: false, errors, errorCount };
      const memberCount = compact ? compact.count : members.length;
      if (memberCount === 0) return { ok: false, errors: [{ row: 2, column: "", code: "no_rows", message: "the file has no member rows" }] };
      const doc: Record<string, unknown> = {
        format: SCHEDULE_FORMAT,
        name: schedule.name,
        ...(schedule.reference === undefined ? {} : { reference: schedule.reference }),
        units: schedule.units,
        profile: schedule.profile,
        members: compact ? createLazyCsvMembers(compact, places, mapRecord) : members,
      };
      return { ok: true, doc, places };
    },
  };
}

function createLazyCsvMembers(rows: CompactRows, places: readonly CsvRowPlace[], mapRecord: MapCsvRecord): unknown[] {
  const memberAt = (index: number) => {
    const { row, line } = places[index]!;
    const mapped = mapRecord({ fields: rows.fields(index), row, line }, { row, line });
    // The same fields mapped the first time; anything else is a defect, not bad input.
    if (!mapped.ok || !mapped.member) throw new Error(`CSV row ${row} no longer maps to a member`);
    return mapped.member;
  };
  return createLazyMembers({
    count: rows.count,
    memberAt,
    chunkText: (first, last) => JSON.stringify(Array.from({ length: last - first }, (_, i) => memberAt(first + i))),
    // The reader refuses NUL characters, and no mapped field adds one.
    mayHoldNulEscape: () => false,
  });
}

/** Every record through createScheduleCollector; the upload page's `mapRecord` first checks the record against the file as written. */
export function mapCsvRecordsToSchedule(records: Iterable<CsvMemberRecord>, mapRecord: MapCsvRecord, schedule: CsvScheduleFields): ParseScheduleCsvResult {
  const collector = createScheduleCollector(mapRecord, schedule);
  for (const record of records) collector.add(record);
  return collector.finish();
}

/**
 * Re-addresses an intake issue on `members[i]...` to the CSV row the member came from; issues
 * outside the members (profile, units) keep row 0.
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
