/**
 * Deflection checks of a reinforced concrete member with cracked, load-dependent stiffness
 * (ACI 318-19 24.2.3 and 24.2.4, from memory). Because I_e depends on the load, deflections no
 * longer superpose; each combination is evaluated as the code's commentary describes:
 *
 * - The loads present when the combination acts ("total") are its immediate factors plus the
 *   permanent dead load and, for a creep combination, the sustained loads, wherever the
 *   combination does not already carry them.
 * - Immediate deflection = deflection under the total with I_e at the total, minus deflection
 *   under the part of the total that is not in the combination ("base") with I_e at the base.
 *   A live-alone combination is thus Delta(D + L) - Delta(D), the incremental live deflection.
 * - Creep part = lambda_Delta x (deflection under the sustained factors with I_e at the total):
 *   cracks formed under the peak service load stay open, so the sustained load sees that
 *   stiffness (at least as much deflection as I_e at the sustained level; conservative).
 * Limits, spans and utilization are exactly those of the linear checks (createCheckResult); on
 * spring supports the chord and total deflections are both judged (createCrackedCheck).
 */
import type { CheckResult, Combination, LimitProfile, Member, RotationResult } from "../model";
import { createCheckResult } from "../checks/evaluate-checks";
import { getSpanJudgements } from "../checks/span-groups";
import { getCreepFactor } from "../checks/validate-profile";
import { hasSpringSupport } from "../checks/pattern-checks";
import type { SpanJudgement } from "../checks/span-groups";
import type { SpanExtreme } from "../solver/deflection-field";
import { EngineInputError } from "../solver/engine-input-error";
import { findCombinedSpanExtreme, getCombinedNodeDeflection, getCombinedNodeRotation, type DeflectionTerm } from "./combined-deflection";
import { createArrangedFactors, solveCrackedState, type CrackedState, type LoadArrangement } from "./cracked-state";

/** Load cases that are always present: the dead load (self-weight goes to it). */
export const PERMANENT_CASE_FACTORS: Readonly<Record<string, number>> = { dead: 1 };

export interface LoadLevels {
  /** Every load present while the combination acts. */
  total: Record<string, number>;
  /** The part of the total that the combination's immediate deflection excludes; null when none. */
  base: Record<string, number> | null;
}

/**
 * The load levels of a combination (see the module doc): base[case] = max(permanent, sustained
 * when creep applies) - max(immediate factor, 0) where positive; total = immediate + base.
 */
export function getLoadLevels(combination: Combination, creepFactor: number): LoadLevels {
  const total: Record<string, number> = { ...combination.factors };
  const base: Record<string, number> = {};
  const present: Record<string, number> = { ...PERMANENT_CASE_FACTORS };
  if (creepFactor !== 0 && combination.sustainedFactors !== undefined) {
    for (const name in combination.sustainedFactors) present[name] = Math.max(present[name] ?? 0, combination.sustainedFactors[name] as number);
  }
  let hasBase = false;
  for (const name in present) {
    const extra = (present[name] as number) - Math.max(combination.factors[name] ?? 0, 0);
    if (extra > 0) {
      base[name] = extra;
      total[name] = (total[name] ?? 0) + extra;
      hasBase = true;
    }
  }
  return { total, base: hasBase ? base : null };
}

function getStateKey(factors: Record<string, number>, arrangement: LoadArrangement | undefined): string {
  const key = Object.keys(factors)
    .sort()
    .map((name) => `${name}=${factors[name]}`)
    .join("|");
  if (arrangement === undefined) return key;
  const loaded = Object.keys(arrangement.loadedSpans)
    .sort()
    .map((name) => `${name}:${arrangement.loadedSpans[name]!.join(",")}`)
    .join(";");
  return `${key}#${loaded}`;
}

/** Solves a load level (with an optional arrangement) once per evaluation: solveCrackedState, cached by level. */
export type CrackedStateSolver = (factors: Record<string, number>, arrangement?: LoadArrangement) => CrackedState;

/** A CrackedStateSolver that caches by load level and arrangement; `states` collects every level solved. */
export function createCrackedStateSolver(member: Member, states: Map<string, CrackedState> = new Map()): CrackedStateSolver {
  return (factors, arrangement) => {
    const key = getStateKey(factors, arrangement);
    let state = states.get(key);
    if (state === undefined) {
      state = solveCrackedState(member, factors, arrangement);
      states.set(key, state);
    }
    return state;
  };
}

export interface CrackedEvaluation {
  checks: CheckResult[];
  rotations: RotationResult[];
  /** The weighted solutions whose sum is each combination's deflection, in profile order. */
  combinationTerms: DeflectionTerm[][];
  /** Every load level solved, by its key (arrangements solved later included), for the notes. */
  states: Map<string, CrackedState>;
  /** The evaluation's cached state solver, for further arrangements of the same member. */
  solveState: CrackedStateSolver;
}

/**
 * The weighted terms of one combination's deflection (module doc); with `arrangement`, every load
 * level has its variable loads clipped to the arrangement's loaded spans.
 */
export function getCombinationTerms(member: Member, combination: Combination, solveState: CrackedStateSolver, arrangement?: LoadArrangement): DeflectionTerm[] {
  const creepFactor = getCreepFactor(combination, member);
  const levels = getLoadLevels(combination, creepFactor);
  const total = solveState(levels.total, arrangement);
  const terms: DeflectionTerm[] = [{ solution: total.solution, factors: total.factors, weight: 1 }];
  if (levels.base !== null) {
    const base = solveState(levels.base, arrangement);
    terms.push({ solution: base.solution, factors: base.factors, weight: -1 });
  }
  if (creepFactor !== 0 && combination.sustainedFactors !== undefined) {
    terms.push({ solution: total.solution, factors: createArrangedFactors(total.solution, combination.sustainedFactors, arrangement), weight: creepFactor });
  }
  return terms;
}

const totalScratch: SpanExtreme = { deflectionMm: 0, atMm: 0 };
const chordScratch: SpanExtreme = { deflectionMm: 0, atMm: 0 };

/**
 * One cracked check from a combination's weighted terms. On rigid supports: the span's extreme
 * total deflection. On springs, as uncracked members are judged (pattern-checks.ts
 * findPatternExtreme): both the extreme measured from the chord between the span's supports and
 * the total one (settlement included) are found, the larger in magnitude is judged, and the
 * check reports both, the settlements of those supports and which was judged.
 */
export function createCrackedCheck(combination: Combination, span: number, judgement: SpanJudgement, profile: LimitProfile, terms: readonly DeflectionTerm[], springs: boolean): CheckResult {
  const total = findCombinedSpanExtreme(terms, span, totalScratch);
  if (!Number.isFinite(total.deflectionMm)) {
    throw new EngineInputError([{ path: "loads", message: `combination "${combination.id}" gives a deflection beyond the range of double precision: check the load and stiffness magnitudes and units` }]);
  }
  if (!springs) return createCheckResult(combination, span, judgement, profile.cantileverSpanMultiplier, total);
  const chord = findCombinedSpanExtreme(terms, span, chordScratch, { startNode: judgement.chordStartNode, endNode: judgement.chordEndNode });
  const judged = Math.abs(chord.deflectionMm) > Math.abs(total.deflectionMm) ? chord : total;
  const check = createCheckResult(combination, span, judgement, profile.cantileverSpanMultiplier, judged);
  check.chordDeflectionMm = chord.deflectionMm;
  check.totalDeflectionMm = total.deflectionMm;
  const start = getCombinedNodeDeflection(terms, judgement.chordStartNode);
  check.supportSettlementMm = judgement.chordEndNode === judgement.chordStartNode ? [start] : [start, getCombinedNodeDeflection(terms, judgement.chordEndNode)];
  check.deflectionBasis = judged === chord ? "chord" : "total";
  return check;
}

/**
 * Every combination of the profile on every span of a validated member with reinforced spans,
 * checks in combination order then span order, rotations at every node; the same limits and
 * results as evaluateDeflectionChecks, with cracked, load-dependent stiffness.
 */
export function evaluateCrackedDeflectionChecks(member: Member, profile: LimitProfile): CrackedEvaluation {
  const judgements = getSpanJudgements(member);
  const springs = hasSpringSupport(member);
  const statesByKey = new Map<string, CrackedState>();
  const solveState = createCrackedStateSolver(member, statesByKey);
  const checks: CheckResult[] = [];
  const rotations: RotationResult[] = [];
  const combinationTerms: DeflectionTerm[][] = [];
  for (const combination of profile.combinations) {
    const terms = getCombinationTerms(member, combination, solveState);
    combinationTerms.push(terms);
    const solution = terms[0]!.solution;
    for (let span = 0; span < solution.spanCount; span++) checks.push(createCrackedCheck(combination, span, judgements[span]!, profile, terms, springs));
    for (let node = 0; node <= solution.spanCount; node++) {
      rotations.push({ combinationId: combination.id, nodeIndex: node, atMm: solution.nodeXMm[node] as number, rotationRad: getCombinedNodeRotation(terms, node) });
    }
  }
  return { checks, rotations, combinationTerms, states: statesByKey, solveState };
}

/**
 * The member's cracked notes: lowest I_e / I_g and a non-convergence warning. Call after every
 * arrangement is solved.
 */
export function describeCrackedEvaluation(member: Member, evaluation: CrackedEvaluation): string[] {
  let lowest = Infinity;
  let converged = true;
  for (const state of evaluation.states.values()) {
    converged = converged && state.converged;
    member.spans.forEach((span, index) => {
      if (span.reinforcedConcrete !== undefined) lowest = Math.min(lowest, (state.inertiaMm4[index] as number) / span.iMm4);
    });
  }
  const notes = [
    `cracked section: I_e per ACI 318-19 Table 24.2.3.5 at each combination's service moment; lowest I_e = ${lowest.toFixed(2)} I_g`,
  ];
  if (!converged) notes.push("cracked section: the I_e iteration did not settle; each span took the lower of its last two I_e values (conservative)");
  return notes;
}
