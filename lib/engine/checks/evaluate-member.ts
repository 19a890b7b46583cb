import type { CheckResult, FrequencyResult, GoverningCheck, LimitProfile, Member, RotationResult } from "../model";
import { collectProfileIssues } from "./validate-profile";
import { evaluateDeflectionChecks, getGoverningCheck, getMemberGoverningCheck } from "./evaluate-checks";
import { computeFrequency } from "../frequency";
import { EngineInputError, prefixIssues } from "../solver/engine-input-error";
import { solveValidatedMember, type MemberSolution } from "../solver/solve-member";
import { collectMemberIssues } from "../solver/validate-member";
import type { CaseFactors } from "../solver/deflection-field";
import { collectReinforcementIssues } from "../concrete/validate-reinforcement";
import { evaluateCrackedMember, hasReinforcedSpan, type CrackedMemberExtras } from "../concrete/evaluate-cracked-member";
import { getPatternSplit, getSpanJudgements } from "./span-groups";

/** Everything checkMember derives before the suggestion and the sampled shape. */
export interface MemberEvaluation {
  solution: MemberSolution;
  checks: CheckResult[];
  governing: CheckResult | null;
  /** The governing check overall, frequency included (getMemberGoverningCheck). */
  governingCheck: GoverningCheck | null;
  rotations: RotationResult[];
  frequency: FrequencyResult | null;
  pass: boolean;
  combinationFactors: CaseFactors[];
  /** Reinforced concrete only: the cracked evaluation's terms and notes (concrete/evaluate-cracked-member.ts). */
  cracked?: CrackedMemberExtras;
}

/** Throws EngineInputError with every member issue and every profile issue (paths `profile.`). */
export function assertMemberAndProfileValid(member: Member, profile: LimitProfile): void {
  const issues = collectReinforcementIssues(member, collectMemberIssues(member));
  const profileIssues = collectProfileIssues(profile, member);
  if (issues.length > 0 || profileIssues.length > 0) throw new EngineInputError([...issues, ...prefixIssues(profileIssues, "profile")]);
}

/**
 * Solves and checks a member already validated with assertMemberAndProfileValid: every
 * combination on every span (variable cases in their worst pattern, span-groups.ts), rotations,
 * the frequency check. Pass = every check passes and the frequency (when the profile asks for
 * one) reaches its minimum.
 */
export function evaluateValidatedMember(member: Member, profile: LimitProfile): MemberEvaluation {
  // reinforced concrete deflects with load-dependent I_e (ACI 318-19 24.2.3): its own evaluation
  if (hasReinforcedSpan(member)) return evaluateCrackedMember(member, profile);
  const judgements = getSpanJudgements(member);
  // one span with no overhang is one pattern group: no split, the single-span fast path
  const split = member.spans.length === 1 && member.supports[0]!.kind !== "free" && member.supports[1]!.kind !== "free" ? undefined : getPatternSplit(member, profile, judgements);
  const solution = solveValidatedMember(member, split);
  const { checks, rotations, combinationFactors } = evaluateDeflectionChecks(member, profile, solution, judgements);
  const governing = getGoverningCheck(checks);
  const frequency = computeFrequency(member, profile);
  let pass = frequency === null || frequency.pass;
  for (const check of checks) if (!check.pass) pass = false;
  return { solution, checks, governing, governingCheck: getMemberGoverningCheck(governing, frequency), rotations, frequency, pass, combinationFactors };
}

/**
 * The largest demand ratio of an evaluation, scaled so that it is proportional to 1/I for a
 * uniform change of I when nothing else changes (no springs, no shear deformation): the largest
 * check utilization, and (minHz / f)^2 for the frequency (f grows with sqrt(EI) at fixed mass).
 * A value <= 1 means the checks pass; the minimum-I search uses it only to aim its trials and
 * decides on `pass` itself.
 */
export function getStiffnessDemandRatio(evaluation: Pick<MemberEvaluation, "checks" | "frequency">): number {
  let ratio = 0;
  for (const check of evaluation.checks) if (check.utilization > ratio) ratio = check.utilization;
  if (evaluation.frequency !== null) {
    const frequencyRatio = evaluation.frequency.minHz / evaluation.frequency.hz;
    ratio = Math.max(ratio, frequencyRatio * frequencyRatio);
  }
  return ratio;
}
