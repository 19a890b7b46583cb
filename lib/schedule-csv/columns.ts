/**
 * The CSV column set: one row per member. A header is a column name, optionally followed by a
 * unit in square brackets (`span_1 [m]`, `live_uniform [kN/m]`). Names ignore case, and spaces
 * or hyphens count as underscores.
 */
import { findUnit, type QuantityKind } from "../engine/units";

export type ColumnValueKind = "text" | "integer" | "boolean" | "list" | "quantity" | "quantityList";

export interface ColumnSpec {
  kind: ColumnValueKind;
  quantity?: QuantityKind;
  description: string;
}

export type ColumnRole =
  | { role: "fixed"; name: string }
  | { role: "span"; index: number }
  | { role: "load"; loadCase: string; load: LoadColumn };

export type LoadColumn = "uniform" | "area_load" | "point" | "point_at" | "moment" | "moment_at";

export const FIXED_COLUMNS: Record<string, ColumnSpec> = {
  mark: { kind: "text", description: "Member mark, unique in the schedule (required)." },
  category: { kind: "text", description: "floor_beam, roof_beam, lintel, purlin_girt, wall_stud, cantilever or other (required)." },
  quantity: { kind: "integer", description: "Number of identical members (required)." },
  material: { kind: "text", description: "Library id (steel-s355, timber-c24, concrete-fc30, ...) or custom (then E, and optionally G and density)." },
  e: { kind: "quantity", quantity: "modulus", description: "Custom material: modulus of elasticity." },
  g: { kind: "quantity", quantity: "modulus", description: "Custom material: shear modulus." },
  density: { kind: "quantity", quantity: "density", description: "Custom material: density." },
  creep: { kind: "text", description: "SC1, SC2, SC3 (EN 1995 service class), NDS-dry, NDS-wet, ACI-3, ACI-6, ACI-12, ACI-60 (months; with compression_ratio) or a creep factor." },
  compression_ratio: { kind: "text", description: "ACI creep: compression reinforcement ratio rho' (e.g. 0 or 0.005)." },
  section: { kind: "text", description: "rectangle, hollow_rectangle, round, tube, i_plate, explicit, or a catalogue section name." },
  b: { kind: "quantity", quantity: "sectionDimension", description: "rectangle width; hollow_rectangle outer width." },
  h: { kind: "quantity", quantity: "sectionDimension", description: "rectangle depth; hollow_rectangle outer depth." },
  t: { kind: "quantity", quantity: "sectionDimension", description: "hollow_rectangle or tube wall thickness." },
  d: { kind: "quantity", quantity: "sectionDimension", description: "round diameter; tube outer diameter; i_plate overall depth." },
  bf: { kind: "quantity", quantity: "sectionDimension", description: "i_plate flange width." },
  tf: { kind: "quantity", quantity: "sectionDimension", description: "i_plate flange thickness." },
  tw: { kind: "quantity", quantity: "sectionDimension", description: "i_plate web thickness." },
  area: { kind: "quantity", quantity: "area", description: "explicit section: area A." },
  second_moment: { kind: "quantity", quantity: "secondMoment", description: "explicit section: second moment of area I." },
  shear_area: { kind: "quantity", quantity: "area", description: "explicit section: shear area." },
  overhang_left: { kind: "quantity", quantity: "length", description: "Left overhang length (0 or empty: none)." },
  overhang_right: { kind: "quantity", quantity: "length", description: "Right overhang length (0 or empty: none)." },
  supports: { kind: "list", description: "One support per span end, left to right: pinned, roller, fixed, free, spring; separated by spaces, | or ;." },
  spring_stiffness: { kind: "quantity", quantity: "springStiffness", description: "Stiffness of every spring support in the row." },
  tributary_width: { kind: "quantity", quantity: "length", description: "Width for <case>_area_load columns (joist spacing)." },
  self_weight: { kind: "boolean", description: "yes/no: add self-weight to the dead case." },
  shear_deformation: { kind: "boolean", description: "yes/no: include shear deformation." },
  notes: { kind: "text", description: "Free text." },
};

export const LOAD_COLUMNS: Record<LoadColumn, ColumnSpec> = {
  uniform: { kind: "quantity", quantity: "distributedLoad", description: "Uniform load over the whole member." },
  area_load: { kind: "quantity", quantity: "pressure", description: "Area load over the whole member, times tributary_width." },
  point: { kind: "quantityList", quantity: "force", description: "Point load(s); with <case>_point_at." },
  point_at: { kind: "quantityList", quantity: "length", description: "Point load position(s) from the left end, overhang included." },
  moment: { kind: "quantityList", quantity: "moment", description: "Applied moment(s), clockwise positive; with <case>_moment_at." },
  moment_at: { kind: "quantityList", quantity: "length", description: "Moment position(s) from the left end, overhang included." },
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
  if (span?.[1]) return { role: { role: "span", index: Number(span[1]) }, spec: { kind: "quantity", quantity: "length", description: "Span length." } };
  const load = LOAD_SUFFIX_PATTERN.exec(name);
  if (load?.[1] && load[2]) {
    const kind = load[2] as LoadColumn;
    return { role: { role: "load", loadCase: load[1], load: kind }, spec: LOAD_COLUMNS[kind] };
  }
  return null;
}

/** Splits `name [unit]` into its parts. */
export function splitHeader(header: string): { name: string; unit: string | null } | null {
  const match = /^([^[\]]*?)\s*(?:\[([^[\]]*)\])?\s*$/.exec(header.trim());
  if (!match) return null;
  return { name: normaliseColumnName(match[1] ?? ""), unit: match[2] === undefined ? null : match[2].trim() };
}

export function isUnitValidFor(kind: QuantityKind, unit: string): { ok: true } | { ok: false; message: string } {
  const found = findUnit(kind, unit);
  return found.ok ? { ok: true } : { ok: false, message: found.message };
}
