/**
 * Unit parsing and conversion to the engine's internal system (mm, N, N/mm, N*mm, MPa, mm^4,
 * mm^2, kg/m^3, Hz). Intake converts every quantity once, here; nothing downstream converts.
 */
import {
  INTERNAL_UNITS,
  QUANTITY_KIND_LABELS,
  QUANTITY_KINDS,
  UNIT_TABLE,
  type QuantityKind,
  type UnitDefinition,
} from "./units/unit-table";

export { INTERNAL_UNITS, QUANTITY_KIND_LABELS, QUANTITY_KINDS, UNIT_TABLE };
export type { QuantityKind, UnitDefinition };

export type UnitSystem = "SI" | "US";

/** Default unit per kind for each system (a schedule's `units.system`). */
export const SYSTEM_DEFAULT_UNITS: Record<UnitSystem, Record<QuantityKind, string>> = {
  SI: {
    length: "m",
    sectionDimension: "mm",
    deflection: "mm",
    force: "kN",
    distributedLoad: "kN/m",
    moment: "kN*m",
    modulus: "MPa",
    pressure: "kPa",
    secondMoment: "mm^4",
    area: "mm^2",
    density: "kg/m^3",
    springStiffness: "kN/mm",
    frequency: "Hz",
  },
  US: {
    length: "ft",
    sectionDimension: "in",
    deflection: "in",
    force: "kip",
    distributedLoad: "klf",
    moment: "kip*ft",
    modulus: "ksi",
    pressure: "psf",
    secondMoment: "in^4",
    area: "in^2",
    density: "pcf",
    springStiffness: "kip/in",
    frequency: "Hz",
  },
};

/**
 * Folds the common ways of writing a unit into one key: case, spaces, `^`, superscript digits
 * and the multiplication marks `*`, `·`, `-`, `.` ("kN m", "kN-m", "kN·m" and "kN*m" are one
 * unit). Case is folded because no two accepted units differ only in case.
 */
export function normaliseUnitText(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/²/g, "2")
    .replace(/³/g, "3")
    .replace(/⁴/g, "4")
    .replace(/\^/g, "")
    .replace(/[·×⋅.\-]/g, "*")
    .replace(/\s+/g, "")
    .replace(/\*+$/, "");
}

const lookupByKind = new Map<QuantityKind, Map<string, UnitDefinition>>();
for (const kind of QUANTITY_KINDS) {
  const lookup = new Map<string, UnitDefinition>();
  for (const unit of UNIT_TABLE[kind]) {
    for (const spelling of [unit.symbol, ...unit.aliases]) lookup.set(normaliseUnitText(spelling), unit);
  }
  lookupByKind.set(kind, lookup);
}

/** The accepted spellings for a kind, canonical symbols first, for error messages and docs. */
export function listAcceptedUnits(kind: QuantityKind): string[] {
  return UNIT_TABLE[kind].map((unit) => unit.symbol);
}

export type FindUnitResult = { ok: true; unit: UnitDefinition } | { ok: false; message: string };

// Schedules repeat a handful of unit spellings many thousand times; results are immutable.
const findUnitCache = new Map<QuantityKind, Map<string, FindUnitResult>>();
const FIND_UNIT_CACHE_LIMIT = 1000;

/** Finds a unit of the given kind; an unknown spelling yields a message listing what is accepted. */
export function findUnit(kind: QuantityKind, text: string): FindUnitResult {
  let byText = findUnitCache.get(kind);
  if (!byText) {
    byText = new Map();
    findUnitCache.set(kind, byText);
  }
  const cached = byText.get(text);
  if (cached) return cached;
  const result = findUnitUncached(kind, text);
  if (byText.size < FIND_UNIT_CACHE_LIMIT) byText.set(text, result);
  return result;
}

function findUnitUncached(kind: QuantityKind, text: string): FindUnitResult {
  const found = lookupByKind.get(kind)?.get(normaliseUnitText(text));
  if (found) return { ok: true, unit: found };
  const accepted = listAcceptedUnits(kind).join(", ");
  const otherKind = QUANTITY_KINDS.find((k) => k !== kind && lookupByKind.get(k)?.has(normaliseUnitText(text)));
  const label = QUANTITY_KIND_LABELS[kind];
  if (otherKind && !sharesUnits(kind, otherKind)) {
    return {
      ok: false,
      message: `"${text}" is a ${QUANTITY_KIND_LABELS[otherKind]} unit, but a ${label} is expected; accepted: ${accepted}`,
    };
  }
  return { ok: false, message: `unknown ${label} unit "${text}"; accepted: ${accepted}` };
}

function sharesUnits(a: QuantityKind, b: QuantityKind): boolean {
  return UNIT_TABLE[a] === UNIT_TABLE[b];
}

export type ConvertResult = { ok: true; value: number } | { ok: false; message: string };

/** Converts a value in `unitText` to the internal unit of `kind` (INTERNAL_UNITS). */
export function convertToInternal(value: number, kind: QuantityKind, unitText: string): ConvertResult {
  if (!Number.isFinite(value)) return { ok: false, message: "must be a finite number" };
  const found = findUnit(kind, unitText);
  if (!found.ok) return found;
  return { ok: true, value: value * found.unit.toInternal };
}

/** Converts an internal value back to `unitText` (for output in the schedule's own units). */
export function convertFromInternal(value: number, kind: QuantityKind, unitText: string): ConvertResult {
  const found = findUnit(kind, unitText);
  if (!found.ok) return found;
  return { ok: true, value: value / found.unit.toInternal };
}
