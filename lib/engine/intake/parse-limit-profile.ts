import type { InputIssue, LimitProfile } from "../model";
import { readCustomProfile } from "./read-profile";
import { IssueCollector, type ReadContext } from "./read-values";

const MAX_PROFILE_ISSUES = 100;

export type ParseLimitProfileResult = { ok: true; profile: LimitProfile } | { ok: false; issues: InputIssue[] };

/**
 * Validates a limit profile definition on its own, in the `limits.custom` format of the public
 * schedule (quantities carry their units: `{"value": 20, "unit": "mm"}`), and converts it to the
 * engine's LimitProfile. Issue paths are relative to the definition, e.g. `combinations[0].limitRatio`.
 */
export function parseLimitProfile(definition: unknown): ParseLimitProfileResult {
  const issues = new IssueCollector(MAX_PROFILE_ISSUES);
  const ctx: ReadContext = { issues, units: { system: null, byKind: {} } };
  const profile = readCustomProfile(ctx, definition, "");
  if (profile === null || issues.count > 0) {
    const list = [...issues.issues];
    if (issues.dropped > 0) list.push({ path: "", message: `${issues.dropped} more issues not listed` });
    if (list.length === 0) list.push({ path: "", message: "the limit profile is not valid" });
    return { ok: false, issues: list };
  }
  return { ok: true, profile };
}
