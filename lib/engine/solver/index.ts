export { EngineInputError } from "./engine-input-error";
export { collectMemberIssues } from "./validate-member";
export { solveMember, type MemberSolution } from "./solve-member";
export {
  createCaseFactors,
  deflectionAt,
  findSpanExtreme,
  getNodeRotation,
  rotationAt,
  type CaseFactors,
} from "./deflection-field";
