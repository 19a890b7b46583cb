import type { CheckResult, Combination, FrequencyResult, GoverningCheck, LimitProfile, Member, RotationResult } from "../model";
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
 * One deflection check: allowed = effective span / N, capped by capMm; utilization =
 * |actual| / allowed; factor of safety = allowed / |actual| (null for zero deflection); pass when
 * utilization <= 1; achieved l/N = effective span / |actual| (null for zero deflection).
 * A span is judged on its judged length against limitRatio. A cantilever is judged on its own
 * length against the combination's cantileverLimitRatio when it has one (EN 1995-1-1 Table 7.2
 * gives cantilevers their own ratios), otherwise on cantileverSpanMultiplier x its length against
 * limitRatio (IBC 2021 Table 1604.3 footnote: l = twice the cantilever's length, from memory).
 */
export function createCheckResult(
  combination: Combination,
  spanIndex: number,
  judgement: SpanJudgement,
  cantileverSpanMultiplier: number,
  extreme: SpanExtreme,
): CheckResult {
  const isCantilever = judgement.spanKind === "cantilever";
  const ownCantileverRatio = isCantilever ? combination.cantileverLimitRatio : undefined;
  const limitRatio = ownCantileverRatio ?? combination.limitRatio;
  const effectiveSpanMm = isCantilever && ownCantileverRatio === undefined ? cantileverSpanMultiplier * judgement.judgedLengthMm : judgement.judgedLengthMm;
  const ratioLimitMm = effectiveSpanMm / limitRatio;
  const capGoverns = combination.capMm !== undefined && combination.capMm < ratioLimitMm;
  const allowedMm = capGoverns ? (combination.capMm as number) : ratioLimitMm;
  const magnitude = Math.abs(extreme.deflectionMm);
  const utilization = magnitude / allowedMm;
  const safety = allowedMm / magnitude;
  const achieved = effectiveSpanMm / magnitude;
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
    // a governing cap is reported as its own l/N, so that achieved >= limit still means pass
    limitRatio: capGoverns ? effectiveSpanMm / allowedMm : limitRatio,
    achievedRatio: magnitude === 0 || !Number.isFinite(achieved) ? null : achieved,
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

/** The deflection check with the highest utilization (the first on ties), null when there are none. */
export function getGoverningCheck(checks: CheckResult[]): CheckResult | null {
  let governing: CheckResult | null = null;
  for (const check of checks) if (governing === null || check.utilization > governing.utilization) governing = check;
  return governing;
}

/** The key of a deflection check in results and stored rows: `${combinationId}@${spanIndex}`. */
export function getCheckKey(combinationId: string, spanIndex: number): string {
  return `${combinationId}@${spanIndex}`;
}

/** The key of the frequency check; it has no "@", so no combination's key can equal it. */
export const FREQUENCY_CHECK_KEY = "frequency";

/**
 * What governs the member overall: the governing deflection check or the frequency, whichever has
 * the higher utilization (deflection on ties). A frequency's utilization is minHz / hz, so it
 * exceeds 1 exactly when the frequency is below its minimum; its factor of safety is hz / minHz.
 * Null when there is neither.
 */
export function getMemberGoverningCheck(governing: CheckResult | null, frequency: FrequencyResult | null): GoverningCheck | null {
  const frequencyUtilization = frequency === null ? null : frequency.hz > 0 ? frequency.minHz / frequency.hz : Infinity;
  if (frequency !== null && frequencyUtilization !== null && (governing === null || frequencyUtilization > governing.utilization)) {
    const safety = frequency.hz / frequency.minHz;
    return { kind: "frequency", key: FREQUENCY_CHECK_KEY, utilization: frequencyUtilization, factorOfSafety: Number.isFinite(safety) && safety > 0 ? safety : null, pass: frequency.pass };
  }
  if (governing === null) return null;
  return { kind: "deflection", key: getCheckKey(governing.combinationId, governing.spanIndex), utilization: governing.utilization, factorOfSafety: governing.factorOfSafety, pass: governing.pass };
}
