/**
 * Streaming-friendly CSV mapping: check the header once, then map each data row to one member
 * of the public schedule format (every quantity written as {"value", "unit"} with the column's
 * unit), or to row errors naming row, line and column. The server and the upload page both feed
 * it the records papaparse splits (read-csv-records.ts), so both check every row the same way.
 */
import { QUANTITY_KIND_LABELS, SYSTEM_DEFAULT_UNITS, findUnit, type QuantityKind, type UnitSystem } from "../engine/units";
import { MAX_HEADER_CELL_CHARS, getColumnRole, splitHeader, type HeaderColumn } from "./columns";
import { findDelimiterInSingleColumnHeader } from "./delimiters";
import { mapGeometry, mapLoads, mapMaterial, mapReinforcement, mapSection, REINFORCEMENT_FIELD_NAMES, SECTION_COLUMNS, SECTION_FIELD_NAMES, type Cells } from "./map-member-fields";
import { parseCellBoolean, parseCellNumber, splitCellList } from "./row-values";
import { stripBom } from "./read-csv-records";

export interface CsvRowError {
  /** Spreadsheet row: the header is row 1, the first data row is row 2. */
  row: number;
  /** Physical line the record starts on (differs from row after quoted newlines). */
  line?: number;
  /** The header cell as written; "" for errors about the whole row. */
  column: string;
  code: string;
  message: string;
}

export interface CsvMapperOptions {
  /** Units for columns whose header has no [unit]: a system and/or per-kind units. */
  units?: { system?: UnitSystem } & Partial<Record<QuantityKind, string>>;
}

export type PublicMember = Record<string, unknown>;

export interface CsvRowMapper {
  columns: HeaderColumn[];
  /** Maps one data row; blank rows give `member: null`. */
  mapRow(
    fields: readonly string[],
    where: { row: number; line?: number },
  ): { ok: true; member: PublicMember | null; sources?: Record<string, string> } | { ok: false; errors: CsvRowError[] };
}

export type CreateMapperResult = { ok: true; mapper: CsvRowMapper } | { ok: false; errors: CsvRowError[] };

const REQUIRED_COLUMNS = ["mark", "category", "quantity", "material", "section", "span_1", "supports"];
function getDefaultUnit(options: CsvMapperOptions, kind: QuantityKind): string | undefined {
  const units = options.units ?? {};
  return units[kind] ?? (units.system ? SYSTEM_DEFAULT_UNITS[units.system][kind] : undefined);
}

/** Checks the header row: every column known, none twice, every quantity column with a valid unit. */
export function createCsvRowMapper(headerRow: readonly string[], options: CsvMapperOptions = {}): CreateMapperResult {
  const errors: CsvRowError[] = [];
  const columns: HeaderColumn[] = [];
  const seen = new Map<string, string>();
  const other = findDelimiterInSingleColumnHeader(headerRow, [";", "\t", ","]);
  if (other !== null) {
    const shown = other === "\t" ? "a tab" : `"${other}"`;
    return { ok: false, errors: [{ row: 1, column: "", code: "wrong_delimiter", message: `the header is a single column containing ${shown}: pass that delimiter (e.g. --delimiter ${other === "\t" ? "tab" : other})` }] };
  }
  headerRow.forEach((rawHeader, index) => {
    const header = index === 0 ? stripBom(rawHeader) : rawHeader;
    if (header.length > MAX_HEADER_CELL_CHARS) {
      const shown = `${header.trim().slice(0, 40)}...`;
      errors.push({ row: 1, column: shown, code: "header_too_long", message: `column ${index + 1}: the header "${shown}" is ${header.length} characters long; at most ${MAX_HEADER_CELL_CHARS}` });
      return;
    }
    const fail = (code: string, message: string) => errors.push({ row: 1, column: header, code, message });
    const parts = splitHeader(header);
    if (!parts || parts.name === "") return fail("invalid_header", `column ${index + 1}: header "${header}" is not a column name with an optional [unit]`);
    const known = getColumnRole(parts.name);
    if (!known) return fail("unknown_column", `unknown column "${parts.name}"; see the column list in docs/schedule-format.md`);
    const first = seen.get(parts.name);
    if (first !== undefined) return fail("duplicate_header", `column "${parts.name}" appears twice (also "${first}")`);
    seen.set(parts.name, header);
    const column: HeaderColumn = { index, header, name: parts.name, role: known.role, spec: known.spec };
    const kind = known.spec.quantity;
    if (kind) {
      const unit = parts.unit ?? getDefaultUnit(options, kind);
      if (unit === undefined || unit === "") {
        return fail("missing_unit", `column "${parts.name}" needs a ${QUANTITY_KIND_LABELS[kind]} unit: write "${parts.name} [${SYSTEM_DEFAULT_UNITS.SI[kind]}]" or pass a units option`);
      }
      const found = findUnit(kind, unit);
      if (!found.ok) return fail("unknown_unit", found.message);
      column.unit = unit;
    } else if (parts.unit !== null) {
      return fail("unexpected_unit", `column "${parts.name}" takes no unit`);
    }
    columns.push(column);
  });
  for (const name of REQUIRED_COLUMNS) {
    if (!seen.has(name) && !errors.some((e) => e.code === "duplicate_header")) {
      errors.push({ row: 1, column: "", code: "missing_column", message: `the "${name}" column is required` });
    }
  }
  for (const column of columns) {
    if (column.role.role === "span" && column.role.index > 1 && !seen.has(`span_${column.role.index - 1}`)) {
      errors.push({ row: 1, column: column.header, code: "missing_column", message: `span_${column.role.index} needs span_${column.role.index - 1}` });
    }
    if (column.role.role === "load") {
      const pair = { point: "point_at", point_at: "point", moment: "moment_at", moment_at: "moment" }[column.role.load as string];
      if (pair && !seen.has(`${column.role.loadCase}_${pair}`)) {
        errors.push({ row: 1, column: column.header, code: "missing_column", message: `${column.name} needs a ${column.role.loadCase}_${pair} column` });
      }
      if (column.role.load === "area_load" && !seen.has("tributary_width")) {
        errors.push({ row: 1, column: column.header, code: "missing_column", message: `${column.name} needs a tributary_width column` });
      }
    }
  }
  if (errors.length > 0) return { ok: false, errors };
  return { ok: true, mapper: { columns, mapRow: (fields, where) => mapRow(columns, headerRow.length, fields, where) } };
}

function mapRow(columns: HeaderColumn[], width: number, fields: readonly string[], where: { row: number; line?: number }) {
  const errors: CsvRowError[] = [];
  const at = where.line === undefined ? { row: where.row } : { row: where.row, line: where.line };
  const fail = (column: string, code: string, message: string) => errors.push({ ...at, column, code, message });
  if (fields.every((f) => f.trim() === "")) return { ok: true as const, member: null };
  if (fields.length !== width) {
    fail("", "field_count", `the row has ${fields.length} fields but the header has ${width}`);
    return { ok: false as const, errors };
  }
  const cells: Cells = new Map();
  for (const column of columns) {
    const text = (fields[column.index] ?? "").trim();
    if (text !== "") cells.set(column.name, { column, text });
  }
  const readText = (name: string) => cells.get(name)?.text;
  const readQuantity = (name: string) => {
    const cell = cells.get(name);
    if (!cell) return undefined;
    const parsed = parseCellNumber(cell.text);
    if (!parsed.ok) return void fail(cell.column.header, parsed.code, parsed.message);
    return { value: parsed.value, unit: cell.column.unit };
  };
  const readQuantityList = (name: string) => {
    const cell = cells.get(name);
    if (!cell) return undefined;
    const values: { value: number; unit: string | undefined }[] = [];
    for (const item of splitCellList(cell.text)) {
      const parsed = parseCellNumber(item);
      if (!parsed.ok) return void fail(cell.column.header, parsed.code, parsed.message);
      values.push({ value: parsed.value, unit: cell.column.unit });
    }
    return values;
  };
  const member: PublicMember = {};
  for (const name of REQUIRED_COLUMNS) {
    if (!cells.has(name)) fail(columns.find((c) => c.name === name)?.header ?? name, "missing_value", `${name} is required`);
  }
  const mark = readText("mark");
  if (mark !== undefined) member.mark = mark;
  const category = readText("category");
  if (category !== undefined) member.category = category;
  const quantityCell = cells.get("quantity");
  if (quantityCell) {
    const parsed = parseCellNumber(quantityCell.text);
    if (!parsed.ok || !Number.isInteger(parsed.value)) fail(quantityCell.column.header, "invalid_number", `"${quantityCell.text}" is not a whole number`);
    else member.quantity = parsed.value;
  }
  mapMaterial(cells, member, readQuantity, fail);
  mapSection(cells, member, readQuantity, fail);
  mapReinforcement(cells, member, readQuantity);
  mapGeometry(columns, cells, member, readQuantity, fail);
  const sources: Record<string, string> = {};
  mapLoads(columns, cells, member, readQuantity, readQuantityList, fail, sources);
  for (const [name, field] of [["self_weight", "selfWeight"], ["shear_deformation", "shearDeformation"]] as const) {
    const cell = cells.get(name);
    if (!cell) continue;
    const parsed = parseCellBoolean(cell.text);
    if (parsed.ok) member[field] = parsed.value;
    else fail(cell.column.header, parsed.code, parsed.message);
  }
  const notes = readText("notes");
  if (notes !== undefined) member.notes = notes;
  if (errors.length > 0) return { ok: false as const, errors };
  return { ok: true as const, member, sources: describeSources(cells, member, sources) };
}

const FIELD_COLUMNS: Record<string, string> = {
  mark: "mark",
  category: "category",
  quantity: "quantity",
  material: "material",
  "material.E": "e",
  "material.G": "g",
  "material.density": "density",
  creep: "creep",
  moistureCondition: "moisture_condition",
  section: "section",
  supports: "supports",
  selfWeight: "self_weight",
  shearDeformation: "shear_deformation",
  notes: "notes",
  "overhangs.left": "overhang_left",
  "overhangs.right": "overhang_right",
};

/**
 * Which header each public field of the member came from, so intake issues on
 * `members[i].spans[1]` can name the CSV column (span_2 [m]).
 */
function describeSources(cells: Cells, member: PublicMember, loadSources: Record<string, string>): Record<string, string> {
  const sources: Record<string, string> = { ...loadSources };
  const headerOf = (name: string) => cells.get(name)?.column.header;
  for (const [path, name] of Object.entries(FIELD_COLUMNS)) {
    const header = headerOf(name);
    if (header) sources[path] = header;
  }
  const section = member.section;
  if (typeof section === "object" && section !== null) {
    const shape = String((section as Record<string, unknown>).shape);
    for (const name of SECTION_COLUMNS) {
      const header = headerOf(name);
      if (header) sources[`section.${SECTION_FIELD_NAMES[shape]?.[name] ?? name}`] = header;
    }
  }
  for (const [name, field] of Object.entries(REINFORCEMENT_FIELD_NAMES)) {
    // A reinforced row with an empty cell still names the column it needs (top_steel, say).
    const header = headerOf(name) ?? (member.reinforcement !== undefined ? name : undefined);
    if (header) sources[`reinforcement.${field}`] = header;
  }
  if (member.reinforcement !== undefined) sources.reinforcement = headerOf("tension_steel") ?? headerOf("effective_depth") ?? "tension_steel";
  const spans = Array.isArray(member.spans) ? member.spans : [];
  spans.forEach((_, i) => {
    const header = headerOf(`span_${i + 1}`);
    if (header) sources[`spans[${i}]`] = header;
  });
  const stiffness = headerOf("spring_stiffness");
  if (stiffness && Array.isArray(member.supports)) member.supports.forEach((_, i) => (sources[`supports[${i}].stiffness`] = stiffness));
  return sources;
}

