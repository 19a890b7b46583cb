import { buildPiecePolynomial, getElementState, getNodeDeflection, type CaseFactors, type ElementState } from "./deflection-field";
import { findPolynomialRoots, findPolynomialSignedMax, type AbsMaxResult } from "./poly-extrema";
import type { MemberSolution } from "./solve-member";

/**
 * The line a span's deflection is measured from: the chord through the deflected supports at
 * nodes startNode and endNode; for an overhang both are its one support (a level line through
 * it). Null measures from the undeflected axis (total deflection, settlement included).
 */
export interface ChordReference {
  startNode: number;
  endNode: number;
}

const COEFFICIENTS = 6;
const DEGREE = 5;

/**
 * What one span's arrangements need from the solved cases, at factor 1, shared by every
 * combination (a factor scales a case without moving its roots): the piece polynomials of each
 * solved case's deflection in this span (chord removed when measured from the chord), their
 * Bernstein coefficients (bounds), and the sign of each variable part in each interval between
 * consecutive roots of the parts (where no part changes sign).
 */
export interface SpanPatternBasis {
  span: number;
  chord: ChordReference | null;
  /** Solved case indices of the parts, in order: a selection is indexed like this. */
  partCases: readonly number[];
  pieceStarts: number[];
  pieceEnds: number[];
  /** (solved case, piece, coefficient), ascending power, local to the piece. */
  coefficients: Float64Array;
  bernstein: Float64Array;
  /** (interval, part): -1, 0 or 1. */
  signs: Int8Array;
  intervalCount: number;
}

/** The worst arrangement found for one span. */
export interface EnvelopeExtreme {
  /** Signed deflection of largest magnitude over every arrangement and position, mm (+ down). */
  deflectionMm: number;
  /** Its position from the member's left end, mm. */
  atMm: number;
  /** Per part of the basis, 1 when present in the arrangement, else 0 (length >= part count). */
  selected: Uint8Array;
}

const pieceScratch = new Float64Array(COEFFICIENTS);
const sumScratch = new Float64Array(COEFFICIENTS);
const stateScratch: ElementState = { v0: 0, psi0: 0, m0: 0, shear0: 0 };
const maxScratch: AbsMaxResult = { t: 0, value: 0 };
const unitFactorScratch: CaseFactors = [];
const chordScratch = { at0: 0, slope: 0 };
// C(i, k) / C(5, k) for the power-to-Bernstein change of basis on [0, 1]
const BERNSTEIN_WEIGHTS: number[][] = [0, 1, 2, 3, 4, 5].map((i) => [0, 1, 2, 3, 4, 5].map((k) => (k > i ? 0 : getBinomial(i, k) / getBinomial(DEGREE, k))));

function getBinomial(n: number, k: number): number {
  let value = 1;
  for (let j = 1; j <= k; j++) value = (value * (n - k + j)) / j;
  return value;
}

/** Chord line in the span's local coordinate s: value at s = 0 and slope, from the node values. */
function getChordLine(solution: MemberSolution, span: number, chord: ChordReference | null, startValue: number, endValue: number): void {
  if (chord === null) {
    chordScratch.at0 = 0;
    chordScratch.slope = 0;
    return;
  }
  const xA = solution.nodeXMm[chord.startNode] as number;
  const xB = solution.nodeXMm[chord.endNode] as number;
  const slope = chord.endNode === chord.startNode ? 0 : (endValue - startValue) / (xB - xA);
  chordScratch.slope = slope;
  chordScratch.at0 = startValue + slope * ((solution.nodeXMm[span] as number) - xA);
}

/**
 * Writes the piece polynomials of one field (chord removed) and their Bernstein coefficients
 * (on each piece's own length) at `base` of the two arrays.
 */
function writeFieldPieces(solution: MemberSolution, factors: CaseFactors, span: number, chord: ChordReference | null, pieceStarts: readonly number[], pieceEnds: readonly number[], coefficients: Float64Array, bernstein: Float64Array, base: number): void {
  if (chord !== null) getChordLine(solution, span, chord, getNodeDeflection(solution, factors, chord.startNode), getNodeDeflection(solution, factors, chord.endNode));
  else getChordLine(solution, span, null, 0, 0);
  const state = getElementState(solution, factors, span, stateScratch);
  for (let p = 0; p < pieceStarts.length; p++) {
    const s0 = pieceStarts[p] as number;
    buildPiecePolynomial(solution, factors, span, state, s0, pieceScratch);
    pieceScratch[0] = (pieceScratch[0] as number) - (chordScratch.at0 + chordScratch.slope * s0);
    pieceScratch[1] = (pieceScratch[1] as number) - chordScratch.slope;
    const offset = base + p * COEFFICIENTS;
    coefficients.set(pieceScratch, offset);
    const length = (pieceEnds[p] as number) - s0;
    let scale = 1;
    for (let k = 0; k < COEFFICIENTS; k++) {
      pieceScratch[k] = (pieceScratch[k] as number) * scale;
      scale *= length;
    }
    for (let i = 0; i < COEFFICIENTS; i++) {
      const weights = BERNSTEIN_WEIGHTS[i] as number[];
      let b = 0;
      for (let k = 0; k <= i; k++) b += (weights[k] as number) * (pieceScratch[k] as number);
      bernstein[offset + i] = b;
    }
  }
}

/**
 * Coefficients this small relative to the largest are round-off (a deflection that vanishes at
 * a support comes out as +-1e-17 of its size there): a sign change they hide lies within a
 * sliver where the part contributes under 1e-9 of its own size, which cannot move a check.
 */
const BERNSTEIN_ZERO_RATIO = 1e-9;

/**
 * Whether the six Bernstein coefficients at `offset` are all >= 0 or all <= 0 (round-off
 * aside): then the polynomial cannot change sign inside its interval (every Bernstein basis
 * polynomial is positive there), even when it vanishes at an end, as at a support.
 */
function hasNoSignChange(bernstein: Float64Array, offset: number): boolean {
  let largest = 0;
  for (let k = 0; k < COEFFICIENTS; k++) largest = Math.max(largest, Math.abs(bernstein[offset + k] as number));
  const zero = largest * BERNSTEIN_ZERO_RATIO;
  let positive = false;
  let negative = false;
  for (let k = 0; k < COEFFICIENTS; k++) {
    const b = bernstein[offset + k] as number;
    if (b > zero) positive = true;
    else if (b < -zero) negative = true;
  }
  return !(positive && negative);
}

/**
 * The span's pattern basis (see SpanPatternBasis): each part solved at factor 1, its real roots
 * in the span (poly-extrema.ts, exact up to round-off), and its sign between them. Built once
 * per span and member, used by every combination. `reuse`: a basis no longer needed whose
 * arrays are overwritten and returned (allocation costs more than the arithmetic here).
 */
export function createSpanPatternBasis(solution: MemberSolution, span: number, partCases: readonly number[], chord: ChordReference | null, reuse?: SpanPatternBasis): SpanPatternBasis {
  const length = solution.lengthMm[span] as number;
  const breakpoints = solution.breakpointsMm[span] as number[];
  const pieceStarts = reuse === undefined ? [] : reuse.pieceStarts;
  const pieceEnds = reuse === undefined ? [] : reuse.pieceEnds;
  pieceStarts.length = 0;
  pieceEnds.length = 0;
  pieceStarts.push(0);
  for (const b of breakpoints) {
    pieceStarts.push(b);
    pieceEnds.push(b);
  }
  pieceEnds.push(length);
  const pieceCount = pieceStarts.length;
  const partCount = partCases.length;
  const caseCount = solution.caseNames.length;
  const size = caseCount * pieceCount * COEFFICIENTS;
  const coefficients = reuse !== undefined && reuse.coefficients.length >= size ? reuse.coefficients : new Float64Array(size * 2);
  const bernstein = reuse !== undefined && reuse.bernstein.length >= size ? reuse.bernstein : new Float64Array(size * 2);
  while (unitFactorScratch.length < caseCount) unitFactorScratch.push(0);
  for (let c = 0; c < caseCount; c++) {
    unitFactorScratch[c] = 1;
    writeFieldPieces(solution, unitFactorScratch, span, chord, pieceStarts, pieceEnds, coefficients, bernstein, c * pieceCount * COEFFICIENTS);
    unitFactorScratch[c] = 0;
  }
  if (cutScratch.length < pieceCount * (1 + partCount * DEGREE) + 1) cutScratch = new Float64Array(2 * (pieceCount * (1 + partCount * DEGREE) + 1));
  let cutCount = 0;
  for (let p = 0; p < pieceCount; p++) cutScratch[cutCount++] = pieceStarts[p] as number;
  cutScratch[cutCount++] = length;
  for (let u = 0; u < partCount; u++) {
    const caseIndex = partCases[u] as number;
    for (let p = 0; p < pieceCount; p++) {
      const offset = (caseIndex * pieceCount + p) * COEFFICIENTS;
      if (hasNoSignChange(bernstein, offset)) continue;
      const s0 = pieceStarts[p] as number;
      for (let k = 0; k < COEFFICIENTS; k++) pieceScratch[k] = coefficients[offset + k] as number;
      const count = findPolynomialRoots(pieceScratch, DEGREE, (pieceEnds[p] as number) - s0, cutScratch, cutCount);
      for (let i = 0; i < count; i++) cutScratch[cutCount + i] = s0 + (cutScratch[cutCount + i] as number);
      cutCount += count;
    }
  }
  const cuts = cutScratch.subarray(0, cutCount).sort();
  const signSize = (cutCount > 1 ? cutCount - 1 : 1) * (partCount > 0 ? partCount : 1);
  const signs = reuse !== undefined && reuse.signs.length >= signSize ? reuse.signs : new Int8Array(signSize * 2);
  let intervalCount = 0;
  let piece = 0;
  for (let k = 0; k + 1 < cutCount; k++) {
    const a = cuts[k] as number;
    const b = cuts[k + 1] as number;
    if (!(b > a)) continue;
    const mid = 0.5 * (a + b);
    while (piece + 1 < pieceCount && mid > (pieceEnds[piece] as number)) piece++;
    const t = mid - (pieceStarts[piece] as number);
    for (let u = 0; u < partCount; u++) {
      const base = ((partCases[u] as number) * pieceCount + piece) * COEFFICIENTS;
      let value = coefficients[base + DEGREE] as number;
      for (let j = DEGREE - 1; j >= 0; j--) value = value * t + (coefficients[base + j] as number);
      signs[intervalCount * partCount + u] = value > 0 ? 1 : value < 0 ? -1 : 0;
    }
    intervalCount++;
  }
  // a span shorter than root resolution: one interval where every part counts as zero
  if (intervalCount === 0) {
    for (let u = 0; u < partCount; u++) signs[u] = 0;
    intervalCount = 1;
  }
  if (reuse === undefined) return { span, chord, partCases, pieceStarts, pieceEnds, coefficients, bernstein, signs, intervalCount };
  reuse.span = span;
  reuse.chord = chord;
  reuse.partCases = partCases;
  reuse.coefficients = coefficients;
  reuse.bernstein = bernstein;
  reuse.signs = signs;
  reuse.intervalCount = intervalCount;
  return reuse;
}

let cutScratch = new Float64Array(64);
let fixedCoefficients = new Float64Array(COEFFICIENTS * 8);
let fixedBernstein = new Float64Array(COEFFICIENTS * 8);
const candidateScratch: number[] = [];
let selectionScratch = new Int8Array(64);

/** Whether part u is in the arrangement of interval i for direction `sign` under the factors. */
function isSelected(basis: SpanPatternBasis, factors: CaseFactors, interval: number, u: number, sign: number): boolean {
  const factor = factors[basis.partCases[u] as number] as number;
  const partSign = basis.signs[interval * basis.partCases.length + u] as number;
  return factor !== 0 && partSign !== 0 && (factor > 0 ? partSign : -partSign) === sign;
}

/** Writes the selection of one candidate (1 selected, 0 not) at `offset` of selectionScratch. */
function writeSelection(basis: SpanPatternBasis, factors: CaseFactors, interval: number, sign: number, offset: number): void {
  for (let u = 0; u < basis.partCases.length; u++) selectionScratch[offset + u] = isSelected(basis, factors, interval, u, sign) ? 1 : 0;
}

/** The always-present field F on each piece: the solved cases' basis fields times their factors. */
function writeFixedPieces(basis: SpanPatternBasis, fixedFactors: CaseFactors, pieceCount: number): void {
  const size = pieceCount * COEFFICIENTS;
  for (let i = 0; i < size; i++) {
    fixedCoefficients[i] = 0;
    fixedBernstein[i] = 0;
  }
  for (let c = 0; c < fixedFactors.length; c++) {
    const f = fixedFactors[c] as number;
    if (f === 0) continue;
    const base = c * size;
    for (let i = 0; i < size; i++) {
      fixedCoefficients[i] = (fixedCoefficients[i] as number) + f * (basis.coefficients[base + i] as number);
      fixedBernstein[i] = (fixedBernstein[i] as number) + f * (basis.bernstein[base + i] as number);
    }
  }
}

/** Sum of the fixed field and the selected parts (scaled by their factors) on one piece. */
function sumPiece(basis: SpanPatternBasis, source: Float64Array, fixed: Float64Array, factors: CaseFactors, selection: number, piece: number, out: Float64Array): void {
  const pieceCount = basis.pieceStarts.length;
  const partCount = basis.partCases.length;
  for (let k = 0; k < COEFFICIENTS; k++) out[k] = fixed[piece * COEFFICIENTS + k] as number;
  for (let u = 0; u < partCount; u++) {
    if (selectionScratch[selection + u] !== 1) continue;
    const caseIndex = basis.partCases[u] as number;
    const factor = factors[caseIndex] as number;
    const base = (caseIndex * pieceCount + piece) * COEFFICIENTS;
    for (let k = 0; k < COEFFICIENTS; k++) out[k] = (out[k] as number) + factor * (source[base + k] as number);
  }
}

/**
 * The exact worst arrangement of pattern parts for one span, by superposition. Deflection under
 * an arrangement is F(x) + sum of the selected parts' contributions f_u C_u(x) (F: the loads
 * always present; a part: one variable case's loads on one span group, f_u its factor). At any x
 * the worst downward arrangement selects exactly the parts with f_u C_u(x) > 0, the worst upward
 * one those with f_u C_u(x) < 0 (the influence-line argument of Mueller-Breslau's principle), so
 * the envelope, max over x of the max over arrangements, equals the max over the arrangements
 * that occur along the span of their own exact maximum; they change only where a part changes
 * sign (the basis intervals). No 2^n search. A candidate whose Bernstein bound cannot beat the
 * best found so far is skipped (the Bernstein coefficients of a polynomial bound it on its
 * interval). fixedFactors: the combination's factors with the parts' entries zero; factors: the
 * full combination (the parts' factors are read from it).
 */
export function findEnvelopeExtreme(solution: MemberSolution, basis: SpanPatternBasis, fixedFactors: CaseFactors, factors: CaseFactors, out: EnvelopeExtreme): EnvelopeExtreme {
  const pieceCount = basis.pieceStarts.length;
  const partCount = basis.partCases.length;
  const intervalCount = basis.intervalCount;
  if (fixedCoefficients.length < pieceCount * COEFFICIENTS) {
    fixedCoefficients = new Float64Array(pieceCount * COEFFICIENTS * 2);
    fixedBernstein = new Float64Array(pieceCount * COEFFICIENTS * 2);
  }
  if (selectionScratch.length < 2 * intervalCount * partCount + partCount) selectionScratch = new Int8Array(4 * intervalCount * partCount + partCount);
  writeFixedPieces(basis, fixedFactors, pieceCount);

  // candidates: one per distinct (direction, selection), with an upper bound of sign * deflection
  const candidates = candidateScratch;
  candidates.length = 0;
  let candidateCount = 0;
  for (let sign = 1; sign >= -1; sign -= 2) {
    for (let i = 0; i < intervalCount; i++) {
      const offset = candidateCount * partCount;
      writeSelection(basis, factors, i, sign, offset);
      let seen = false;
      for (let j = 0; j < candidateCount && !seen; j++) {
        if ((candidates[3 * j + 1] as number) !== sign) continue;
        seen = true;
        for (let u = 0; u < partCount && seen; u++) seen = selectionScratch[j * partCount + u] === selectionScratch[offset + u];
      }
      if (seen) continue;
      let bound = Number.NEGATIVE_INFINITY;
      for (let p = 0; p < pieceCount; p++) {
        sumPiece(basis, basis.bernstein, fixedBernstein, factors, offset, p, sumScratch);
        for (let k = 0; k < COEFFICIENTS; k++) if (sign * (sumScratch[k] as number) > bound) bound = sign * (sumScratch[k] as number);
      }
      candidates.push(bound, sign, offset);
      candidateCount++;
    }
  }

  let bestValue = 0;
  let bestS = 0;
  let bestSelection = -1;
  for (let evaluated = 0; evaluated < candidateCount; evaluated++) {
    // highest bound first, so the bound check prunes the rest as early as possible
    let next = -1;
    for (let j = 0; j < candidateCount; j++) if ((candidates[3 * j + 1] as number) !== 0 && (next < 0 || (candidates[3 * j] as number) > (candidates[3 * next] as number))) next = j;
    const bound = candidates[3 * next] as number;
    const sign = candidates[3 * next + 1] as number;
    const selection = candidates[3 * next + 2] as number;
    candidates[3 * next + 1] = 0;
    if (bestSelection >= 0 && !(bound > Math.abs(bestValue))) break;
    for (let p = 0; p < pieceCount; p++) {
      sumPiece(basis, basis.coefficients, fixedCoefficients, factors, selection, p, sumScratch);
      const s0 = basis.pieceStarts[p] as number;
      const extreme = findPolynomialSignedMax(sumScratch, DEGREE, (basis.pieceEnds[p] as number) - s0, sign, maxScratch);
      if (bestSelection < 0 || Math.abs(extreme.value) > Math.abs(bestValue)) {
        bestValue = extreme.value;
        bestS = s0 + extreme.t;
        bestSelection = selection;
      }
    }
  }

  if (out.selected.length < partCount) out.selected = new Uint8Array(partCount * 2);
  for (let u = 0; u < partCount; u++) out.selected[u] = selectionScratch[bestSelection + u] as number;
  out.deflectionMm = bestValue;
  out.atMm = (solution.nodeXMm[basis.span] as number) + bestS;
  return out;
}
