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
 * Limits, spans and utilization are exactly those of the linear checks (createCheckResult).
 */
import type { CheckResult, Combination, LimitProfile, Member, RotationResult } from "../model";
import { createCheckResult } from "../checks/evaluate-checks";
import { getSpanJudgements } from "../checks/span-groups";
import { getCreepFactor } from "../checks/validate-profile";
import { createCaseFactors, type SpanExtreme } from "../solver/deflection-field";
import { EngineInputError } from "../solver/engine-input-error";
import { findCombinedSpanExtreme, getCombinedNodeRotation, type DeflectionTerm } from "./combined-deflection";
import { solveCrackedState, type CrackedState } from "./cracked-state";

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

function getStateKey(factors: Record<string, number>): string {
  return Object.keys(factors)
    .sort()
    .map((name) => `${name}=${factors[name]}`)
    .join("|");
}

export interface CrackedEvaluation {
  checks: CheckResult[];
  rotations: RotationResult[];
  /** The weighted solutions whose sum is each combination's deflection, in profile order. */
  combinationTerms: DeflectionTerm[][];
  /** Every load level solved, by its key, for notes and the frequency mass. */
  states: CrackedState[];
}

/** The weighted terms of one combination's deflection (module doc). */
function getCombinationTerms(member: Member, combination: Combination, solveState: (factors: Record<string, number>) => CrackedState): DeflectionTerm[] {
  const creepFactor = getCreepFactor(combination, member);
  const levels = getLoadLevels(combination, creepFactor);
  const total = solveState(levels.total);
  const terms: DeflectionTerm[] = [{ solution: total.solution, factors: total.factors, weight: 1 }];
  if (levels.base !== null) {
    const base = solveState(levels.base);
    terms.push({ solution: base.solution, factors: base.factors, weight: -1 });
  }
  if (creepFactor !== 0 && combination.sustainedFactors !== undefined) {
    terms.push({ solution: total.solution, factors: createCaseFactors(total.solution, combination.sustainedFactors), weight: creepFactor });
  }
  return terms;
}

/**
 * Every combination of the profile on every span of a validated member with reinforced spans,
 * checks in combination order then span order, rotations at every node; the same limits and
 * results as evaluateDeflectionChecks, with cracked, load-dependent stiffness.
 */
export function evaluateCrackedDeflectionChecks(member: Member, profile: LimitProfile): CrackedEvaluation {
  const judgements = getSpanJudgements(member);
  const statesByKey = new Map<string, CrackedState>();
  const solveState = (factors: Record<string, number>): CrackedState => {
    const key = getStateKey(factors);
    let state = statesByKey.get(key);
    if (state === undefined) {
      state = solveCrackedState(member, factors);
      statesByKey.set(key, state);
    }
    return state;
  };
  const checks: CheckResult[] = [];
  const rotations: RotationResult[] = [];
  const combinationTerms: DeflectionTerm[][] = [];
  const extreme: SpanExtreme = { deflectionMm: 0, atMm: 0 };
  for (const combination of profile.combinations) {
    const terms = getCombinationTerms(member, combination, solveState);
    combinationTerms.push(terms);
    const solution = terms[0]!.solution;
    for (let span = 0; span < solution.spanCount; span++) {
      findCombinedSpanExtreme(terms, span, extreme);
      if (!Number.isFinite(extreme.deflectionMm)) {
        throw new EngineInputError([{ path: "loads", message: `combination "${combination.id}" gives a deflection beyond the range of double precision: check the load and stiffness magnitudes and units` }]);
      }
      checks.push(createCheckResult(combination, span, judgements[span]!, profile.cantileverSpanMultiplier, extreme));
    }
    for (let node = 0; node <= solution.spanCount; node++) {
      rotations.push({ combinationId: combination.id, nodeIndex: node, atMm: solution.nodeXMm[node] as number, rotationRad: getCombinedNodeRotation(terms, node) });
    }
  }
  return { checks, rotations, combinationTerms, states: [...statesByKey.values()] };
}

/** Lowest I_e / I_g ratio text and a non-convergence warning, for the member's notes. */
export function describeCrackedEvaluation(member: Member, evaluation: CrackedEvaluation): string[] {
  let lowest = Infinity;
  let lowestSpan = 0;
  let converged = true;
  for (const state of evaluation.states) {
    converged = converged && state.converged;
    member.spans.forEach((span, index) => {
      if (span.reinforcedConcrete === undefined) return;
      const ratio = (state.inertiaMm4[index] as number) / span.iMm4;
      if (ratio < lowest) {
        lowest = ratio;
        lowestSpan = index;
      }
    });
  }
  const notes = [
    `cracked section: I_e per ACI 318-19 Table 24.2.3.5 at each combination's service moment; lowest I_e = ${lowest.toFixed(2)} I_g (span index ${lowestSpan})`,
  ];
  if (!converged) notes.push("cracked section: the I_e iteration did not settle; each span took the lower of its last two I_e values (conservative)");
  return notes;
}
