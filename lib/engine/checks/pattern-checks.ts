import type { CheckResult, Member } from "../model";
import { getNodeDeflection, type CaseFactors, type SpanExtreme } from "../solver/deflection-field";
import { findEnvelopeExtreme, type EnvelopeExtreme } from "../solver/pattern-envelope";
import type { MemberSolution } from "../solver/solve-member";
import type { SpanJudgement } from "./span-groups";

/**
 * The variable parts of one combination: each solved per-span part of a variable case with a
 * non-zero factor is a unit that an arrangement includes or leaves off; fixedFactors holds the
 * rest (everything that is always present).
 */
export interface PatternUnits {
  cases: number[];
  factors: number[];
  fixedFactors: CaseFactors;
}

/** The combination's pattern units, null when it has none (then every load is always present). */
export function createPatternUnits(solution: MemberSolution, factors: CaseFactors): PatternUnits | null {
  let units: PatternUnits | null = null;
  for (let c = 0; c < factors.length; c++) {
    const factor = factors[c] as number;
    if (factor === 0 || (solution.casePatternGroup[c] as number) < 0) continue;
    units ??= { cases: [], factors: [], fixedFactors: factors.slice() };
    units.cases.push(c);
    units.factors.push(factor);
    units.fixedFactors[c] = 0;
  }
  return units;
}

/** Whether any support of the member moves under load (a spring). */
export function hasSpringSupport(member: Member): boolean {
  for (const support of member.supports) if (support.kind === "spring") return true;
  return false;
}

/** Fields a check gains from patterns and from moving supports (model.ts CheckResult). */
export type PatternFigures = Pick<CheckResult, "loadedSpans" | "chordDeflectionMm" | "totalDeflectionMm" | "supportSettlementMm" | "deflectionBasis">;

const NO_UNITS: number[] = [];
const totalScratch: EnvelopeExtreme = { deflectionMm: 0, atMm: 0, selected: new Uint8Array(16) };
const chordScratch: EnvelopeExtreme = { deflectionMm: 0, atMm: 0, selected: new Uint8Array(16) };

function getArrangedNodeDeflection(solution: MemberSolution, units: PatternUnits | null, factors: CaseFactors, selected: Uint8Array, node: number): number {
  if (units === null) return getNodeDeflection(solution, factors, node);
  let value = getNodeDeflection(solution, units.fixedFactors, node);
  for (let u = 0; u < units.cases.length; u++) {
    if (selected[u] === 1) value += (units.factors[u] as number) * (solution.caseStates[(units.cases[u] as number) * solution.caseStride + 2 * node] as number);
  }
  return value;
}

/** Per variable case, the spans (element indices, ascending) of the selected units. */
function getLoadedSpans(solution: MemberSolution, units: PatternUnits, selected: Uint8Array, judgements: readonly SpanJudgement[]): Record<string, number[]> {
  const loaded: Record<string, number[]> = {};
  for (let u = 0; u < units.cases.length; u++) {
    const caseIndex = units.cases[u] as number;
    const name = solution.caseNames[caseIndex] as string;
    const spans = (loaded[name] ??= []);
    if (selected[u] !== 1) continue;
    const group = solution.casePatternGroup[caseIndex] as number;
    for (let e = 0; e < judgements.length; e++) if (judgements[e]!.groupIndex === group) spans.push(e);
  }
  for (const name in loaded) loaded[name]!.sort((a, b) => a - b);
  return loaded;
}

/**
 * The check's deflection under the worst arrangement of the combination's variable parts
 * (findEnvelopeExtreme), written to `out`, and the figures that go with it: the spans loaded and,
 * on spring supports, the extreme measured from the chord between the span's supports beside the
 * total one. A check on springs judges the larger in magnitude of the two: a span/N limit can be
 * read as the member's own bending (chord) or as the movement a finish sees (total), and neither
 * is always the larger (a support can rise), so taking the larger is the conservative reading.
 */
export function addPatternFigures(
  solution: MemberSolution,
  factors: CaseFactors,
  units: PatternUnits | null,
  span: number,
  judgement: SpanJudgement,
  springs: boolean,
  out: SpanExtreme,
  judgements: readonly SpanJudgement[],
): PatternFigures {
  const fixedFactors = units === null ? factors : units.fixedFactors;
  const unitCases = units === null ? NO_UNITS : units.cases;
  const unitFactors = units === null ? NO_UNITS : units.factors;
  const total = findEnvelopeExtreme(solution, fixedFactors, unitCases, unitFactors, span, null, totalScratch);
  let judged = total;
  const figures: PatternFigures = {};
  if (springs) {
    const chord = findEnvelopeExtreme(solution, fixedFactors, unitCases, unitFactors, span, { startNode: judgement.chordStartNode, endNode: judgement.chordEndNode }, chordScratch);
    if (Math.abs(chord.deflectionMm) > Math.abs(total.deflectionMm)) judged = chord;
    figures.chordDeflectionMm = chord.deflectionMm;
    figures.totalDeflectionMm = total.deflectionMm;
    const settlement = [getArrangedNodeDeflection(solution, units, factors, judged.selected, judgement.chordStartNode)];
    if (judgement.chordEndNode !== judgement.chordStartNode) settlement.push(getArrangedNodeDeflection(solution, units, factors, judged.selected, judgement.chordEndNode));
    figures.supportSettlementMm = settlement;
    figures.deflectionBasis = judged === chord ? "chord" : "total";
  }
  if (units !== null) figures.loadedSpans = getLoadedSpans(solution, units, judged.selected, judgements);
  out.deflectionMm = judged.deflectionMm;
  out.atMm = judged.atMm;
  return figures;
}
