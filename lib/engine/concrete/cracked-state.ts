/**
 * A reinforced concrete member solved at one service load level with the effective I of each
 * span (ACI 318-19 24.2.3, from memory). I_e depends on the span's moment and, in an
 * indeterminate member, the moments depend on the spans' stiffnesses, so the two are iterated to
 * a fixed point (a statically determinate member converges at the second solve).
 */
import type { Member, ReinforcedConcreteSection } from "../model";
import { createCaseFactors, type CaseFactors } from "../solver/deflection-field";
import { findSpanMomentRange, type SpanMomentRange } from "../solver/moment-field";
import { solveValidatedMember, type MemberSolution, type PatternSplit } from "../solver/solve-member";
import { EngineInputError } from "../solver/engine-input-error";
import { getCrackedSection, getCrackingMomentNmm, getGrossConcreteProperties, hasTopSteel, type MomentSign } from "./cracked-section";
import { getEffectiveInertiaMm4, UNCRACKED_MOMENT_SHARE } from "./effective-inertia";
import { describeMissingTopSteel, hasSpanBetweenSupports } from "./hogging-causes";

/** Most solves per load level; then the lower of the last two iterates is used (and said). */
export const MAX_CRACKED_ITERATIONS = 30;
/** Relative change of every span's I_e below which the iteration has converged. */
export const CRACKED_TOLERANCE = 1e-6;

export interface CrackedState {
  solution: MemberSolution;
  factors: CaseFactors;
  /** The I each span was solved with, mm^4 (I_e for reinforced spans, the given I otherwise). */
  inertiaMm4: number[];
  /** Service moment M_a of each span that set its I_e (signed, + sagging), N*mm. */
  serviceMomentNmm: number[];
  converged: boolean;
}

/**
 * One arrangement of a member's variable loads (pattern loading): the split that solves each
 * variable case once per pattern group (solve-member.ts PatternSplit) and, per variable case,
 * the spans whose loads are present (CheckResult.loadedSpans). A split case not named keeps all
 * of its loads.
 */
export interface LoadArrangement {
  split: PatternSplit;
  loadedSpans: Readonly<Record<string, readonly number[]>>;
}

/**
 * Case factors by name (createCaseFactors) with the parts of a split case that lie on unloaded
 * pattern groups set to zero: the variable loads clipped to the arrangement's loaded spans, by the
 * solver's own rule for which loads fall on which span.
 */
export function createArrangedFactors(solution: MemberSolution, factorsByCase: Record<string, number>, arrangement: LoadArrangement | undefined): CaseFactors {
  const factors = createCaseFactors(solution, factorsByCase);
  if (arrangement === undefined) return factors;
  for (let c = 0; c < factors.length; c++) {
    const group = solution.casePatternGroup[c] as number;
    const spans = group < 0 ? undefined : arrangement.loadedSpans[solution.caseNames[c] as string];
    if (spans === undefined) continue;
    let loaded = false;
    for (const span of spans) if (arrangement.split.groupOfSpan[span] === group) loaded = true;
    if (!loaded) factors[c] = 0;
  }
  return factors;
}

/** The member with each span's I replaced (everything else shared, not copied). */
export function createMemberWithInertia(member: Member, inertiaMm4: readonly number[]): Member {
  return { ...member, spans: member.spans.map((span, index) => ({ ...span, iMm4: inertiaMm4[index] as number })) };
}

interface SpanCrackingFacts {
  iGMm4: number;
  mCrNmm: number;
  iCrSaggingMm4: number;
  /** I_cr under hogging: the top steel when given, else the layout as given (cracked-section.ts getSteelLayers). */
  iCrHoggingMm4: number;
}

// Section facts depend only on the section and E_c: computed once per distinct section object.
const factsBySection = new WeakMap<ReinforcedConcreteSection, Map<number, SpanCrackingFacts>>();

function getSpanCrackingFacts(section: ReinforcedConcreteSection, concreteEMpa: number): SpanCrackingFacts {
  let byModulus = factsBySection.get(section);
  if (byModulus === undefined) {
    byModulus = new Map();
    factsBySection.set(section, byModulus);
  }
  let facts = byModulus.get(concreteEMpa);
  if (facts === undefined) {
    facts = {
      iGMm4: getGrossConcreteProperties(section).iGMm4,
      mCrNmm: getCrackingMomentNmm(section),
      iCrSaggingMm4: getCrackedSection(section, concreteEMpa, "sagging").iCrMm4,
      iCrHoggingMm4: getCrackedSection(section, concreteEMpa, "hogging").iCrMm4,
    };
    byModulus.set(concreteEMpa, facts);
  }
  return facts;
}

/**
 * I_e of a reinforced span at service moment M_a (N*mm, + sagging): Table 24.2.3.5 with the
 * cracked section for the moment's sign (under hogging, the top steel when the section gives it:
 * cracked-section.ts getSteelLayers).
 */
export function getSpanEffectiveInertiaMm4(section: ReinforcedConcreteSection, concreteEMpa: number, momentNmm: number): number {
  const facts = getSpanCrackingFacts(section, concreteEMpa);
  const sign: MomentSign = momentNmm >= 0 ? "sagging" : "hogging";
  return getEffectiveInertiaMm4(facts.iGMm4, sign === "sagging" ? facts.iCrSaggingMm4 : facts.iCrHoggingMm4, facts.mCrNmm, momentNmm);
}

/**
 * One uniform I_e for a whole span: the lower of I_e at its largest sagging and at its largest
 * hogging moment, and that moment. ACI 318-19 permits the average of the critical positive and
 * negative sections for continuous spans (24.2.3.6) or the midspan value (24.2.3.7, the support
 * value for cantilevers), from memory; the lower of the two sections is never stiffer than
 * either, so it is the conservative choice (the code's own are not always, when the top steel
 * is light).
 */
export function getSpanGoverningInertia(section: ReinforcedConcreteSection, concreteEMpa: number, range: SpanMomentRange): { iMm4: number; momentNmm: number } {
  const sagging = getSpanEffectiveInertiaMm4(section, concreteEMpa, range.saggingNmm);
  if (range.hoggingNmm === 0) return { iMm4: sagging, momentNmm: range.saggingNmm };
  const hogging = getSpanEffectiveInertiaMm4(section, concreteEMpa, range.hoggingNmm);
  return hogging < sagging ? { iMm4: hogging, momentNmm: range.hoggingNmm } : { iMm4: sagging, momentNmm: range.saggingNmm };
}

/**
 * Refuses a solved state in which a span cracks under a moment whose tension steel was not given:
 * hogging in a member with a span between supports and no top steel, or sagging (net uplift) in a
 * member of overhangs only and no top steel (its given steel is its top steel). Guessing that
 * steel could overstate the stiffness, the unsafe side. Below (2/3) M_cr, I_e = I_g whatever the
 * steel, so nothing is missing.
 */
function assertTensionSteelKnown(member: Member, ranges: readonly SpanMomentRange[]): void {
  const betweenSupports = hasSpanBetweenSupports(member);
  member.spans.forEach((span, index) => {
    const section = span.reinforcedConcrete;
    if (section === undefined || hasTopSteel(section)) return;
    const range = ranges[index] as SpanMomentRange;
    // the moment whose tension face has no steel given: top (hogging) in a member with a span between supports
    const moment = betweenSupports ? range.hoggingNmm : range.saggingNmm;
    if (!(Math.abs(moment) > UNCRACKED_MOMENT_SHARE * getSpanCrackingFacts(section, span.eMpa).mCrNmm)) return;
    const path = `spans[${index}].reinforcedConcrete.topSteelMm2`;
    const message = betweenSupports
      ? describeMissingTopSteel("a hogging (negative) moment past (2/3) M_cr acts on this span")
      : "is required: this overhang sags (net upward load) past (2/3) M_cr, and in a member of overhangs only the given steel is the top steel; give topSteel and topDepth for the top steel, and the bottom steel as tensionSteel and effectiveDepth";
    throw new EngineInputError([{ path, message }]);
  });
}

function getNextInertia(member: Member, solution: MemberSolution, factors: CaseFactors, current: readonly number[], moments: number[], ranges: SpanMomentRange[]): number[] {
  return member.spans.map((span, index) => {
    const range = findSpanMomentRange(solution, factors, index);
    ranges[index] = range;
    if (span.reinforcedConcrete === undefined) {
      moments[index] = -range.hoggingNmm > range.saggingNmm ? range.hoggingNmm : range.saggingNmm;
      return current[index] as number;
    }
    const governing = getSpanGoverningInertia(span.reinforcedConcrete, span.eMpa, range);
    moments[index] = governing.momentNmm;
    return governing.iMm4;
  });
}

function getLargestRelativeChange(a: readonly number[], b: readonly number[]): number {
  let change = 0;
  for (let index = 0; index < a.length; index++) change = Math.max(change, Math.abs((a[index] as number) - (b[index] as number)) / (a[index] as number));
  return change;
}

/**
 * Solves a validated member at the service load level `stateFactors` (load case -> factor) with
 * I_e in every reinforced span: start at the given I (I_g), solve, take each span's largest
 * moment, recompute I_e, and repeat until no I_e changes by more than CRACKED_TOLERANCE. Without
 * convergence in MAX_CRACKED_ITERATIONS solves, each span takes the lower I of the last two
 * iterates (the softer, conservative side) and converged is false. With `arrangement`, the
 * variable loads are clipped to its loaded spans (createArrangedFactors).
 */
export function solveCrackedState(member: Member, stateFactors: Record<string, number>, arrangement?: LoadArrangement): CrackedState {
  let inertia = member.spans.map((span) => span.iMm4);
  const moments = member.spans.map(() => 0);
  const ranges: SpanMomentRange[] = [];
  for (let iteration = 1; iteration <= MAX_CRACKED_ITERATIONS; iteration++) {
    const solution = solveValidatedMember(createMemberWithInertia(member, inertia), arrangement?.split);
    const factors = createArrangedFactors(solution, stateFactors, arrangement);
    const next = getNextInertia(member, solution, factors, inertia, moments, ranges);
    if (getLargestRelativeChange(inertia, next) <= CRACKED_TOLERANCE) {
      assertTensionSteelKnown(member, ranges);
      return { solution, factors, inertiaMm4: inertia, serviceMomentNmm: moments, converged: true };
    }
    if (iteration === MAX_CRACKED_ITERATIONS) inertia = inertia.map((value, index) => Math.min(value, next[index] as number));
    else inertia = next;
  }
  const solution = solveValidatedMember(createMemberWithInertia(member, inertia), arrangement?.split);
  const factors = createArrangedFactors(solution, stateFactors, arrangement);
  getNextInertia(member, solution, factors, inertia, moments, ranges);
  assertTensionSteelKnown(member, ranges);
  return { solution, factors, inertiaMm4: inertia, serviceMomentNmm: moments, converged: false };
}

/** True when any span of the member carries reinforcement (it deflects cracked). */
export function hasReinforcedSpan(member: Member): boolean {
  for (const span of member.spans) if (span.reinforcedConcrete !== undefined) return true;
  return false;
}
