import type { ElementTerms } from "./element-terms";
import type { CaseFactors } from "./deflection-field";
import { findPolynomialAbsMax, findPolynomialSignedMax, type AbsMaxResult } from "./poly-extrema";
import type { MemberSolution } from "./solve-member";

/** The sagging bending moment of largest magnitude in a span and where it acts. */
export interface SpanMomentExtreme {
  /** Signed: + sagging (tension at the bottom), - hogging; N*mm. */
  momentNmm: number;
  /** Position from the member's left end, mm. */
  atMm: number;
}

const BINOMIAL: number[][] = [[1], [1, 1], [1, 2, 1], [1, 3, 3, 1]];
const momentCoefficients = new Float64Array(6);
const extremeScratch: AbsMaxResult = { t: 0, value: 0 };

/** Adds scale * (t + delta)^n (n <= 3) to ascending coefficients. */
function addShiftedPower(coef: Float64Array, scale: number, delta: number, n: number): void {
  const row = BINOMIAL[n] as number[];
  let deltaPower = 1;
  for (let k = n; k >= 0; k--) {
    coef[k] = (coef[k] as number) + scale * (row[k] as number) * deltaPower;
    deltaPower *= delta;
  }
}

/** Combined moment M0 and shear V0 just right of the span's left node, from the solved case states. */
function getLeftEndForces(solution: MemberSolution, factors: CaseFactors, span: number): { m0: number; shear0: number } {
  const momentOffset = 2 * (solution.spanCount + 1) + span;
  const shearOffset = momentOffset + solution.spanCount;
  let m0 = 0;
  let shear0 = 0;
  for (let c = 0; c < factors.length; c++) {
    const f = factors[c] as number;
    if (f === 0) continue;
    m0 += f * (solution.caseStates[c * solution.caseStride + momentOffset] as number);
    shear0 += f * (solution.caseStates[c * solution.caseStride + shearOffset] as number);
  }
  return { m0, shear0 };
}

/**
 * The sagging moment of largest magnitude within one span under a combination, exact: between
 * load discontinuities the moment is the polynomial M(s) = M0 + V0 s + sum A <s - c>^p (degree
 * <= 3, element-terms.ts), and each piece's extremes come from its derivative's real roots. Both
 * sides of a point load or couple are candidates.
 */
export function findSpanMomentExtreme(solution: MemberSolution, factors: CaseFactors, span: number): SpanMomentExtreme {
  const { m0, shear0 } = getLeftEndForces(solution, factors, span);
  const pieces = (solution.breakpointsMm[span] as number[]).length + 1;
  let bestValue = 0;
  let bestS = 0;
  for (let piece = 0; piece < pieces; piece++) {
    const { s0, s1 } = setPieceCoefficients(solution, factors, span, piece, m0, shear0);
    const extreme = findPolynomialAbsMax(momentCoefficients, 3, s1 - s0, extremeScratch);
    if (piece === 0 || Math.abs(extreme.value) > Math.abs(bestValue)) {
      bestValue = extreme.value;
      bestS = s0 + extreme.t;
    }
  }
  return { momentNmm: bestValue, atMm: (solution.nodeXMm[span] as number) + bestS };
}

/**
 * Sets momentCoefficients to M(s0 + t) on one piece of a span (between load discontinuities) and
 * returns the piece's ends s0, s1 measured from the span's left node.
 */
function setPieceCoefficients(solution: MemberSolution, factors: CaseFactors, span: number, piece: number, m0: number, shear0: number): { s0: number; s1: number } {
  const terms = solution.terms[span] as ElementTerms;
  const breakpoints = solution.breakpointsMm[span] as number[];
  const s0 = piece === 0 ? 0 : (breakpoints[piece - 1] as number);
  const s1 = piece < breakpoints.length ? (breakpoints[piece] as number) : (solution.lengthMm[span] as number);
  const coef = momentCoefficients;
  coef.fill(0);
  coef[0] = m0 + shear0 * s0;
  coef[1] = shear0;
  for (let t = 0; t < terms.coefficient.length; t++) {
    const c = terms.atMm[t] as number;
    if (c > s0) continue;
    const a = (factors[terms.caseIndex[t] as number] as number) * (terms.coefficient[t] as number);
    if (a !== 0) addShiftedPower(coef, a, s0 - c, terms.power[t] as number);
  }
  return { s0, s1 };
}

/** The largest sagging and the largest hogging moment of a span, N*mm: sagging >= 0 >= hogging. */
export interface SpanMomentRange {
  saggingNmm: number;
  hoggingNmm: number;
}

/**
 * The span's largest sagging (most positive) and largest hogging (most negative) moment under a
 * combination, each 0 when the moment never has that sign; exact by the same pieces as
 * findSpanMomentExtreme.
 */
export function findSpanMomentRange(solution: MemberSolution, factors: CaseFactors, span: number): SpanMomentRange {
  const { m0, shear0 } = getLeftEndForces(solution, factors, span);
  const pieces = (solution.breakpointsMm[span] as number[]).length + 1;
  let sagging = 0;
  let hogging = 0;
  for (let piece = 0; piece < pieces; piece++) {
    const { s0, s1 } = setPieceCoefficients(solution, factors, span, piece, m0, shear0);
    sagging = Math.max(sagging, findPolynomialSignedMax(momentCoefficients, 3, s1 - s0, 1, extremeScratch).value);
    hogging = Math.min(hogging, findPolynomialSignedMax(momentCoefficients, 3, s1 - s0, -1, extremeScratch).value);
  }
  return { saggingNmm: sagging, hoggingNmm: hogging };
}
