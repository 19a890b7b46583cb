/**
 * Deflection that is a weighted sum over several solutions of one member, each solved with its
 * own stiffness: a cracked member's immediate live deflection is the deflection under
 * dead + live (I_e at that load) minus the deflection under dead alone (I_e at dead), and its
 * creep part is lambda times the sustained deflection. Every solution must come from the same
 * member geometry and loads (only I differs), so they share load breakpoints.
 */
import { getNodeDeflection, getNodeRotation, sampleSpanDeflections, writeSpanPiecePolynomial, type CaseFactors, type SpanExtreme } from "../solver/deflection-field";
import { findPolynomialAbsMax, type AbsMaxResult } from "../solver/poly-extrema";
import type { ChordReference } from "../solver/pattern-envelope";
import type { MemberSolution } from "../solver/solve-member";

/** weight x (deflection of `solution` under `factors`). */
export interface DeflectionTerm {
  solution: MemberSolution;
  factors: CaseFactors;
  weight: number;
}

const termCoefficients = new Float64Array(6);
const sumCoefficients = new Float64Array(6);
const extremeScratch: AbsMaxResult = { t: 0, value: 0 };

/**
 * Largest |sum of weighted deflections| within one span, mm (signed, + down), and where (mm from
 * the member's left end): exact, because the sum is again a polynomial of degree <= 5 between
 * load discontinuities (see deflection-field.ts findSpanExtreme). With `chord`, measured from the
 * chord through the combined deflections of its two support nodes (for an overhang, one node: a
 * level line through it), as pattern-envelope.ts measures uncracked members; a line is linear in
 * the deflections, so the chord of the sum is the sum of the chords.
 */
export function findCombinedSpanExtreme(terms: readonly DeflectionTerm[], span: number, out: SpanExtreme, chord: ChordReference | null = null): SpanExtreme {
  const first = terms[0]!.solution;
  const breakpoints = first.breakpointsMm[span] as number[];
  const length = first.lengthMm[span] as number;
  // the chord line in the span's local s: value at s = 0 and slope (pattern-envelope.ts's rule)
  let chordAt0 = 0;
  let chordSlope = 0;
  if (chord !== null) {
    const startValue = getCombinedNodeDeflection(terms, chord.startNode);
    const xA = first.nodeXMm[chord.startNode] as number;
    chordSlope = chord.endNode === chord.startNode ? 0 : (getCombinedNodeDeflection(terms, chord.endNode) - startValue) / ((first.nodeXMm[chord.endNode] as number) - xA);
    chordAt0 = startValue + chordSlope * ((first.nodeXMm[span] as number) - xA);
  }
  let bestValue = 0;
  let bestS = 0;
  for (let piece = 0; piece <= breakpoints.length; piece++) {
    const s0 = piece === 0 ? 0 : (breakpoints[piece - 1] as number);
    const s1 = piece < breakpoints.length ? (breakpoints[piece] as number) : length;
    sumCoefficients.fill(0);
    for (const term of terms) {
      writeSpanPiecePolynomial(term.solution, term.factors, span, s0, termCoefficients);
      for (let k = 0; k < 6; k++) sumCoefficients[k] = (sumCoefficients[k] as number) + term.weight * (termCoefficients[k] as number);
    }
    sumCoefficients[0] = (sumCoefficients[0] as number) - (chordAt0 + chordSlope * s0);
    sumCoefficients[1] = (sumCoefficients[1] as number) - chordSlope;
    const extreme = findPolynomialAbsMax(sumCoefficients, 5, s1 - s0, extremeScratch);
    if (piece === 0 || Math.abs(extreme.value) > Math.abs(bestValue)) {
      bestValue = extreme.value;
      bestS = s0 + extreme.t;
    }
  }
  out.deflectionMm = bestValue;
  out.atMm = (first.nodeXMm[span] as number) + bestS;
  return out;
}

/** Weighted sum of the node's deflection over the terms, mm, + down. */
export function getCombinedNodeDeflection(terms: readonly DeflectionTerm[], node: number): number {
  let deflection = 0;
  for (const term of terms) deflection += term.weight * getNodeDeflection(term.solution, term.factors, node);
  return deflection;
}

/** Weighted sum of the node's rotation over the terms, rad, + clockwise. */
export function getCombinedNodeRotation(terms: readonly DeflectionTerm[], node: number): number {
  let rotation = 0;
  for (const term of terms) rotation += term.weight * getNodeRotation(term.solution, term.factors, node);
  return rotation;
}

let sampleScratch = new Float64Array(32);

/**
 * Weighted sum of the terms' deflections (mm) of one span at ascending local positions, written to
 * out[outOffset + k * outStride] (the combined form of sampleSpanDeflections).
 */
export function sampleCombinedSpanDeflections(terms: readonly DeflectionTerm[], span: number, localXMm: ArrayLike<number>, out: Float64Array, outOffset: number, outStride: number): void {
  const count = localXMm.length;
  if (sampleScratch.length < count) sampleScratch = new Float64Array(2 * count);
  for (let k = 0; k < count; k++) out[outOffset + k * outStride] = 0;
  for (const term of terms) {
    sampleSpanDeflections(term.solution, term.factors, span, localXMm, sampleScratch, 0, 1);
    for (let k = 0; k < count; k++) out[outOffset + k * outStride] = (out[outOffset + k * outStride] as number) + term.weight * (sampleScratch[k] as number);
  }
}
