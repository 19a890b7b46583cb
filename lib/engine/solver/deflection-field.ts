import { getPower, type ElementTerms } from "./element-terms";
import { evaluatePolynomial, findPolynomialAbsMax, type AbsMaxResult } from "./poly-extrema";
import { findSpanAt, type MemberSolution } from "./solve-member";

/**
 * Factor per load case of a linear combination, indexed like solution.caseNames. A plain array:
 * one is made per combination per member, and a typed array costs far more to allocate.
 */
export type CaseFactors = number[];

/** `count` zeros, filled by push so the array stays packed. */
function createZeroFactors(count: number): CaseFactors {
  const factors: CaseFactors = [];
  for (let i = 0; i < count; i++) factors.push(0);
  return factors;
}

/**
 * Adds scale * factorsByCase[name] to each named case the member loads (others add nothing); a
 * patterned case gets the factor on each of its per-span parts.
 */
function addScaledCaseFactors(solution: MemberSolution, factors: CaseFactors, factorsByCase: Record<string, number>, scale: number): void {
  const names = solution.caseNames;
  for (const name in factorsByCase) {
    // scale 1 leaves the factor's bits unchanged (1 * x === x in IEEE 754)
    const amount = scale * (factorsByCase[name] as number);
    for (let index = names.indexOf(name); index >= 0; index = names.indexOf(name, index + 1)) factors[index] = (factors[index] as number) + amount;
  }
}

/**
 * Case factors of a linear combination, indexed like solution.caseNames:
 * factorsByCase[case] + scaledScale * scaledFactorsByCase[case]. Names the member does not load
 * contribute nothing; the internal self-weight case follows the member's selfWeightCase.
 */
export function createCaseFactors(
  solution: MemberSolution,
  factorsByCase: Record<string, number>,
  scaledFactorsByCase?: Record<string, number>,
  scaledScale = 1,
): CaseFactors {
  const factors = createZeroFactors(solution.caseNames.length);
  addScaledCaseFactors(solution, factors, factorsByCase, 1);
  if (scaledFactorsByCase !== undefined) addScaledCaseFactors(solution, factors, scaledFactorsByCase, scaledScale);
  if (solution.selfWeightCaseIndex >= 0) factors[solution.selfWeightCaseIndex] = factors[solution.selfWeightNamedCaseIndex] as number;
  return factors;
}

/** Combined left-node state of one element: v0 (mm), psi0 (rad), M0 (N*mm), V0 (N). */
export interface ElementState {
  v0: number;
  psi0: number;
  m0: number;
  shear0: number;
}

const stateScratch: ElementState = { v0: 0, psi0: 0, m0: 0, shear0: 0 };

/** The element's left-node state under the combination (superposed from the solved cases). */
export function getElementState(solution: MemberSolution, factors: CaseFactors, span: number, out: ElementState): ElementState {
  let v0 = 0;
  let psi0 = 0;
  let m0 = 0;
  let shear0 = 0;
  const caseCount = factors.length;
  const states = solution.caseStates;
  const stride = solution.caseStride;
  const momentOffset = 2 * (solution.spanCount + 1) + span;
  const shearOffset = momentOffset + solution.spanCount;
  for (let c = 0; c < caseCount; c++) {
    const f = factors[c] as number;
    if (f === 0) continue;
    const base = c * stride;
    v0 += f * (states[base + 2 * span] as number);
    psi0 += f * (states[base + 2 * span + 1] as number);
    m0 += f * (states[base + momentOffset] as number);
    shear0 += f * (states[base + shearOffset] as number);
  }
  out.v0 = v0;
  out.psi0 = psi0;
  out.m0 = m0;
  out.shear0 = shear0;
  return out;
}

function evaluateLocal(solution: MemberSolution, factors: CaseFactors, span: number, s: number, wantRotation: boolean): number {
  const state = getElementState(solution, factors, span, stateScratch);
  const ei = solution.eiNmm2[span] as number;
  const inverseShear = solution.inverseShearStiffness[span] as number;
  const terms = solution.terms[span] as ElementTerms;
  let bending = 0;
  let shearPart = 0;
  const count = terms.coefficient.length;
  for (let t = 0; t < count; t++) {
    const d = s - (terms.atMm[t] as number);
    if (d <= 0) continue;
    const a = (factors[terms.caseIndex[t] as number] as number) * (terms.coefficient[t] as number);
    if (a === 0) continue;
    const p = terms.power[t] as number;
    const dp = getPower(d, p);
    if (wantRotation) bending += (a * dp * d) / (p + 1);
    else {
      bending += (a * dp * d * d) / ((p + 1) * (p + 2));
      if (p >= 1) shearPart += a * dp;
    }
  }
  if (wantRotation) return state.psi0 - (state.m0 * s + (state.shear0 * s * s) / 2 + bending) / ei;
  return state.v0 + state.psi0 * s - (state.m0 * s * s / 2 + (state.shear0 * s * s * s) / 6 + bending) / ei + (state.shear0 * s + shearPart) * inverseShear;
}

/** Deflection at x (mm from the left end) under the combination, mm, positive downward. Exact. */
export function deflectionAt(solution: MemberSolution, factors: CaseFactors, xMm: number): number {
  const span = findSpanAt(solution.nodeXMm, xMm);
  return evaluateLocal(solution, factors, span, xMm - (solution.nodeXMm[span] as number), false);
}

/**
 * Cross-section rotation at x under the combination, rad, positive clockwise (= dv/dx without
 * shear deformation; with it, the slope also carries the shear strain V/(kGA)).
 */
export function rotationAt(solution: MemberSolution, factors: CaseFactors, xMm: number): number {
  const span = findSpanAt(solution.nodeXMm, xMm);
  return evaluateLocal(solution, factors, span, xMm - (solution.nodeXMm[span] as number), true);
}

/** Deflection of node j (a DOF of the solution), mm, positive downward. */
export function getNodeDeflection(solution: MemberSolution, factors: CaseFactors, node: number): number {
  let deflection = 0;
  for (let c = 0; c < factors.length; c++) {
    const f = factors[c] as number;
    if (f !== 0) deflection += f * (solution.caseStates[c * solution.caseStride + 2 * node] as number);
  }
  return deflection;
}

/** Rotation of node j (a DOF of the solution), rad, positive clockwise. */
export function getNodeRotation(solution: MemberSolution, factors: CaseFactors, node: number): number {
  let rotation = 0;
  for (let c = 0; c < factors.length; c++) {
    const f = factors[c] as number;
    if (f !== 0) rotation += f * (solution.caseStates[c * solution.caseStride + 2 * node + 1] as number);
  }
  return rotation;
}

const BINOMIAL: number[][] = [[1], [1, 1], [1, 2, 1], [1, 3, 3, 1], [1, 4, 6, 4, 1], [1, 5, 10, 10, 5, 1]];
const pieceCoefficients = new Float64Array(6);
const extremeScratch: AbsMaxResult = { t: 0, value: 0 };

/** Adds scale * (t + delta)^n to the ascending coefficients. */
function addShiftedPower(coef: Float64Array, scale: number, delta: number, n: number): void {
  if (delta === 0) {
    coef[n] = (coef[n] as number) + scale;
    return;
  }
  const row = BINOMIAL[n] as number[];
  let deltaPower = 1;
  for (let k = n; k >= 0; k--) {
    coef[k] = (coef[k] as number) + scale * (row[k] as number) * deltaPower;
    deltaPower *= delta;
  }
}

/**
 * Writes to `coef` the ascending coefficients (degree 5) of v(s0 + t), the deflection in the
 * load-continuous piece of `span` that starts at local s0 (a breakpoint or 0); `state` is the
 * element's getElementState under the same factors.
 */
export function buildPiecePolynomial(solution: MemberSolution, factors: CaseFactors, span: number, state: ElementState, s0: number, coef: Float64Array): void {
  const ei = solution.eiNmm2[span] as number;
  const inverseShear = solution.inverseShearStiffness[span] as number;
  const terms = solution.terms[span] as ElementTerms;
  coef[0] = state.v0;
  coef[1] = 0;
  coef[2] = 0;
  coef[3] = 0;
  coef[4] = 0;
  coef[5] = 0;
  addShiftedPower(coef, state.psi0 + state.shear0 * inverseShear, s0, 1);
  addShiftedPower(coef, -state.m0 / (2 * ei), s0, 2);
  addShiftedPower(coef, -state.shear0 / (6 * ei), s0, 3);
  const termCount = terms.coefficient.length;
  for (let t = 0; t < termCount; t++) {
    const c = terms.atMm[t] as number;
    if (c > s0) continue;
    const a = (factors[terms.caseIndex[t] as number] as number) * (terms.coefficient[t] as number);
    if (a === 0) continue;
    const p = terms.power[t] as number;
    addShiftedPower(coef, -a / ((p + 1) * (p + 2) * ei), s0 - c, p + 2);
    if (p >= 1 && inverseShear !== 0) addShiftedPower(coef, a * inverseShear, s0 - c, p);
  }
}

/**
 * Deflections (mm) of one span at ascending local positions (mm from the span's left node),
 * written to out[outOffset + k * outStride]; cheaper than deflectionAt point by point.
 */
export function sampleSpanDeflections(solution: MemberSolution, factors: CaseFactors, span: number, localXMm: ArrayLike<number>, out: Float64Array, outOffset: number, outStride: number): void {
  const state = getElementState(solution, factors, span, stateScratch);
  const breakpoints = solution.breakpointsMm[span] as number[];
  const coef = pieceCoefficients;
  let piece = 0;
  let s0 = 0;
  buildPiecePolynomial(solution, factors, span, state, 0, coef);
  for (let k = 0; k < localXMm.length; k++) {
    const s = localXMm[k] as number;
    while (piece < breakpoints.length && s > (breakpoints[piece] as number)) {
      s0 = breakpoints[piece] as number;
      piece += 1;
      buildPiecePolynomial(solution, factors, span, state, s0, coef);
    }
    out[outOffset + k * outStride] = evaluatePolynomial(coef, 5, s - s0);
  }
}

export interface SpanExtreme {
  /** Signed deflection of largest magnitude in the span, mm (+ down). */
  deflectionMm: number;
  /** Its position from the member's left end, mm. */
  atMm: number;
}

/**
 * Largest |deflection| within one span under the combination, found exactly: the deflection is a
 * polynomial (degree <= 5) between load discontinuities, and each piece's extrema come from the
 * real roots of its derivative (see poly-extrema.ts). Ends and discontinuities are candidates.
 */
export function findSpanExtreme(solution: MemberSolution, factors: CaseFactors, span: number, out?: SpanExtreme): SpanExtreme {
  const result = out ?? { deflectionMm: 0, atMm: 0 };
  const state = getElementState(solution, factors, span, stateScratch);
  const length = solution.lengthMm[span] as number;
  const breakpoints = solution.breakpointsMm[span] as number[];
  let bestValue = 0;
  let bestS = 0;
  for (let piece = 0; piece <= breakpoints.length; piece++) {
    const s0 = piece === 0 ? 0 : (breakpoints[piece - 1] as number);
    const s1 = piece < breakpoints.length ? (breakpoints[piece] as number) : length;
    buildPiecePolynomial(solution, factors, span, state, s0, pieceCoefficients);
    const extreme = findPolynomialAbsMax(pieceCoefficients, 5, s1 - s0, extremeScratch);
    if (piece === 0 || Math.abs(extreme.value) > Math.abs(bestValue)) {
      bestValue = extreme.value;
      bestS = s0 + extreme.t;
    }
  }
  result.deflectionMm = bestValue;
  result.atMm = (solution.nodeXMm[span] as number) + bestS;
  return result;
}

/**
 * Writes to `coef` the ascending coefficients (degree 5) of the deflection (mm) of `span` at local
 * s0 + t under the combination, for the load-continuous piece that starts at s0 (0 or a
 * breakpoint of solution.breakpointsMm). For sums over several solutions (cracked concrete,
 * where each load level has its own stiffness).
 */
export function writeSpanPiecePolynomial(solution: MemberSolution, factors: CaseFactors, span: number, s0: number, coef: Float64Array): void {
  const state = getElementState(solution, factors, span, stateScratch);
  buildPiecePolynomial(solution, factors, span, state, s0, coef);
}
