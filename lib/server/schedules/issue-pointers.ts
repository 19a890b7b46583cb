import type { InputIssue } from "@/lib/engine/model";
import type { FieldError } from "@/lib/server/errors";

export const MAX_LISTED_ERRORS = 1000;

/** `members[12].spans[1].length` becomes the JSON pointer `/members/12/spans/1/length`. */
export function pathToPointer(path: string): string {
  if (path === "") return "";
  const tokens = path
    .replace(/\[(\d+)\]/g, ".$1")
    .split(".")
    .filter((t) => t !== "")
    .map((t) => t.replaceAll("~", "~0").replaceAll("/", "~1"));
  return "/" + tokens.join("/");
}

export function issuesToFieldErrors(issues: readonly InputIssue[]): FieldError[] {
  return issues.slice(0, MAX_LISTED_ERRORS).map((issue) => ({ pointer: pathToPointer(issue.path), message: issue.message }));
}
