/**
 * The CSV column set: one row per member. A header is a column name, optionally followed by a
 * unit in square brackets (`span_1 [m]`, `live_uniform [kN/m]`). Names ignore case, and spaces
 * or hyphens count as underscores.
 */
import type { QuantityKind } from "../engine/units";

export interface ColumnSpec {
  /** Set for quantity columns (and lists of quantities): the kind their unit must measure. */
  quantity?: QuantityKind;
  description: string;
}

export type ColumnRole =
  | { role: "fixed"; name: string }
  | { role: "span"; index: number }
  | { role: "load"; loadCase: string; load: LoadColumn };

export type LoadColumn = "uniform" | "area_load" | "point" | "point_at" | "moment" | "moment_at";

function createDimensionSpec(description: string): ColumnSpec {
  return { quantity: "sectionDimension", description };
}

export const FIXED_COLUMNS: Record<string, ColumnSpec> = {
  mark: { description: "Member mark, unique in the schedule (required)." },
  category: { description: "floor_beam, roof_beam, lintel, purlin_girt, wall_stud, cantilever or other (required)." },
  quantity: { description: "Number of identical members (required)." },
  material: { description: "Library id (steel-s355, timber-c24, concrete-fc30, ...) or custom (then E, and optionally G and density)." },
  e: { quantity: "modulus", description: "Custom material: modulus of elasticity." },
  g: { quantity: "modulus", description: "Custom material: shear modulus." },
  density: { quantity: "density", description: "Custom material: density." },
  creep: { description: "SC1, SC2, SC3 (EN 1995 service class), NDS-dry, NDS-wet, ACI-3, ACI-6, ACI-12, ACI-60 (months; with compression_ratio, or with reinforcement columns) or a creep factor." },
  compression_ratio: { description: "ACI creep: compression reinforcement ratio rho' (e.g. 0 or 0.005)." },
  moisture_condition: { description: "Wood: seasoned_dry or unseasoned_or_wet (IBC D + L creep component 0.5 D or 1.0 D; empty: 1.0 D, the conservative side)." },
  section: { description: "rectangle, hollow_rectangle, round, tube, i_plate, tee, explicit, or a catalogue section name." },
  b: createDimensionSpec("rectangle width; hollow_rectangle outer width."),
  h: createDimensionSpec("rectangle depth; hollow_rectangle outer depth; tee overall depth."),
  t: createDimensionSpec("hollow_rectangle or tube wall thickness."),
  d: createDimensionSpec("round diameter; tube outer diameter; i_plate overall depth."),
  bf: createDimensionSpec("i_plate or tee flange width."),
  hf: createDimensionSpec("tee flange thickness."),
  bw: createDimensionSpec("tee web width."),
  tf: createDimensionSpec("i_plate flange thickness."),
  tw: createDimensionSpec("i_plate web thickness."),
  area: { quantity: "area", description: "explicit section: area A." },
  second_moment: { quantity: "secondMoment", description: "explicit section: second moment of area I." },
  shear_area: { quantity: "area", description: "explicit section: shear area." },
  tension_steel: { quantity: "area", description: "Reinforced concrete: tension steel area A_s (with effective_depth)." },
  effective_depth: createDimensionSpec("Reinforced concrete: effective depth d from the compression face, less than h."),
  compression_steel: { quantity: "area", description: "Reinforced concrete: compression steel area A's (with compression_depth)." },
  compression_depth: createDimensionSpec("Reinforced concrete: depth d' of the compression steel, less than d."),
  top_steel: { quantity: "area", description: "Reinforced concrete: top steel area A_s,top, in tension under hogging moment (with top_depth)." },
  top_depth: createDimensionSpec("Reinforced concrete: effective depth d_top of the top steel from the bottom face, less than h."),
  steel_e: { quantity: "modulus", description: "Reinforced concrete: steel modulus E_s (default 200,000 MPa)." },
  overhang_left: { quantity: "length", description: "Left overhang length (0 or empty: none)." },
  overhang_right: { quantity: "length", description: "Right overhang length (0 or empty: none)." },
  supports: { description: "One support per span end, left to right: pinned, roller, fixed, free, spring; separated by spaces, | or ;." },
  spring_stiffness: { quantity: "springStiffness", description: "Stiffness of every spring support in the row." },
  tributary_width: { quantity: "length", description: "Width for <case>_area_load columns (joist spacing)." },
  fixed_cases: { description: "Load cases whose loads in this row are fixed (always present in full, never patterned span by span), e.g. live; separated by spaces, | or ;." },
  self_weight: { description: "yes/no: add self-weight to the dead case." },
  shear_deformation: { description: "yes/no: include shear deformation." },
  notes: { description: "Free text." },
};

export const LOAD_COLUMNS: Record<LoadColumn, ColumnSpec> = {
  uniform: { quantity: "distributedLoad", description: "Uniform load over the whole member." },
  area_load: { quantity: "pressure", description: "Area load over the whole member, times tributary_width." },
  point: { quantity: "force", description: "Point load(s); with <case>_point_at." },
  point_at: { quantity: "length", description: "Point load position(s) from the left end, overhang included." },
  moment: { quantity: "moment", description: "Applied moment(s), clockwise positive; with <case>_moment_at." },
  moment_at: { quantity: "length", description: "Moment position(s) from the left end, overhang included." },
};

const LOAD_SUFFIX_PATTERN = /^([a-z][a-z0-9_]*?)_(uniform|area_load|point_at|point|moment_at|moment)$/;
const SPAN_PATTERN = /^span_([1-9][0-9]?)$/;

export interface HeaderColumn {
  index: number;
  /** The header cell as written, for messages. */
  header: string;
  name: string;
  role: ColumnRole;
  spec: ColumnSpec;
  /** Unit text for quantity columns. */
  unit?: string;
}

export function normaliseColumnName(text: string): string {
  return text.trim().toLowerCase().replace(/[\s-]+/g, "_");
}

export function getColumnRole(name: string): { role: ColumnRole; spec: ColumnSpec } | null {
  const fixed = FIXED_COLUMNS[name];
  if (fixed) return { role: { role: "fixed", name }, spec: fixed };
  const span = SPAN_PATTERN.exec(name);
  if (span?.[1]) return { role: { role: "span", index: Number(span[1]) }, spec: { quantity: "length", description: "Span length." } };
  const load = LOAD_SUFFIX_PATTERN.exec(name);
  if (load?.[1] && load[2]) {
    const kind = load[2] as LoadColumn;
    return { role: { role: "load", loadCase: load[1], load: kind }, spec: LOAD_COLUMNS[kind] };
  }
  return null;
}

/** The longest header cell read; longer ones are refused by name before any parsing. */
export const MAX_HEADER_CELL_CHARS = 200;

/**
 * Splits `name [unit]` into its parts, or null when the brackets are misplaced. A scan with
 * indexOf, not a regular expression: a backtracking pattern took cubic time on long blank runs.
 */
export function splitHeader(header: string): { name: string; unit: string | null } | null {
  const text = header.trim();
  const open = text.indexOf("[");
  if (open === -1) return text.includes("]") ? null : { name: normaliseColumnName(text), unit: null };
  const name = text.slice(0, open);
  const unit = text.slice(open + 1, -1);
  if (!text.endsWith("]") || name.includes("]") || unit.includes("[") || unit.includes("]")) return null;
  return { name: normaliseColumnName(name), unit: unit.trim() };
}
