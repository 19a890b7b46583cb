/**
 * The upload page's CSV work, in the browser: read the file strictly as UTF-8, split it with
 * papaparse using the delimiter the person chose, map their headers onto Sagline's columns, check
 * every row with the same row mapper the server uses, and write the mapped CSV to send.
 */
import Papa from "papaparse";

import { parseSchedule } from "@/lib/engine/intake";
import type { Material } from "@/lib/engine/materials";
import type { CatalogueSection, LimitProfile } from "@/lib/engine/model";
import { getPreset, listProfileLoadCases } from "@/lib/engine/presets";
import { QUANTITY_KIND_LABELS, SYSTEM_DEFAULT_UNITS, type QuantityKind, type UnitSystem } from "@/lib/engine/units";
import {
  CSV_DELIMITER_CHARS,
  CSV_ROW_LIMITS,
  createCsvRowMapper,
  findDelimiterInSingleColumnHeader,
  mapCsvRecordsToSchedule,
  mapIssueToCsvRow,
  readCsvRecords,
  stripBom,
  type CsvDelimiter,
  type CsvRecord,
  type CsvDelimiterName,
  type CsvRowError,
} from "@/lib/schedule-csv";
import { FIXED_COLUMNS, LOAD_COLUMNS, getColumnRole, splitHeader } from "@/lib/schedule-csv/columns";

export type DelimiterName = CsvDelimiterName;
export const DELIMITERS: Record<DelimiterName, { char: CsvDelimiter; label: string }> = {
  comma: { char: CSV_DELIMITER_CHARS.comma, label: "Comma ( , )" },
  semicolon: { char: CSV_DELIMITER_CHARS.semicolon, label: "Semicolon ( ; )" },
  tab: { char: CSV_DELIMITER_CHARS.tab, label: "Tab" },
};

export type { CsvRecord };

export type ParsedCsv = { ok: true; header: CsvRecord; records: CsvRecord[] } | { ok: false; errors: CsvRowError[] };

/** Decodes the file's bytes; anything but UTF-8 is refused (never silently replaced with "?"). */
export function decodeCsvBytes(bytes: ArrayBuffer): { ok: true; text: string } | { ok: false; message: string } {
  try {
    return { ok: true, text: stripBom(new TextDecoder("utf-8", { fatal: true }).decode(bytes)) };
  } catch {
    return { ok: false, message: "The file is not UTF-8 text. Save it as CSV UTF-8 from your spreadsheet program and choose it again." };
  }
}

/** A suggestion only: the delimiter seen most often on the first line. The person decides. */
export function suggestDelimiter(text: string): DelimiterName | null {
  const firstLine = text.split(/\r\n|\n|\r/, 1)[0] ?? "";
  const counts = (Object.keys(DELIMITERS) as DelimiterName[]).map((name) => ({ name, count: firstLine.split(DELIMITERS[name].char).length - 1 }));
  const best = counts.sort((a, b) => b.count - a.count)[0];
  return best && best.count > 0 ? best.name : null;
}

/**
 * Splits the text into records with their row and starting line: the same papaparse reading, with
 * the same limits and errors, as the server (lib/schedule-csv/read-csv-records.ts).
 */
export function parseCsvText(text: string, delimiter: DelimiterName): ParsedCsv {
  const records: CsvRecord[] = [];
  const read = readCsvRecords(text, DELIMITERS[delimiter].char, CSV_ROW_LIMITS, (record) => void records.push(record));
  if (!read.ok) return { ok: false, errors: [read.error] };
  const [header, ...rest] = records;
  if (!header || header.fields.every((f) => f.trim() === "")) return { ok: false, errors: [{ row: 1, line: 1, column: "", code: "empty_file", message: "the file has no header row" }] };
  return { ok: true, header, records: rest };
}

export interface HeaderInfo {
  index: number;
  original: string;
  /** The Sagline column the header already names, or null when the person must choose. */
  knownName: string | null;
  /** Unit written in the header's brackets. */
  headerUnit: string | null;
}

export function describeHeaders(fields: readonly string[]): HeaderInfo[] {
  return fields.map((original, index) => {
    const parts = splitHeader(original);
    const knownName = parts && parts.name !== "" && getColumnRole(parts.name) ? parts.name : null;
    return { index, original, knownName, headerUnit: parts?.unit ?? null };
  });
}

/** The quantity kind a Sagline column holds, or null for text, list and yes/no columns. */
export function getColumnKind(name: string): QuantityKind | null {
  return getColumnRole(name)?.spec.quantity ?? null;
}

const MAX_OFFERED_SPANS = 12;

/** Column names offered for an unknown header: fixed columns, spans, and loads for the preset's cases. */
export function listTargetColumns(presetId: string | null): { group: string; names: string[] }[] {
  const preset = presetId ? getPreset(presetId) : null;
  const cases = [...new Set(["dead", ...(preset ? listProfileLoadCases(preset) : ["live"])])];
  return [
    { group: "Member", names: Object.keys(FIXED_COLUMNS) },
    { group: "Spans", names: Array.from({ length: MAX_OFFERED_SPANS }, (_, i) => `span_${i + 1}`) },
    ...cases.map((c) => ({ group: `Loads, case ${c}`, names: Object.keys(LOAD_COLUMNS).map((load) => `${c}_${load}`) })),
  ];
}

export const IGNORE = "__ignore__";

export interface MappingChoices {
  /** Per header index: a Sagline column name, IGNORE, or "" (not chosen yet). */
  targets: Record<number, string>;
  /** Per header index: a unit for a quantity column whose header has none ("" = the schedule's default). */
  units: Record<number, string>;
  system: UnitSystem | null;
}

/** What the person picks per column; the unit system is chosen with the schedule options. */
export type ColumnChoices = Omit<MappingChoices, "system">;

export interface MappedHeader {
  header: string[];
  /** Original column index of each mapped column. */
  keep: number[];
  /** Mapped header text -> the person's own header, to name their column in messages. */
  originOf: Record<string, string>;
  problems: CsvRowError[];
}

/** Writes the header Sagline reads: `name [unit]` for each kept column, in the original order. */
export function buildMappedHeader(headers: HeaderInfo[], choices: MappingChoices): MappedHeader {
  const header: string[] = [];
  const keep: number[] = [];
  const originOf: Record<string, string> = {};
  const problems: CsvRowError[] = [];
  for (const h of headers) {
    const target = h.knownName ?? choices.targets[h.index] ?? "";
    if (target === IGNORE) continue;
    if (target === "") {
      problems.push({ row: 1, line: 1, column: h.original, code: "unmapped_column", message: `choose the Sagline column "${h.original}" holds, or Ignore` });
      continue;
    }
    const kind = getColumnKind(target);
    const unit = h.headerUnit ?? (kind ? choices.units[h.index] || null : null);
    if (kind && !unit && !choices.system) {
      problems.push({ row: 1, line: 1, column: h.original, code: "missing_unit", message: `choose a ${QUANTITY_KIND_LABELS[kind]} unit for "${h.original}", or a unit system` });
    }
    const text = unit ? `${target} [${unit}]` : target;
    header.push(text);
    keep.push(h.index);
    originOf[text] = h.original;
  }
  return { header, keep, originOf, problems };
}

export function describeDefaultUnit(kind: QuantityKind, system: UnitSystem | null): string {
  return system ? `${system} default (${SYSTEM_DEFAULT_UNITS[system][kind]})` : "choose a unit";
}

/** The organization's criteria the server reads the schedule with (catalogues in use, materials, profiles), as plain data. */
export interface UploadCriteria {
  catalogue: CatalogueSection[];
  materials: Material[];
  profiles: { id: string; profile: LimitProfile }[];
}

export interface ValidationInput {
  criteria?: UploadCriteria;
  parsed: Extract<ParsedCsv, { ok: true }>;
  mapped: MappedHeader;
  system: UnitSystem | null;
  presetId: string;
  name: string;
  reference: string;
}

export type ValidationResult = { ok: true; memberCount: number } | { ok: false; errors: CsvRowError[] };

/**
 * Every row through the server's row mapper, then the whole schedule through intake (the same
 * first checks the server makes); every problem is listed with row, line and column.
 */
export function validateSchedule({ criteria, parsed, mapped, system, presetId, name, reference }: ValidationInput): ValidationResult {
  const names = Object.keys(DELIMITERS) as DelimiterName[];
  const found = findDelimiterInSingleColumnHeader(parsed.header.fields, names.map((d) => DELIMITERS[d].char));
  const other = names.find((d) => DELIMITERS[d].char === found);
  if (other) {
    const message = `the header is a single column containing ${other === "tab" ? "tabs" : `"${DELIMITERS[other].char}"`}: choose ${DELIMITERS[other].label.toLowerCase()} as the delimiter`;
    return { ok: false, errors: [{ row: 1, line: 1, column: "", code: "wrong_delimiter", message }] };
  }
  if (mapped.problems.length > 0) return { ok: false, errors: mapped.problems };
  const width = parsed.header.fields.length;
  const units = system ? { system } : {};
  const created = createCsvRowMapper(mapped.header, { units });
  if (!created.ok) return { ok: false, errors: created.errors.map((e) => ({ ...e, line: parsed.header.line })) };
  const built = mapCsvRecordsToSchedule(
    parsed.records,
    (record, where) => {
      if (record.fields.every((f) => f.trim() === "")) return { ok: true, member: null };
      // Counted on the file as written: dropping ignored columns must not hide a short row.
      if (record.fields.length !== width) {
        return { ok: false, errors: [{ ...where, column: "", code: "field_count", message: `the row has ${record.fields.length} fields but the header has ${width}` }] };
      }
      return created.mapper.mapRow(mapped.keep.map((i) => record.fields[i] ?? ""), where);
    },
    // an organization profile (lp_...) or a preset, as the server reads the profile parameter
    { name, reference: reference || undefined, units, profile: presetId.startsWith("lp_") ? { id: presetId } : { preset: presetId } },
  );
  if (!built.ok) return { ok: false, errors: built.errors };
  const intake = parseSchedule(
    built.doc,
    criteria
      ? {
          catalogue: criteria.catalogue,
          organizationMaterials: new Map(criteria.materials.map((m) => [m.id, m])),
          organizationProfiles: new Map(criteria.profiles.map((p) => [p.id, p.profile])),
        }
      : {},
  );
  if (!intake.ok) return { ok: false, errors: intake.issues.map((issue) => mapIssueToCsvRow(issue, built.places)) };
  // One place per member.
  return { ok: true, memberCount: built.places.length };
}

/**
 * The server numbers the rows of the CSV it was sent; rows are kept one for one, so a row number
 * is the person's, but lines are taken from their file (dropped columns may have held line breaks).
 */
export function relineErrors<E extends { row?: number; line?: number }>(errors: E[], parsed: Extract<ParsedCsv, { ok: true }>): E[] {
  const lineOfRow = new Map<number, number>([[1, parsed.header.line], ...parsed.records.map((r): [number, number] => [r.row, r.line])]);
  return errors.map((e) => {
    const line = e.row === undefined ? undefined : lineOfRow.get(e.row);
    return line === undefined ? e : { ...e, line };
  });
}

/** The CSV that is sent: the mapped header and the kept columns, in the chosen delimiter. */
export function writeMappedCsv(parsed: Extract<ParsedCsv, { ok: true }>, mapped: MappedHeader, delimiter: DelimiterName): string {
  const rows = [mapped.header, ...parsed.records.map((r) => (r.fields.length === 1 && r.fields[0] === "" ? [""] : mapped.keep.map((i) => r.fields[i] ?? "")))];
  return Papa.unparse(rows, { delimiter: DELIMITERS[delimiter].char, newline: "\r\n", quotes: false, escapeFormulae: false }) + "\r\n";
}
