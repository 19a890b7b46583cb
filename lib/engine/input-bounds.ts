/**
 * Physically meaningful ranges for the quantities a schedule gives, in internal units (mm, N,
 * N/mm, N*mm, MPa, mm^4, mm^2, kg/m^3, Hz). A value outside its range is a typing or unit slip
 * (E = 13.8 read as MPa, a span of 1e308 mm), never a member to analyse: intake and the solver's
 * validation refuse it on its own field instead of letting it reach the stiffness matrix, where
 * it shows up as a singular matrix or as a result that looks plausible and is not.
 *
 * The limits are Sagline's own choice (common practice): wide enough for any building member in
 * steel, timber, cold-formed steel, aluminium or concrete, narrow enough that the banded solve
 * keeps its precision (every stiffness ratio in one member stays well inside double precision).
 */
import type { QuantityKind } from "./units/unit-table";

export interface QuantityBound {
  /**
   * Smallest magnitude accepted for a size (a span, E, I): 0 itself is governed by the field's own
   * rule, and signed values (loads, positions) have no lower bound, since a tiny load is harmless.
   */
  minAbs: number;
  /** Largest magnitude accepted. */
  maxAbs: number;
  /** Why the range is what it is, for the message. */
  reason: string;
}

/** Per quantity kind, in internal units (common practice, see the module comment). */
export const QUANTITY_BOUNDS: Record<QuantityKind, QuantityBound> = {
  // 1 mm to 1 km: a span, overhang, position or tributary width of a building member.
  length: { minAbs: 1, maxAbs: 1e6, reason: "a member length, position or width from 1 mm to 1 km" },
  // 0.1 mm (thinnest cold-formed sheet is about 0.4 mm) to 10 m (deepest girder).
  sectionDimension: { minAbs: 0.1, maxAbs: 1e4, reason: "a section dimension from 0.1 mm to 10 m" },
  deflection: { minAbs: 0.01, maxAbs: 1e4, reason: "a deflection cap from 0.01 mm to 10 m" },
  // 1 MN = 1,000 kN and more is a transfer structure, not a schedule member: 1e9 N is generous.
  force: { minAbs: 0, maxAbs: 1e9, reason: "a point load up to 1,000,000 kN" },
  distributedLoad: { minAbs: 0, maxAbs: 1e5, reason: "a line load up to 100,000 kN/m" },
  moment: { minAbs: 0, maxAbs: 1e12, reason: "an applied moment up to 1,000,000 kN*m" },
  // E of structural materials: timber across the grain about 300 MPa, steel 200,000 to 210,000 MPa,
  // the stiffest metals about 400,000 MPa. Below 100 MPa is almost always GPa or ksi written bare.
  modulus: { minAbs: 100, maxAbs: 1e6, reason: "a structural modulus from 100 MPa to 1,000,000 MPa (1,000 GPa); a smaller number is usually GPa written without its unit" },
  pressure: { minAbs: 0, maxAbs: 10, reason: "an area load up to 10 MPa (10,000 kPa)" },
  secondMoment: { minAbs: 1, maxAbs: 1e15, reason: "a second moment of area from 1 mm^4 to 1e15 mm^4" },
  area: { minAbs: 1, maxAbs: 1e8, reason: "a section area from 1 mm^2 to 100 m^2" },
  // Foamed cores about 30 kg/m^3, osmium 22,590 kg/m^3.
  density: { minAbs: 10, maxAbs: 25_000, reason: "a material density from 10 to 25,000 kg/m^3" },
  // 1 N/mm is a very soft bearing; above 1e10 N/mm a spring is a rigid support (use pinned).
  springStiffness: { minAbs: 1, maxAbs: 1e10, reason: "a spring stiffness from 1 N/mm to 1e10 N/mm (stiffer is a rigid support: use pinned)" },
  frequency: { minAbs: 0.01, maxAbs: 1000, reason: "a frequency from 0.01 to 1,000 Hz" },
};

/**
 * Returns why an internal-unit value is outside its kind's range, or null when it is inside.
 * Zero passes here: whether zero is allowed is the field's own rule (positive, non-negative).
 * `signed` values (loads, positions) are checked against the largest magnitude only.
 * `toInternalFactor` is the caller's unit in internal units (1 mm per mm, 304.8 mm per ft), so the
 * message states the limit in the unit the value was written in. Allocates nothing when in range
 * (intake calls it for every quantity).
 */
export function describeOutOfBounds(
  kind: QuantityKind,
  internalValue: number,
  unitLabel: string,
  signed = false,
  toInternalFactor = 1,
): string | null {
  const bound = QUANTITY_BOUNDS[kind];
  const magnitude = Math.abs(internalValue);
  if (magnitude <= bound.maxAbs && (magnitude === 0 || signed || magnitude >= bound.minAbs)) return null;
  const limit = magnitude > bound.maxAbs ? bound.maxAbs : bound.minAbs;
  const side = magnitude > bound.maxAbs ? "at most" : "at least";
  return `must be ${side} ${formatBound(limit / toInternalFactor)} ${unitLabel}${signed ? " in magnitude" : ""}: expected ${bound.reason}`;
}

function formatBound(value: number): string {
  const abs = Math.abs(value);
  if (abs !== 0 && (abs >= 1e7 || abs < 1e-3)) return value.toExponential(3).replace(/\.?0+e/, "e").replace("e+", "e");
  return Number(value.toPrecision(6)).toLocaleString("en-US", { maximumFractionDigits: 6 });
}
