export { EngineInputError, prefixIssues } from "./engine-input-error";
export { assertMemberValid, collectMemberIssues } from "./validate-member";
export { getCaseIndexOf, solveMember, solveValidatedMember, SELF_WEIGHT_CASE_KEY, type MemberSolution } from "./solve-member";
export {
  createCaseFactors,
  deflectionAt,
  findSpanAt,
  findSpanExtreme,
  getNodeRotation,
  rotationAt,
  type CaseFactors,
  type SpanExtreme,
} from "./deflection-field";
