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

/** The worst arrangement found for one span. */
export interface EnvelopeExtreme {
  /** Signed deflection of largest magnitude over every arrangement and position, mm (+ down). */
  deflectionMm: number;
  /** Its position from the member's left end, mm. */
  atMm: number;
  /** Per unit, 1 when that unit is present in the arrangement, else 0 (length >= unit count). */
  selected: Uint8Array;
}

const COEFFICIENTS = 6;
const DEGREE = 5;
let coefficientScratch = new Float64Array(COEFFICIENTS * 16);
let cutScratch = new Float64Array(64);
let signScratch = new Int8Array(64);
const pieceScratch = new Float64Array(COEFFICIENTS);
const sumScratch = new Float64Array(COEFFICIENTS);
const stateScratch: ElementState = { v0: 0, psi0: 0, m0: 0, shear0: 0 };
const maxScratch: AbsMaxResult = { t: 0, value: 0 };
const unitFactorScratch: CaseFactors = [];

function ensureCapacity(coefficients: number, cuts: number, signs: number): void {
  if (coefficientScratch.length < coefficients) coefficientScratch = new Float64Array(coefficients * 2);
  if (cutScratch.length < cuts) cutScratch = new Float64Array(cuts * 2);
  if (signScratch.length < signs) signScratch = new Int8Array(signs * 2);
}

/** Deflection of a node under `factors` restricted to one case, mm. */
function getCaseNodeDeflection(solution: MemberSolution, caseIndex: number, factor: number, node: number): number {
  return factor * (solution.caseStates[caseIndex * solution.caseStride + 2 * node] as number);
}

/**
 * Writes the piece polynomials (degree 5, ascending, local to each piece) of one field into the
 * coefficient scratch at `base`, minus the chord line c0 + c1 * s when chordSlope/chordAt0 given.
 */
function writeFieldPieces(solution: MemberSolution, factors: CaseFactors, span: number, pieceStarts: readonly number[], base: number, chordAt0: number, chordSlope: number): void {
  const state = getElementState(solution, factors, span, stateScratch);
  for (let p = 0; p < pieceStarts.length; p++) {
    const s0 = pieceStarts[p] as number;
    buildPiecePolynomial(solution, factors, span, state, s0, pieceScratch);
    pieceScratch[0] = (pieceScratch[0] as number) - (chordAt0 + chordSlope * s0);
    pieceScratch[1] = (pieceScratch[1] as number) - chordSlope;
    coefficientScratch.set(pieceScratch, base + p * COEFFICIENTS);
  }
}

/** Chord line in the span's local coordinate s: value at s = 0 and slope, from the node values. */
function getChordLine(solution: MemberSolution, span: number, chord: ChordReference | null, startValue: number, endValue: number, out: { at0: number; slope: number }): void {
  if (chord === null) {
    out.at0 = 0;
    out.slope = 0;
    return;
  }
  const xA = solution.nodeXMm[chord.startNode] as number;
  const xB = solution.nodeXMm[chord.endNode] as number;
  const slope = chord.endNode === chord.startNode ? 0 : (endValue - startValue) / (xB - xA);
  out.slope = slope;
  out.at0 = startValue + slope * ((solution.nodeXMm[span] as number) - xA);
}

const chordScratch = { at0: 0, slope: 0 };

/**
 * Largest sign * (F + sum of selected units) over the span, for the arrangement `mask` of signs
 * (units whose sign entry equals `sign` are selected); returns the value, position in best.
 */
function findArrangementMax(unitCount: number, pieceStarts: readonly number[], pieceEnds: readonly number[], signs: Int8Array, signOffset: number, sign: number, best: { value: number; s: number }): void {
  const pieceCount = pieceStarts.length;
  let bestValue = Number.NEGATIVE_INFINITY;
  let bestS = 0;
  for (let p = 0; p < pieceCount; p++) {
    for (let k = 0; k < COEFFICIENTS; k++) sumScratch[k] = coefficientScratch[p * COEFFICIENTS + k] as number;
    for (let u = 0; u < unitCount; u++) {
      if (signs[signOffset + u] !== sign) continue;
      const base = ((u + 1) * pieceCount + p) * COEFFICIENTS;
      for (let k = 0; k < COEFFICIENTS; k++) sumScratch[k] = (sumScratch[k] as number) + (coefficientScratch[base + k] as number);
    }
    const s0 = pieceStarts[p] as number;
    const extreme = findPolynomialSignedMax(sumScratch, DEGREE, (pieceEnds[p] as number) - s0, sign, maxScratch);
    if (sign * extreme.value > bestValue) {
      bestValue = sign * extreme.value;
      bestS = s0 + extreme.t;
    }
  }
  best.value = sign * bestValue;
  best.s = bestS;
}

function hasSameSelection(signs: Int8Array, a: number, b: number, unitCount: number, sign: number): boolean {
  for (let u = 0; u < unitCount; u++) if ((signs[a + u] === sign) !== (signs[b + u] === sign)) return false;
  return true;
}

const arrangementBest = { value: 0, s: 0 };

/**
 * The exact worst arrangement of pattern units for one span, by superposition. Deflection under
 * an arrangement is F(x) + sum of the selected units' contributions C_u(x) (F: the loads always
 * present; a unit: one variable case's part on one span group, with its factor). At any x the
 * worst downward arrangement selects exactly the units with C_u(x) > 0, the worst upward one
 * those with C_u(x) < 0 (the influence-line argument of Mueller-Breslau's principle), so the
 * envelope max over x of max over arrangements equals max over the arrangements that occur along
 * the span of their own exact maximum. Those arrangements change only where some C_u changes
 * sign: the real roots of each unit's piece polynomials split the span into intervals of constant
 * selection, and each distinct selection is maximised exactly (poly-extrema.ts). No 2^n search.
 * `chord` measures from the chord between the span's supports instead of the axis. Units are
 * given as parallel arrays of solved-case index and factor.
 */
export function findEnvelopeExtreme(
  solution: MemberSolution,
  fixedFactors: CaseFactors,
  unitCases: readonly number[],
  unitFactors: readonly number[],
  span: number,
  chord: ChordReference | null,
  out: EnvelopeExtreme,
): EnvelopeExtreme {
  const unitCount = unitCases.length;
  const length = solution.lengthMm[span] as number;
  const breakpoints = solution.breakpointsMm[span] as number[];
  const pieceStarts = [0, ...breakpoints];
  const pieceEnds = [...breakpoints, length];
  const pieceCount = pieceStarts.length;
  const maxCuts = pieceCount * (1 + unitCount * DEGREE) + 1;
  ensureCapacity((unitCount + 1) * pieceCount * COEFFICIENTS, maxCuts, (maxCuts + 1) * unitCount);

  const startNode = chord === null ? 0 : chord.startNode;
  const endNode = chord === null ? 0 : chord.endNode;
  getChordLine(solution, span, chord, getNodeDeflection(solution, fixedFactors, startNode), getNodeDeflection(solution, fixedFactors, endNode), chordScratch);
  writeFieldPieces(solution, fixedFactors, span, pieceStarts, 0, chordScratch.at0, chordScratch.slope);
  while (unitFactorScratch.length < fixedFactors.length) unitFactorScratch.push(0);
  let cutCount = 0;
  for (let p = 0; p < pieceCount; p++) cutScratch[cutCount++] = pieceStarts[p] as number;
  cutScratch[cutCount++] = length;
  for (let u = 0; u < unitCount; u++) {
    const caseIndex = unitCases[u] as number;
    const factor = unitFactors[u] as number;
    unitFactorScratch[caseIndex] = factor;
    getChordLine(solution, span, chord, getCaseNodeDeflection(solution, caseIndex, factor, startNode), getCaseNodeDeflection(solution, caseIndex, factor, endNode), chordScratch);
    const base = (u + 1) * pieceCount * COEFFICIENTS;
    writeFieldPieces(solution, unitFactorScratch, span, pieceStarts, base, chordScratch.at0, chordScratch.slope);
    unitFactorScratch[caseIndex] = 0;
    for (let p = 0; p < pieceCount; p++) {
      const s0 = pieceStarts[p] as number;
      const pieceBase = base + p * COEFFICIENTS;
      for (let k = 0; k < COEFFICIENTS; k++) pieceScratch[k] = coefficientScratch[pieceBase + k] as number;
      const count = findPolynomialRoots(pieceScratch, DEGREE, (pieceEnds[p] as number) - s0, cutScratch, cutCount);
      for (let i = 0; i < count; i++) cutScratch[cutCount + i] = s0 + (cutScratch[cutCount + i] as number);
      cutCount += count;
    }
  }
  const cuts = cutScratch.subarray(0, cutCount).sort();

  // the sign of every unit in each interval of constant selection, evaluated at its midpoint
  let intervalCount = 0;
  let piece = 0;
  for (let k = 0; k + 1 < cutCount; k++) {
    const a = cuts[k] as number;
    const b = cuts[k + 1] as number;
    if (!(b > a)) continue;
    const mid = 0.5 * (a + b);
    while (piece + 1 < pieceCount && mid > (pieceEnds[piece] as number)) piece++;
    const t = mid - (pieceStarts[piece] as number);
    const offset = intervalCount * unitCount;
    for (let u = 0; u < unitCount; u++) {
      const pieceBase = ((u + 1) * pieceCount + piece) * COEFFICIENTS;
      let value = coefficientScratch[pieceBase + DEGREE] as number;
      for (let k = DEGREE - 1; k >= 0; k--) value = value * t + (coefficientScratch[pieceBase + k] as number);
      signScratch[offset + u] = value > 0 ? 1 : value < 0 ? -1 : 0;
    }
    intervalCount++;
  }
  if (intervalCount === 0) {
    // a span shorter than the root resolution: every unit judged at its midpoint
    intervalCount = 1;
    for (let u = 0; u < unitCount; u++) signScratch[u] = 0;
  }

  let bestValue = 0;
  let bestS = 0;
  let bestInterval = -1;
  let bestSign = 1;
  for (const sign of [1, -1]) {
    for (let i = 0; i < intervalCount; i++) {
      let seen = false;
      for (let j = 0; j < i && !seen; j++) seen = hasSameSelection(signScratch, i * unitCount, j * unitCount, unitCount, sign);
      if (seen) continue;
      findArrangementMax(unitCount, pieceStarts, pieceEnds, signScratch, i * unitCount, sign, arrangementBest);
      if (bestInterval < 0 || Math.abs(arrangementBest.value) > Math.abs(bestValue)) {
        bestValue = arrangementBest.value;
        bestS = arrangementBest.s;
        bestInterval = i;
        bestSign = sign;
      }
    }
  }

  if (out.selected.length < unitCount) out.selected = new Uint8Array(unitCount * 2);
  for (let u = 0; u < unitCount; u++) out.selected[u] = signScratch[bestInterval * unitCount + u] === bestSign ? 1 : 0;
  out.deflectionMm = bestValue;
  out.atMm = (solution.nodeXMm[span] as number) + bestS;
  return out;
}
