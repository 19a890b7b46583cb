/**
 * Closed-form beam cases that the engine is checked against, shared by the unit test and the
 * in-app verification page so both always show the same cases. Uniform EI, Euler-Bernoulli,
 * internal units (mm, N, MPa). Expected values are the handbook formulas written out; the sources
 * are named beside each case and were recalled from memory of those publications.
 */
import type { Load, Member, SupportKind } from "@/lib/engine/model";
import { createCaseFactors, findSpanExtreme, getNodeRotation, solveMember } from "@/lib/engine/solver";

export const CASE_E_MPA = 200_000;
export const CASE_I_MM4 = 8.0e7;
const EI = CASE_E_MPA * CASE_I_MM4;
const L = 6000;
const W = 10; // N/mm
const P = 20_000; // N

/** The relative error every case is held to unless it names its own `tolerance`. */
export const DEFAULT_RELATIVE_TOLERANCE = 1e-9;

/** The units a case's values are shown in (extend additively; the page formats each one). */
export type CaseUnit = "mm" | "rad" | "mm^2" | "mm^4" | "kg/m^3" | "MPa" | "Hz" | "N*mm" | "ratio";

/** One case; Unit may narrow the units a case list uses. */
export interface ClosedFormCase<Unit extends CaseUnit = CaseUnit> {
  id: string;
  title: string;
  quantity: string;
  formula: string;
  source: string;
  /** The reference value: the published formula or table value written out. */
  expected: number;
  unit: Unit;
  /** The engine's value for the same quantity. */
  compute: () => number;
  /**
   * Largest relative error accepted, when the engine promises less than the closed-form solver's
   * 1e-9 (a converged eigenvalue, a published coefficient given to 4 figures); say why beside it.
   */
  tolerance?: number;
}

function createMember(supports: SupportKind[], loads: Load[]): Member {
  return { mark: "V", category: "other", quantity: 1, spans: [{ lengthMm: L, eMpa: CASE_E_MPA, iMm4: CASE_I_MM4 }], supports: supports.map((kind) => ({ kind })), loads };
}

function maxDeflection(member: Member): number {
  const solution = solveMember(member);
  return findSpanExtreme(solution, createCaseFactors(solution, { A: 1 }), 0).deflectionMm;
}

function rotationAtNode(member: Member, node: number): number {
  const solution = solveMember(member);
  return Math.abs(getNodeRotation(solution, createCaseFactors(solution, { A: 1 }), node));
}

const uniform: Load = { kind: "uniform", loadCase: "A", wNPerMm: W };
const pointAt = (atMm: number): Load => ({ kind: "point", loadCase: "A", atMm, pN: P });
const a = 4000;
const b = L - a;

export const closedFormCases: ClosedFormCase[] = [
  {
    id: "ss-uniform",
    title: "Simply supported, uniform load",
    quantity: "largest deflection (midspan)",
    formula: "5wL^4 / (384EI)",
    source: "AISC Steel Construction Manual, Table 3-23, case 1 (from memory)",
    expected: (5 * W * L ** 4) / (384 * EI),
    unit: "mm",
    compute: () => maxDeflection(createMember(["pinned", "roller"], [uniform])),
  },
  {
    id: "ss-uniform-slope",
    title: "Simply supported, uniform load",
    quantity: "end rotation",
    formula: "wL^3 / (24EI)",
    source: "Gere and Goodno, Mechanics of Materials, appendix of beam deflections and slopes (from memory)",
    expected: (W * L ** 3) / (24 * EI),
    unit: "rad",
    compute: () => rotationAtNode(createMember(["pinned", "roller"], [uniform]), 0),
  },
  {
    id: "ss-centre-point",
    title: "Simply supported, point load at midspan",
    quantity: "largest deflection (midspan)",
    formula: "PL^3 / (48EI)",
    source: "AISC Steel Construction Manual, Table 3-23, case 7 (from memory)",
    expected: (P * L ** 3) / (48 * EI),
    unit: "mm",
    compute: () => maxDeflection(createMember(["pinned", "roller"], [pointAt(L / 2)])),
  },
  {
    id: "ss-offset-point",
    title: "Simply supported, point load at a = 4 m of 6 m",
    quantity: "largest deflection, at x = sqrt(a(a + 2b)/3)",
    formula: "P a b (a + 2b) sqrt(3a(a + 2b)) / (27 EI L)",
    source: "AISC Steel Construction Manual, Table 3-23, case 8 (from memory)",
    expected: (P * a * b * (a + 2 * b) * Math.sqrt(3 * a * (a + 2 * b))) / (27 * EI * L),
    unit: "mm",
    compute: () => maxDeflection(createMember(["pinned", "roller"], [pointAt(a)])),
  },
  {
    id: "cantilever-uniform",
    title: "Cantilever, uniform load",
    quantity: "tip deflection",
    formula: "wL^4 / (8EI)",
    source: "Roark's Formulas for Stress and Strain, Table 8.1, cantilever with uniform load (from memory)",
    expected: (W * L ** 4) / (8 * EI),
    unit: "mm",
    compute: () => maxDeflection(createMember(["fixed", "free"], [uniform])),
  },
  {
    id: "cantilever-uniform-slope",
    title: "Cantilever, uniform load",
    quantity: "tip rotation",
    formula: "wL^3 / (6EI)",
    source: "Roark's Formulas for Stress and Strain, Table 8.1, cantilever with uniform load (from memory)",
    expected: (W * L ** 3) / (6 * EI),
    unit: "rad",
    compute: () => rotationAtNode(createMember(["fixed", "free"], [uniform]), 1),
  },
  {
    id: "cantilever-tip-point",
    title: "Cantilever, point load at the tip",
    quantity: "tip deflection",
    formula: "PL^3 / (3EI)",
    source: "AISC Steel Construction Manual, Table 3-23, case 22 (from memory)",
    expected: (P * L ** 3) / (3 * EI),
    unit: "mm",
    compute: () => maxDeflection(createMember(["fixed", "free"], [pointAt(L)])),
  },
  {
    id: "fixed-uniform",
    title: "Fixed at both ends, uniform load",
    quantity: "largest deflection (midspan)",
    formula: "wL^4 / (384EI)",
    source: "AISC Steel Construction Manual, Table 3-23, case 15 (from memory)",
    expected: (W * L ** 4) / (384 * EI),
    unit: "mm",
    compute: () => maxDeflection(createMember(["fixed", "fixed"], [uniform])),
  },
  {
    id: "fixed-centre-point",
    title: "Fixed at both ends, point load at midspan",
    quantity: "largest deflection (midspan)",
    formula: "PL^3 / (192EI)",
    source: "AISC Steel Construction Manual, Table 3-23, case 16 (from memory)",
    expected: (P * L ** 3) / (192 * EI),
    unit: "mm",
    compute: () => maxDeflection(createMember(["fixed", "fixed"], [pointAt(L / 2)])),
  },
];

export interface VerifiedCase extends ClosedFormCase {
  computed: number;
  relativeError: number;
  /** The tolerance applied (the case's own, or DEFAULT_RELATIVE_TOLERANCE). */
  allowedRelativeError: number;
  withinTolerance: boolean;
}

/** Runs cases through the engine and compares each with its reference value. */
export function runCases(cases: readonly ClosedFormCase[]): VerifiedCase[] {
  return cases.map((c) => {
    const computed = c.compute();
    const relativeError = c.expected === 0 ? Math.abs(computed) : Math.abs(computed - c.expected) / Math.abs(c.expected);
    const allowedRelativeError = c.tolerance ?? DEFAULT_RELATIVE_TOLERANCE;
    return { ...c, computed, relativeError, allowedRelativeError, withinTolerance: Number.isFinite(computed) && relativeError <= allowedRelativeError };
  });
}

/** Runs the closed-form beam cases; the engine promises a relative error of at most 1e-9. */
export function runClosedFormCases(): VerifiedCase[] {
  return runCases(closedFormCases);
}
