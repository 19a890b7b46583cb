/**
 * Loads inside one element as Macaulay terms of the bending moment.
 *
 * Within an element (local s from its left node, 0 <= s <= L) the sagging bending moment is
 *   M(s) = M0 + V0 s + sum_t A_t <s - c_t>^p_t
 * where M0, V0 are the moment and shear just right of the left node and <u>^p = u^p for u >= 0,
 * 0 otherwise. A point load P (down) at c gives A = -P, p = 1; a clockwise couple C gives A = +C,
 * p = 0; a distributed load q0 <t-c>^0 gives A = -q0/2, p = 2 and a slope k <t-c>^1 gives
 * A = -k/6, p = 3 (integrating q(t)(s - t) twice). Equilibrium with v downward:
 *   EI psi'(s) = -M(s),  v'(s) = psi(s) + V(s)/(kGA),  V = dM/ds.
 * Integrating from the left node gives the exact deflection everywhere:
 *   v(s) = v0 + psi0 s - (M0 s^2/2 + V0 s^3/6 + sum A <s-c>^(p+2)/((p+1)(p+2)))/EI
 *          + (V0 s + sum_{p>=1} A <s-c>^p)/(kGA).
 */
export interface ElementTerms {
  /** Coefficient A (units depend on p: N*mm for p 0, N for 1, N/mm for 2, N/mm^2 for 3). */
  coefficient: number[];
  /** Position c, mm from the element's left node. */
  atMm: number[];
  power: number[];
  /** Index of the load case the term belongs to. */
  caseIndex: number[];
}

/** An empty term list for one element. */
export function createElementTerms(): ElementTerms {
  return { coefficient: [], atMm: [], power: [], caseIndex: [] };
}

function pushTerm(terms: ElementTerms, coefficient: number, atMm: number, power: number, caseIndex: number): void {
  if (coefficient === 0) return;
  terms.coefficient.push(coefficient);
  terms.atMm.push(atMm);
  terms.power.push(power);
  terms.caseIndex.push(caseIndex);
}

/**
 * Adds a linearly varying load q(s) = qStart + (qEnd - qStart)(s - a)/(b - a) on [a, b] (local mm,
 * 0 <= a < b <= L). Terms that would start at or beyond L act nowhere inside and are dropped.
 */
export function addDistributedTerms(
  terms: ElementTerms,
  lengthMm: number,
  startMm: number,
  endMm: number,
  qStartNPerMm: number,
  qEndNPerMm: number,
  caseIndex: number,
): void {
  const slope = (qEndNPerMm - qStartNPerMm) / (endMm - startMm);
  pushTerm(terms, -qStartNPerMm / 2, startMm, 2, caseIndex);
  pushTerm(terms, -slope / 6, startMm, 3, caseIndex);
  if (endMm < lengthMm) {
    pushTerm(terms, qEndNPerMm / 2, endMm, 2, caseIndex);
    pushTerm(terms, slope / 6, endMm, 3, caseIndex);
  }
}

/** A point load pN (N, + down) at local atMm: A = -P, p = 1. */
export function addPointTerm(terms: ElementTerms, atMm: number, pN: number, caseIndex: number): void {
  pushTerm(terms, -pN, atMm, 1, caseIndex);
}

/** A couple mNmm (N*mm, + clockwise) at local atMm: A = +C, p = 0. */
export function addCoupleTerm(terms: ElementTerms, atMm: number, mNmm: number, caseIndex: number): void {
  pushTerm(terms, mNmm, atMm, 0, caseIndex);
}

/** d^p for the small integer powers of the terms (0^0 = 1: a couple at s = L still acts). */
export function getPower(d: number, p: number): number {
  switch (p) {
    case 0:
      return 1;
    case 1:
      return d;
    case 2:
      return d * d;
    case 3:
      return d * d * d;
    default:
      return d ** p;
  }
}

/** Load integrals at s = L needed for the fixed-end forces of one load case. */
export interface EndIntegrals {
  /** integral_0^L of the load part of M. */
  firstIntegral: number;
  /** double integral_0^L of the load part of M. */
  secondIntegral: number;
  /** Load part of M at L, couples included. */
  momentAtEnd: number;
  /** Load part of M at L without couples (the shear-deflection part). */
  shearMomentAtEnd: number;
  /** Total downward load on the element, N. */
  totalLoadN: number;
}

/** Accumulates the end integrals of every term of `caseIndex` into `out` (reset first). */
export function getEndIntegrals(terms: ElementTerms, lengthMm: number, caseIndex: number, out: EndIntegrals): EndIntegrals {
  out.firstIntegral = 0;
  out.secondIntegral = 0;
  out.momentAtEnd = 0;
  out.shearMomentAtEnd = 0;
  out.totalLoadN = 0;
  const count = terms.coefficient.length;
  for (let t = 0; t < count; t++) {
    if (terms.caseIndex[t] !== caseIndex) continue;
    const a = terms.coefficient[t] as number;
    const p = terms.power[t] as number;
    const d = lengthMm - (terms.atMm[t] as number);
    const dp = getPower(d, p);
    out.momentAtEnd += a * dp;
    out.firstIntegral += (a * dp * d) / (p + 1);
    out.secondIntegral += (a * dp * d * d) / ((p + 1) * (p + 2));
    if (p >= 1) {
      out.shearMomentAtEnd += a * dp;
      // V(L) - V0 = sum A p d^(p-1) = -(total load)
      out.totalLoadN -= a * p * getPower(d, p - 1);
    }
  }
  return out;
}
