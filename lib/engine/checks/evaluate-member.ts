import type { CheckResult, FrequencyResult, LimitProfile, Member, RotationResult } from "../model";
import { collectProfileIssues } from "./validate-profile";
import { evaluateDeflectionChecks, getGoverningCheck } from "./evaluate-checks";
import { computeFrequency } from "../frequency";
import { EngineInputError, prefixIssues } from "../solver/engine-input-error";
import { solveValidatedMember, type MemberSolution } from "../solver/solve-member";
import { collectMemberIssues } from "../solver/validate-member";
import type { CaseFactors } from "../solver/deflection-field";
import { getPatternSplit, getSpanJudgements } from "./span-groups";

/** Everything checkMember derives before the suggestion and the sampled shape. */
export interface MemberEvaluation {
  solution: MemberSolution;
  checks: CheckResult[];
  governing: CheckResult | null;
  rotations: RotationResult[];
  frequency: FrequencyResult | null;
  pass: boolean;
  combinationFactors: CaseFactors[];
}

/** Throws EngineInputError with every member issue and every profile issue (paths `profile.`). */
export function assertMemberAndProfileValid(member: Member, profile: LimitProfile): void {
  const issues = collectMemberIssues(member);
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
  const judgements = getSpanJudgements(member);
  // one span with no overhang is one pattern group: no split, the single-span fast path
  const split = member.spans.length === 1 && member.supports[0]!.kind !== "free" && member.supports[1]!.kind !== "free" ? undefined : getPatternSplit(member, profile, judgements);
  const solution = solveValidatedMember(member, split);
  const { checks, rotations, combinationFactors } = evaluateDeflectionChecks(member, profile, solution, judgements);
  const governing = getGoverningCheck(checks);
  const frequency = computeFrequency(member, profile);
  let pass = frequency === null || frequency.pass;
  for (const check of checks) if (!check.pass) pass = false;
  return { solution, checks, governing, rotations, frequency, pass, combinationFactors };
}

/**
 * The largest demand ratio of an evaluation, scaled so that it is proportional to 1/I for a
 * uniform change of I: the governing utilization, and (minHz / f)^2 for the frequency (f grows
 * with sqrt(EI) at fixed mass). A value <= 1 means the member passes.
 */
export function getStiffnessDemandRatio(evaluation: Pick<MemberEvaluation, "governing" | "frequency">): number {
  let ratio = evaluation.governing === null ? 0 : evaluation.governing.utilization;
  if (evaluation.frequency !== null) {
    const frequencyRatio = evaluation.frequency.minHz / evaluation.frequency.hz;
    ratio = Math.max(ratio, frequencyRatio * frequencyRatio);
  }
  return ratio;
}
