export { getSpanJudgements } from "./span-groups";
export { assertMemberAndProfileValid } from "./evaluate-member";
