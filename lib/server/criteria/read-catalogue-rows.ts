import { normaliseSectionName } from "@/lib/engine/sections";
import type { CatalogueSection } from "@/lib/engine/model";
import { readCsvRecords } from "@/lib/schedule-csv/read-csv-records";
import type { FieldError } from "@/lib/server/errors";
import { MAX_LISTED_ERRORS } from "@/lib/server/schedules/issue-pointers";

/** The most sections one catalogue holds: the suggestion tries them in order for every failing member. */
export const MAX_CATALOGUE_SECTIONS = 2000;
export const MAX_SECTION_NAME_CHARS = 100;

/** Catalogue fields, units in their names (internal units: mm^4, mm^2, kg/m). */
export const CATALOGUE_FIELDS = ["name", "iMm4", "areaMm2", "massKgPerM", "shearAreaMm2"] as const;
type CatalogueField = (typeof CATALOGUE_FIELDS)[number];
const REQUIRED_FIELDS: readonly CatalogueField[] = ["name", "iMm4", "areaMm2", "massKgPerM"];
const NUMBER_FIELDS: readonly Exclude<CatalogueField, "name">[] = ["iMm4", "areaMm2", "massKgPerM", "shearAreaMm2"];
const FIELD_UNITS: Record<Exclude<CatalogueField, "name">, string> = { iMm4: "mm^4", areaMm2: "mm^2", massKgPerM: "kg/m", shearAreaMm2: "mm^2" };

export type CatalogueRowsResult = { ok: true; sections: CatalogueSection[] } | { ok: false; errors: FieldError[]; errorCount: number };

/** Collects errors up to the cap and counts the rest, so a hostile file costs linear work only. */
class ErrorList {
  readonly errors: FieldError[] = [];
  count = 0;
  add(error: FieldError): void {
    this.count += 1;
    if (this.errors.length < MAX_LISTED_ERRORS) this.errors.push(error);
  }
}

/** Where a value came from: a CSV row and column, or a JSON pointer. */
type Place = (field: string) => Pick<FieldError, "row" | "column" | "pointer">;

function readNumberValue(raw: unknown, field: Exclude<CatalogueField, "name">, place: Place, errors: ErrorList): number | undefined | null {
  if (raw === undefined || raw === null || (typeof raw === "string" && raw.trim() === "")) {
    if (field === "shearAreaMm2") return undefined;
    errors.add({ ...place(field), code: "missing_value", message: `is required: a positive number in ${FIELD_UNITS[field]}` });
    return null;
  }
  const value = typeof raw === "number" ? raw : typeof raw === "string" && /^[+]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(raw.trim()) ? Number(raw.trim()) : Number.NaN;
  if (!Number.isFinite(value) || value <= 0) {
    errors.add({ ...place(field), code: "invalid_number", message: `must be a positive number in ${FIELD_UNITS[field]}, got ${JSON.stringify(typeof raw === "string" ? raw.slice(0, 40) : raw)}` });
    return null;
  }
  return value;
}

/**
 * Checks one row's values and, when all are good, returns the section. Names are unique on
 * normaliseSectionName (case and spaces ignored): the second spelling names the first's row.
 */
function readSectionRow(values: Record<string, unknown>, place: Place, firstByKey: Map<string, string>, describeFirst: (at: string) => string, at: string, errors: ErrorList): CatalogueSection | null {
  const before = errors.count;
  const rawName = values.name;
  const name = typeof rawName === "string" ? rawName.trim() : "";
  if (name === "") errors.add({ ...place("name"), code: "missing_value", message: "is required: the section's name" });
  else if (name.length > MAX_SECTION_NAME_CHARS) errors.add({ ...place("name"), code: "too_long", message: `must be at most ${MAX_SECTION_NAME_CHARS} characters` });
  else {
    const key = normaliseSectionName(name);
    const first = firstByKey.get(key);
    if (first !== undefined) errors.add({ ...place("name"), code: "duplicate_name", message: `"${name}" is the same name as ${describeFirst(first)} (names are compared with case and spaces ignored)` });
    else firstByKey.set(key, at);
  }
  const numbers: Partial<Record<Exclude<CatalogueField, "name">, number | undefined | null>> = {};
  for (const field of NUMBER_FIELDS) numbers[field] = readNumberValue(values[field], field, place, errors);
  if (errors.count > before) return null;
  return {
    name,
    iMm4: numbers.iMm4!,
    areaMm2: numbers.areaMm2!,
    massKgPerM: numbers.massKgPerM!,
    ...(numbers.shearAreaMm2 === undefined || numbers.shearAreaMm2 === null ? {} : { shearAreaMm2: numbers.shearAreaMm2 }),
  };
}

function finish(sections: CatalogueSection[], errors: ErrorList): CatalogueRowsResult {
  if (errors.count > 0) return { ok: false, errors: errors.errors, errorCount: errors.count };
  if (sections.length === 0) return { ok: false, errors: [{ message: "the catalogue has no sections" }], errorCount: 1 };
  return { ok: true, sections };
}

/**
 * Reads a catalogue CSV: a header row naming the columns (name, iMm4, areaMm2, massKgPerM and
 * optionally shearAreaMm2; case-insensitive), one section per row. Every problem names its
 * spreadsheet row (header = 1) and column; blank rows are skipped.
 */
export function readCatalogueCsv(text: string): CatalogueRowsResult {
  const errors = new ErrorList();
  const sections: CatalogueSection[] = [];
  const firstByKey = new Map<string, string>();
  let columns: (CatalogueField | null)[] = [];
  let headerOk = true;
  const read = readCsvRecords(text, ",", { maxRows: MAX_CATALOGUE_SECTIONS * 2 + 1, maxFilledRows: MAX_CATALOGUE_SECTIONS + 1 }, (record) => {
    if (record.row === 1) {
      const byLower = new Map(CATALOGUE_FIELDS.map((f) => [f.toLowerCase(), f]));
      columns = record.fields.map((cell) => byLower.get(cell.trim().toLowerCase()) ?? null);
      record.fields.forEach((cell, index) => {
        if (columns[index] === null) errors.add({ row: 1, column: cell.trim().slice(0, 80) || `column ${index + 1}`, code: "unknown_column", message: `unknown column; columns: ${CATALOGUE_FIELDS.join(", ")}` });
      });
      for (const field of REQUIRED_FIELDS) if (!columns.includes(field)) errors.add({ row: 1, column: field, code: "missing_column", message: `the header needs a ${field} column` });
      headerOk = errors.count === 0;
      return headerOk;
    }
    if (record.fields.every((cell) => cell.trim() === "")) return;
    const values: Record<string, unknown> = {};
    columns.forEach((field, index) => {
      if (field !== null) values[field] = record.fields[index];
    });
    const place: Place = (field) => ({ row: record.row, column: field });
    const section = readSectionRow(values, place, firstByKey, (first) => `row ${first}`, String(record.row), errors);
    if (section) sections.push(section);
  });
  if (!read.ok) errors.add({ row: read.error.row, column: read.error.column, code: read.error.code, message: read.error.message });
  return finish(sections, errors);
}

/** Reads a catalogue as a JSON array of sections (the example file's format); problems carry JSON pointers under `pointerBase`. */
export function readCatalogueJson(value: unknown, pointerBase: string): CatalogueRowsResult {
  const errors = new ErrorList();
  if (!Array.isArray(value) || value.length > MAX_CATALOGUE_SECTIONS) {
    errors.add({ pointer: pointerBase, message: `must be an array of 1 to ${MAX_CATALOGUE_SECTIONS} sections` });
    return finish([], errors);
  }
  const sections: CatalogueSection[] = [];
  const firstByKey = new Map<string, string>();
  value.forEach((entry: unknown, index) => {
    const at = `${pointerBase}/${index}`;
    if (typeof entry !== "object" || entry === null || Array.isArray(entry)) {
      errors.add({ pointer: at, row: index + 1, message: "must be an object with name, iMm4, areaMm2, massKgPerM and optionally shearAreaMm2" });
      return;
    }
    const values = entry as Record<string, unknown>;
    for (const key of Object.keys(values)) {
      if (!(CATALOGUE_FIELDS as readonly string[]).includes(key)) errors.add({ pointer: `${at}/${key.slice(0, 80)}`, row: index + 1, column: key.slice(0, 80), message: `unknown field; fields: ${CATALOGUE_FIELDS.join(", ")}` });
    }
    if (values.name !== undefined && typeof values.name !== "string") {
      errors.add({ pointer: `${at}/name`, row: index + 1, column: "name", message: "must be a string" });
      return;
    }
    for (const field of NUMBER_FIELDS) {
      if (values[field] !== undefined && typeof values[field] !== "number") {
        errors.add({ pointer: `${at}/${field}`, row: index + 1, column: field, message: `must be a number in ${FIELD_UNITS[field]}` });
        return;
      }
    }
    const place: Place = (field) => ({ pointer: `${at}/${field}`, row: index + 1, column: field });
    const section = readSectionRow(values, place, firstByKey, (first) => first, at, errors);
    if (section) sections.push(section);
  });
  return finish(sections, errors);
}
