export { getSpanJudgements, type SpanJudgement } from "./span-groups";
export { collectProfileIssues, getCreepFactor } from "./validate-profile";
export {
  createCheckResult,
  createCombinationFactors,
  evaluateDeflectionChecks,
  getGoverningCheck,
  type DeflectionEvaluation,
} from "./evaluate-checks";
export {
  assertMemberAndProfileValid,
  evaluateValidatedMember,
  getStiffnessDemandRatio,
  type MemberEvaluation,
} from "./evaluate-member";
