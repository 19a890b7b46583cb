import type { InputIssue } from "../model";

/**
 * Thrown by the engine when a member or profile cannot be analysed as given: every issue names
 * the field (a path relative to the member or profile, e.g. `spans[1].eMpa`) and the reason.
 * Callers that know the member's place in a schedule prefix the paths (see `prefixIssues`).
 */
export class EngineInputError extends Error {
  readonly issues: InputIssue[];

  constructor(issues: InputIssue[]) {
    super(issues.map((issue) => `${issue.path}: ${issue.message}`).join("; "));
    this.name = "EngineInputError";
    this.issues = issues;
  }
}

/** Returns the issues with `prefix` put in front of each path (`members[3]` + `spans[0]`). */
export function prefixIssues(issues: InputIssue[], prefix: string): InputIssue[] {
  if (prefix === "") return issues;
  return issues.map((issue) => ({
    path: issue.path === "" ? prefix : issue.path.startsWith("[") ? prefix + issue.path : `${prefix}.${issue.path}`,
    message: issue.message,
  }));
}
