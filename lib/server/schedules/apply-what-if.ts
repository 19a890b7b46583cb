/** A what-if's trial change applied to a member's public-format input (pure: no database, no engine run). */
import { findMaterial } from "@/lib/engine/materials";
import { SYSTEM_DEFAULT_UNITS, type QuantityKind, type UnitSystem } from "@/lib/engine/units";

/** The section shapes a what-if may try, with their dimensions (lib/engine/intake/read-section.ts). */
export const WHAT_IF_SHAPES = {
  explicit: ["I", "A"],
  rectangle: ["b", "h"],
  i_plate: ["bf", "tf", "d", "tw"],
  round: ["d"],
  tube: ["D", "t"],
  hollow_rectangle: ["B", "H", "t"],
} as const satisfies Record<string, readonly string[]>;

export type WhatIfShape = keyof typeof WHAT_IF_SHAPES;

/** A trial change, numbers in the schedule's own unit for each kind (`units` on the answer). */
export interface WhatIfChange {
  section: { shape: WhatIfShape; dimensions: Record<string, number> } | null;
  material: { id: string } | { eValue: number } | null;
}

type Json = Record<string, unknown>;

const isObject = (value: unknown): value is Json => typeof value === "object" && value !== null && !Array.isArray(value);

/** The unit a schedule's bare numbers of a kind take (its declared unit, else its system's, else SI). */
export function getScheduleUnit(header: Json, kind: QuantityKind): string {
  const units = isObject(header.units) ? header.units : {};
  const declared = units[kind];
  if (typeof declared === "string") return declared;
  const system: UnitSystem = units.system === "US" ? "US" : "SI";
  return SYSTEM_DEFAULT_UNITS[system][kind];
}

const dimensionKind = (field: string): QuantityKind => (field === "A" ? "area" : field === "I" ? "secondMoment" : "sectionDimension");

function buildSection(header: Json, change: NonNullable<WhatIfChange["section"]>): Json {
  const section: Json = { shape: change.shape };
  for (const field of WHAT_IF_SHAPES[change.shape]) {
    const value = change.dimensions[field];
    if (value !== undefined) section[field] = { value, unit: getScheduleUnit(header, dimensionKind(field)) };
  }
  return section;
}

/**
 * A custom material with the trial E that keeps the old material's G, density and creep factor
 * (self-weight, shear deformation and creep still need them): from the library for a library id,
 * as given for a custom one.
 */
function buildCustomMaterial(header: Json, old: unknown, eValue: number): Json {
  const material: Json = { name: "what-if material", E: { value: eValue, unit: getScheduleUnit(header, "modulus") } };
  if (isObject(old)) {
    if (old.G !== undefined) material.G = old.G;
    if (old.density !== undefined) material.density = old.density;
    if (old.creepFactor !== undefined) material.creepFactor = old.creepFactor;
  } else if (typeof old === "string") {
    const found = findMaterial(old);
    if (found.ok) {
      if (found.material.gMpa !== null) material.G = { value: found.material.gMpa, unit: "MPa" };
      if (found.material.densityKgPerM3 !== null) material.density = { value: found.material.densityKgPerM3, unit: "kg/m^3" };
      // metals do not creep (IBC 2021 Table 1604.3 note permits K = 0 for steel, from memory); wood
      // and concrete keep no creep here, so intake asks for one and the answer says so
      if (found.material.family === "steel" || found.material.family === "aluminium") material.creepFactor = 0;
    }
  }
  return material;
}

export function describeChange(header: Json, change: WhatIfChange): string[] {
  const words: string[] = [];
  if (change.section) {
    const dims = WHAT_IF_SHAPES[change.section.shape]
      .filter((field) => change.section!.dimensions[field] !== undefined)
      .map((field) => `${field} ${change.section!.dimensions[field]} ${getScheduleUnit(header, dimensionKind(field))}`);
    words.push(`section ${change.section.shape}: ${dims.join(", ")}`);
  }
  if (change.material) {
    words.push("id" in change.material ? `material ${change.material.id}` : `material E ${change.material.eValue} ${getScheduleUnit(header, "modulus")} (G and density kept)`);
  }
  return words;
}

/**
 * The member's public-format input with the trial section and material in place of its own,
 * on the member and on every span that named its own (the trial applies to the whole member).
 */
export function applyWhatIf(header: Json, input: Json, change: WhatIfChange): Json {
  const next: Json = { ...input };
  const section = change.section ? buildSection(header, change.section) : null;
  const material = change.material ? ("id" in change.material ? change.material.id : buildCustomMaterial(header, input.material, change.material.eValue)) : null;
  if (section) next.section = section;
  if (material) next.material = material;
  const strip = (entry: unknown): unknown => {
    if (!isObject(entry) || "value" in entry) return entry;
    const copy: Json = { ...entry };
    if (section) delete copy.section;
    if (material) delete copy.material;
    return copy;
  };
  if (Array.isArray(input.spans)) next.spans = input.spans.map(strip);
  if (isObject(input.overhangs)) next.overhangs = { ...(input.overhangs.left !== undefined ? { left: strip(input.overhangs.left) } : {}), ...(input.overhangs.right !== undefined ? { right: strip(input.overhangs.right) } : {}) };
  return next;
}

