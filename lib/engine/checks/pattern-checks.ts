import type { CheckResult, Member } from "../model";
import { getNodeDeflection, type CaseFactors, type SpanExtreme } from "../solver/deflection-field";
import { createSpanPatternBasis, findEnvelopeExtreme, type EnvelopeExtreme, type SpanPatternBasis } from "../solver/pattern-envelope";
import type { MemberSolution } from "../solver/solve-member";
import type { SpanJudgement } from "./span-groups";

/**
 * What the checks of one member share for patterns and moving supports: the solved per-span
 * parts of its variable cases (solve-member.ts PatternSplit), whether a support is a spring,
 * and each span's pattern basis, built on first use and reused by every combination.
 */
export interface MemberPatternContext {
  solution: MemberSolution;
  judgements: readonly SpanJudgement[];
  partCases: number[];
  springs: boolean;
  totalBases: (SpanPatternBasis | undefined)[];
  chordBases: (SpanPatternBasis | undefined)[];
}

/** Whether any support of the member moves under load (a spring). */
export function hasSpringSupport(member: Member): boolean {
  for (const support of member.supports) if (support.kind === "spring") return true;
  return false;
}

/**
 * The member's pattern context; null when no check needs it (no variable part was solved and no
 * support moves), which keeps single spans on the plain path.
 */
export function createMemberPatternContext(member: Member, solution: MemberSolution, judgements: readonly SpanJudgement[]): MemberPatternContext | null {
  let partCases: number[] | null = null;
  for (let c = 0; c < solution.casePatternGroup.length; c++) if ((solution.casePatternGroup[c] as number) >= 0) (partCases ??= []).push(c);
  const springs = hasSpringSupport(member);
  if (partCases === null && !springs) return null;
  return { solution, judgements, partCases: partCases ?? [], springs, totalBases: [], chordBases: [] };
}

/**
 * Whether a combination needs the general path: it gives a variable part a non-zero factor, or
 * a support moves. Otherwise every load is always present and the deflection is total.
 */
export function needsPatternPath(context: MemberPatternContext | null, factors: CaseFactors): context is MemberPatternContext {
  if (context === null) return false;
  if (context.springs) return true;
  for (const c of context.partCases) if ((factors[c] as number) !== 0) return true;
  return false;
}


const totalScratch: EnvelopeExtreme = { deflectionMm: 0, atMm: 0, selected: new Uint8Array(16) };
const chordScratch: EnvelopeExtreme = { deflectionMm: 0, atMm: 0, selected: new Uint8Array(16) };
const fixedScratch: CaseFactors = [];
// bases of the previous member, whose arrays the next member's bases overwrite
const totalPool: SpanPatternBasis[] = [];
const chordPool: SpanPatternBasis[] = [];
// figures of the last findPatternExtreme call, read by addPatternFigures
let lastLoadedSpans: Record<string, number[]> | null = null;
const lastChord = { chordDeflectionMm: 0, totalDeflectionMm: 0, startMm: 0, endMm: null as number | null, basis: "total" as "total" | "chord" };

function getArrangedNodeDeflection(context: MemberPatternContext, factors: CaseFactors, fixedFactors: CaseFactors, selected: Uint8Array, node: number): number {
  const solution = context.solution;
  let value = getNodeDeflection(solution, fixedFactors, node);
  for (let u = 0; u < context.partCases.length; u++) {
    const c = context.partCases[u] as number;
    if (selected[u] === 1) value += (factors[c] as number) * (solution.caseStates[c * solution.caseStride + 2 * node] as number);
  }
  return value;
}

/**
 * Per variable case with a non-zero factor, the spans (element indices, ascending) loaded.
 * Null when the combination has no such case.
 */
function getLoadedSpans(context: MemberPatternContext, factors: CaseFactors, selected: Uint8Array): Record<string, number[]> | null {
  const { solution, partCases, judgements } = context;
  let loaded: Record<string, number[]> | null = null;
  for (let u = 0; u < partCases.length; u++) {
    const caseIndex = partCases[u] as number;
    if ((factors[caseIndex] as number) === 0) continue;
    loaded ??= {};
    loaded[solution.caseNames[caseIndex] as string] ??= [];
  }
  if (loaded === null) return null;
  // spans in ascending order: each belongs to one group, so each is pushed at most once per case
  for (let e = 0; e < judgements.length; e++) {
    const group = judgements[e]!.groupIndex;
    for (let u = 0; u < partCases.length; u++) {
      const caseIndex = partCases[u] as number;
      if (selected[u] !== 1 || (factors[caseIndex] as number) === 0 || solution.casePatternGroup[caseIndex] !== group) continue;
      const spans = loaded[solution.caseNames[caseIndex] as string]!;
      if (spans[spans.length - 1] !== e) spans.push(e);
    }
  }
  return loaded;
}

/**
 * The check's deflection under the worst arrangement of the combination's variable parts
 * (pattern-envelope.ts), in mm (+ down) with its position in mm from the left end, written to
 * `out`; the figures that go with it (the spans loaded and, on spring supports, the extreme
 * measured from the chord between the span's supports beside the total one) are kept for
 * addPatternFigures, which must be called next. A check on springs judges the larger in magnitude of the two: a span/N
 * limit can be read as the member's own bending (chord) or as the movement a finish sees
 * (total), and neither is always the larger (a support can rise), so the larger is the
 * conservative reading.
 */
export function findPatternExtreme(context: MemberPatternContext, factors: CaseFactors, span: number, out: SpanExtreme): void {
  const { solution, partCases } = context;
  const judgement = context.judgements[span]!;
  const fixedFactors = fixedScratch;
  fixedFactors.length = 0;
  for (let c = 0; c < factors.length; c++) fixedFactors.push(factors[c] as number);
  for (const c of partCases) fixedFactors[c] = 0;
  const totalBasis = (context.totalBases[span] ??= createSpanPatternBasis(solution, span, partCases, null, totalPool[span]));
  totalPool[span] = totalBasis;
  const total = findEnvelopeExtreme(solution, totalBasis, fixedFactors, factors, totalScratch);
  let judged = total;
  if (context.springs) {
    const reference = { startNode: judgement.chordStartNode, endNode: judgement.chordEndNode };
    const chordBasis = (context.chordBases[span] ??= createSpanPatternBasis(solution, span, partCases, reference, chordPool[span]));
    chordPool[span] = chordBasis;
    const chord = findEnvelopeExtreme(solution, chordBasis, fixedFactors, factors, chordScratch);
    if (Math.abs(chord.deflectionMm) > Math.abs(total.deflectionMm)) judged = chord;
    lastChord.chordDeflectionMm = chord.deflectionMm;
    lastChord.totalDeflectionMm = total.deflectionMm;
    lastChord.startMm = getArrangedNodeDeflection(context, factors, fixedFactors, judged.selected, judgement.chordStartNode);
    lastChord.endMm = judgement.chordEndNode === judgement.chordStartNode ? null : getArrangedNodeDeflection(context, factors, fixedFactors, judged.selected, judgement.chordEndNode);
    lastChord.basis = judged === chord ? "chord" : "total";
  }
  lastLoadedSpans = getLoadedSpans(context, factors, judged.selected);
  out.deflectionMm = judged.deflectionMm;
  out.atMm = judged.atMm;
}

/**
 * Adds to a check the figures of the findPatternExtreme call that produced its deflection (the
 * spans loaded; on springs the chord and total extremes, the settlements and which was judged).
 */
export function addPatternFigures(context: MemberPatternContext, check: CheckResult): void {
  if (lastLoadedSpans !== null) check.loadedSpans = lastLoadedSpans;
  if (!context.springs) return;
  check.chordDeflectionMm = lastChord.chordDeflectionMm;
  check.totalDeflectionMm = lastChord.totalDeflectionMm;
  check.supportSettlementMm = lastChord.endMm === null ? [lastChord.startMm] : [lastChord.startMm, lastChord.endMm];
  check.deflectionBasis = lastChord.basis;
}
