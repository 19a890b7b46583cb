/** Maps the cells of one CSV row onto public-format member fields (see row-mapper.ts). */
import type { HeaderColumn } from "./columns";
import type { PublicMember } from "./row-mapper";
import { parseCellNumber, splitCellList } from "./row-values";

const SHAPE_COLUMNS: Record<string, string[]> = {
  rectangle: ["b", "h"],
  hollow_rectangle: ["b", "h", "t"],
  round: ["d"],
  tube: ["d", "t"],
  i_plate: ["bf", "tf", "d", "tw"],
  explicit: ["second_moment", "area", "shear_area"],
  tee: ["bf", "hf", "bw", "h"],
};
export const SECTION_COLUMNS = ["b", "h", "t", "d", "bf", "tf", "tw", "hf", "bw", "area", "second_moment", "shear_area"];
/** CSV reinforcement column -> public `reinforcement` field (reinforced concrete). */
export const REINFORCEMENT_FIELD_NAMES: Record<string, string> = {
  tension_steel: "tensionSteel",
  effective_depth: "effectiveDepth",
  compression_steel: "compressionSteel",
  compression_depth: "compressionDepth",
  top_steel: "topSteel",
  top_depth: "topDepth",
  steel_e: "steelE",
};
const CUSTOM_MATERIAL_COLUMNS = ["e", "g", "density"];

/** CSV section column -> public section field, per shape (columns not listed keep their name). */
export const SECTION_FIELD_NAMES: Record<string, Record<string, string>> = {
  hollow_rectangle: { b: "b", h: "h", t: "t" },
  tube: { d: "D", t: "t" },
  explicit: { second_moment: "I", area: "A", shear_area: "shearArea" },
};

export type Cells = Map<string, { column: HeaderColumn; text: string }>;
export type ReadQuantity = (name: string) => { value: number; unit: string | undefined } | undefined;
export type ReadQuantityList = (name: string) => { value: number; unit: string | undefined }[] | undefined;
export type Fail = (column: string, code: string, message: string) => void;

export function mapMaterial(cells: Cells, member: PublicMember, readQuantity: ReadQuantity, fail: Fail): void {
  const material = cells.get("material");
  if (material && material.text.toLowerCase() === "custom") {
    const custom: Record<string, unknown> = {};
    const e = readQuantity("e");
    if (e) custom.E = e;
    else if (!cells.has("e")) fail(material.column.header, "missing_value", "a custom material needs the E column");
    const g = readQuantity("g");
    if (g) custom.G = g;
    const density = readQuantity("density");
    if (density) custom.density = density;
    member.material = custom;
  } else if (material) {
    member.material = material.text;
    for (const name of CUSTOM_MATERIAL_COLUMNS) {
      const cell = cells.get(name);
      if (cell) fail(cell.column.header, "not_applicable", `${name} is only for material "custom"; ${material.text} is a library material`);
    }
  }
  const creep = cells.get("creep");
  const ratio = cells.get("compression_ratio");
  if (creep) {
    const spec = parseCreep(creep.text, ratio?.text, cells.has("tension_steel"));
    if (typeof spec === "string") fail(creep.column.header, "invalid_value", spec);
    else member.creep = spec;
  } else if (ratio) {
    fail(ratio.column.header, "not_applicable", "compression_ratio is only for ACI creep");
  }
  // intake checks the value and that the material is wood, naming this column
  const moisture = cells.get("moisture_condition");
  if (moisture) member.moistureCondition = moisture.text.trim().toLowerCase();
}

function parseCreep(text: string, ratioText: string | undefined, reinforced: boolean): Record<string, unknown> | string {
  const word = text.trim().toUpperCase();
  const serviceClass = /^SC([123])$/.exec(word);
  if (serviceClass) return { method: "en1995", serviceClass: Number(serviceClass[1]) };
  if (word === "NDS-DRY") return { method: "nds", condition: "seasoned_dry" };
  if (word === "NDS-WET") return { method: "nds", condition: "unseasoned_or_wet" };
  const aci = /^ACI-(3|6|12|60)$/.exec(word);
  if (aci) {
    // with reinforcement, rho' comes from compression_steel (intake refuses a ratio beside it)
    if (ratioText === undefined && reinforced) return { method: "aci", durationMonths: Number(aci[1]) };
    if (ratioText === undefined) return "ACI creep needs the compression_ratio column (rho', e.g. 0), or reinforcement columns";
    const ratio = parseCellNumber(ratioText);
    if (!ratio.ok) return `compression_ratio: ${ratio.message}`;
    return { method: "aci", durationMonths: Number(aci[1]), compressionRatio: ratio.value };
  }
  const factor = parseCellNumber(text);
  if (factor.ok) return { method: "factor", factor: factor.value };
  return `"${text}" is not SC1, SC2, SC3, NDS-dry, NDS-wet, ACI-3, ACI-6, ACI-12, ACI-60 or a creep factor`;
}

export function mapSection(cells: Cells, member: PublicMember, readQuantity: ReadQuantity, fail: Fail): void {
  const section = cells.get("section");
  if (!section) return;
  const shape = section.text.toLowerCase();
  const used = SHAPE_COLUMNS[shape];
  if (!used) {
    member.section = section.text;
    for (const name of SECTION_COLUMNS) {
      const cell = cells.get(name);
      if (cell) fail(cell.column.header, "not_applicable", `${name} does not apply to catalogue section "${section.text}"`);
    }
    return;
  }
  for (const name of SECTION_COLUMNS) {
    const cell = cells.get(name);
    if (cell && !used.includes(name)) fail(cell.column.header, "not_applicable", `${name} does not apply to section ${shape}`);
  }
  const out: Record<string, unknown> = { shape };
  for (const name of used) {
    const value = readQuantity(name);
    if (value) out[SECTION_FIELD_NAMES[shape]?.[name] ?? name] = value;
    else if (!cells.has(name) && !(shape === "explicit" && name !== "second_moment")) {
      fail(section.column.header, "missing_value", `section ${shape} needs the ${name} column`);
    }
  }
  member.section = out;
}

/** The reinforcement columns of a row, as the member's `reinforcement` (intake checks the rest). */
export function mapReinforcement(cells: Cells, member: PublicMember, readQuantity: ReadQuantity): void {
  const out: Record<string, unknown> = {};
  for (const [column, field] of Object.entries(REINFORCEMENT_FIELD_NAMES)) {
    const value = readQuantity(column);
    if (value) out[field] = value;
  }
  if (Object.keys(out).length > 0 || cells.has("tension_steel") || cells.has("effective_depth")) member.reinforcement = out;
}

export function mapGeometry(columns: HeaderColumn[], cells: Cells, member: PublicMember, readQuantity: ReadQuantity, fail: Fail): void {
  const spanColumns = columns.filter((c) => c.role.role === "span").sort((a, b) => (a.role.role === "span" && b.role.role === "span" ? a.role.index - b.role.index : 0));
  const spans: unknown[] = [];
  let gapAfter: string | null = null;
  for (const column of spanColumns) {
    if (!cells.has(column.name)) {
      gapAfter ??= column.name;
      continue;
    }
    if (gapAfter !== null) {
      fail(column.header, "span_gap", `${column.name} is given but ${gapAfter} is empty`);
      continue;
    }
    const value = readQuantity(column.name);
    if (value) spans.push(value);
  }
  if (spans.length > 0) member.spans = spans;
  const overhangs: Record<string, unknown> = {};
  for (const side of ["left", "right"] as const) {
    const value = readQuantity(`overhang_${side}`);
    if (value) overhangs[side] = value;
  }
  if (Object.keys(overhangs).length > 0) member.overhangs = overhangs;
  const supportsCell = cells.get("supports");
  if (supportsCell) {
    const stiffness = readQuantity("spring_stiffness");
    const kinds = splitCellList(supportsCell.text).map((k) => k.toLowerCase());
    if (kinds.includes("spring") && !stiffness && !cells.has("spring_stiffness")) {
      fail(supportsCell.column.header, "missing_value", "spring supports need the spring_stiffness column");
    }
    if (!kinds.includes("spring") && cells.has("spring_stiffness")) {
      fail(cells.get("spring_stiffness")?.column.header ?? "spring_stiffness", "not_applicable", "spring_stiffness is given but no support is a spring");
    }
    member.supports = kinds.map((kind) => (kind === "spring" && stiffness ? { kind, stiffness } : kind));
  }
}

export function mapLoads(
  columns: HeaderColumn[],
  cells: Cells,
  member: PublicMember,
  readQuantity: ReadQuantity,
  readQuantityList: ReadQuantityList,
  fail: Fail,
  sources: Record<string, string>,
): void {
  const loads: Record<string, unknown>[] = [];
  const width = readQuantity("tributary_width");
  for (const column of columns) {
    if (column.role.role !== "load" || !cells.has(column.name)) continue;
    const loadCase = column.role.loadCase;
    switch (column.role.load) {
      case "uniform": {
        const w = readQuantity(column.name);
        if (w) {
          sources[`loads[${loads.length}]`] = column.header;
          loads.push({ case: loadCase, type: "uniform", w });
        }
        break;
      }
      case "area_load": {
        const pressure = readQuantity(column.name);
        if (!cells.has("tributary_width")) fail(column.header, "missing_value", `${column.name} needs tributary_width in the row`);
        else if (pressure && width) {
          sources[`loads[${loads.length}]`] = column.header;
          sources[`loads[${loads.length}].tributaryWidth`] = cells.get("tributary_width")?.column.header ?? "tributary_width";
          loads.push({ case: loadCase, type: "uniform", pressure, tributaryWidth: width });
        }
        break;
      }
      case "point":
      case "moment": {
        const loadType = column.role.load;
        const valueKey = loadType === "point" ? "P" : "M";
        const atName = `${loadCase}_${loadType}_at`;
        const values = readQuantityList(column.name);
        const positions = readQuantityList(atName);
        if (!cells.has(atName)) {
          fail(column.header, "missing_value", `${column.name} needs ${atName} in the row`);
          break;
        }
        if (!values || !positions) break;
        if (values.length !== positions.length) {
          fail(column.header, "list_mismatch", `${values.length} values in ${column.name} but ${positions.length} positions in ${atName}`);
          break;
        }
        values.forEach((value, i) => {
          sources[`loads[${loads.length}]`] = column.header;
          sources[`loads[${loads.length}].at`] = cells.get(atName)?.column.header ?? atName;
          loads.push({ case: loadCase, type: loadType, at: positions[i], [valueKey]: value });
        });
        break;
      }
      case "point_at":
      case "moment_at": {
        const valueName = column.name.replace(/_at$/, "");
        if (!cells.has(valueName)) fail(column.header, "missing_value", `${column.name} is given but ${valueName} is empty`);
        break;
      }
    }
  }
  markFixedLoads(cells, loads, fail);
  member.loads = loads;
}

/** fixed_cases: the named cases' loads in the row are always present in full (never patterned). */
function markFixedLoads(cells: Cells, loads: Record<string, unknown>[], fail: Fail): void {
  const cell = cells.get("fixed_cases");
  if (!cell) return;
  for (const name of splitCellList(cell.text)) {
    const loadCase = name.toLowerCase();
    const matching = loads.filter((load) => load.case === loadCase);
    if (matching.length === 0) {
      fail(cell.column.header, "not_applicable", `fixed_cases names "${name}" but the row has no ${loadCase} load`);
      continue;
    }
    for (const load of matching) load.fixed = true;
  }
}
