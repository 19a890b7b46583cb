import type { CheckResult, Combination, LimitProfile, Member, RotationResult } from "../model";
import { createCaseFactors, findSpanExtreme, getNodeRotation, type CaseFactors, type SpanExtreme } from "../solver/deflection-field";
import { EngineInputError } from "../solver/engine-input-error";
import type { MemberSolution } from "../solver/solve-member";
import { addPatternFigures, createMemberPatternContext, findPatternExtreme, needsPatternPath } from "./pattern-checks";
import { getSpanJudgements, type SpanJudgement } from "./span-groups";
import { getCreepFactor } from "./validate-profile";

/**
 * Case factors of a combination: factors[case] + creep * sustainedFactors[case], indexed like
 * solution.caseNames (Combination doc in model.ts). The internal self-weight case follows the
 * member's selfWeightCase.
 */
export function createCombinationFactors(solution: MemberSolution, combination: Combination, creepFactor: number): CaseFactors {
  const sustained = creepFactor !== 0 ? combination.sustainedFactors : undefined;
  return createCaseFactors(solution, combination.factors, sustained, creepFactor);
}

/**
 * One deflection check: allowed = effective span / limitRatio, capped by capMm; utilization =
 * |actual| / allowed; factor of safety = allowed / |actual| (null for zero deflection); pass when
 * utilization <= 1. Effective span = judged length, times the profile's multiplier for overhangs.
 */
export function createCheckResult(
  combination: Combination,
  spanIndex: number,
  judgement: SpanJudgement,
  cantileverSpanMultiplier: number,
  extreme: SpanExtreme,
): CheckResult {
  const effectiveSpanMm = judgement.spanKind === "cantilever" ? cantileverSpanMultiplier * judgement.judgedLengthMm : judgement.judgedLengthMm;
  const ratioLimitMm = effectiveSpanMm / combination.limitRatio;
  const allowedMm = combination.capMm !== undefined && combination.capMm < ratioLimitMm ? combination.capMm : ratioLimitMm;
  const magnitude = Math.abs(extreme.deflectionMm);
  const utilization = magnitude / allowedMm;
  const safety = allowedMm / magnitude;
  return {
    combinationId: combination.id,
    spanIndex,
    spanKind: judgement.spanKind,
    spanMm: judgement.judgedLengthMm,
    effectiveSpanMm,
    deflectionMm: extreme.deflectionMm,
    atMm: extreme.atMm,
    allowedMm,
    utilization,
    factorOfSafety: magnitude === 0 || !Number.isFinite(safety) ? null : safety,
    pass: utilization <= 1,
  };
}

export interface DeflectionEvaluation {
  checks: CheckResult[];
  rotations: RotationResult[];
  /** Case factors per combination, in profile order (reused for the shape). */
  combinationFactors: CaseFactors[];
}

/**
 * Runs every combination of the profile on every span of a solved member: the checks (combination
 * order, then span order; variable parts in their worst arrangement, pattern-checks.ts) and the
 * rotation at every node (every load as given). Assumes the profile was validated. `judgements`:
 * getSpanJudgements(member), when the caller already has them.
 */
export function evaluateDeflectionChecks(member: Member, profile: LimitProfile, solution: MemberSolution, judgements: readonly SpanJudgement[] = getSpanJudgements(member)): DeflectionEvaluation {
  const checks: CheckResult[] = [];
  const rotations: RotationResult[] = [];
  const combinationFactors: CaseFactors[] = [];
  const extreme: SpanExtreme = { deflectionMm: 0, atMm: 0 };
  const patternContext = createMemberPatternContext(member, solution, judgements);
  for (const combination of profile.combinations) {
    const factors = createCombinationFactors(solution, combination, getCreepFactor(combination, member));
    combinationFactors.push(factors);
    // fast path: no variable part to arrange and no support that moves
    const general = needsPatternPath(patternContext, factors) ? patternContext : null;
    for (let span = 0; span < solution.spanCount; span++) {
      const judgement = judgements[span]!;
      if (general !== null) findPatternExtreme(general, factors, span, extreme);
      else findSpanExtreme(solution, factors, span, extreme);
      if (!Number.isFinite(extreme.deflectionMm)) {
        throw new EngineInputError([{ path: "loads", message: `combination "${combination.id}" gives a deflection beyond the range of double precision: check the load and stiffness magnitudes and units` }]);
      }
      const check = createCheckResult(combination, span, judgement, profile.cantileverSpanMultiplier, extreme);
      if (general !== null) addPatternFigures(general, check);
      checks.push(check);
    }
    for (let node = 0; node <= solution.spanCount; node++) {
      rotations.push({ combinationId: combination.id, nodeIndex: node, atMm: solution.nodeXMm[node] as number, rotationRad: getNodeRotation(solution, factors, node) });
    }
  }
  return { checks, rotations, combinationFactors };
}

/** The check with the highest utilization (the first on ties), null when there are none. */
export function getGoverningCheck(checks: CheckResult[]): CheckResult | null {
  let governing: CheckResult | null = null;
  for (const check of checks) if (governing === null || check.utilization > governing.utilization) governing = check;
  return governing;
}
