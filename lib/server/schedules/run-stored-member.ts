import { checkMember } from "@/lib/engine/check-member";
import { mapEnginePath } from "@/lib/engine/check-schedule";
import { parseSchedule } from "@/lib/engine/intake";
import type { InputIssue, MemberResult } from "@/lib/engine/model";
import { EngineInputError } from "@/lib/engine/solver";

import { toParseOptions, type ScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";

import { describeMemberModel, type MemberModelView } from "./describe-member-model";

export type StoredMemberRun = { ok: true; result: MemberResult; model: MemberModelView } | { ok: false; issues: InputIssue[] };

/** Issues past this many are not listed (a what-if input is small; this only bounds the answer). */
const MAX_ISSUES = 20;

/**
 * Checks one member of a stored schedule again with the engine, exactly as intake and the worker
 * read it (`criteria`: what the schedule was frozen with: catalogue names, organization materials and profile, and the
 * catalogue a failing member's lightest section comes from): the schedule's header (units, limits) around the member's public-format input, the
 * shape sampled. Nothing is stored. Input the engine refuses comes back as issues naming the field.
 */
export function runStoredMember(header: Record<string, unknown>, input: unknown, criteria: ScheduleCriteria | null = null): StoredMemberRun {
  const parsed = parseSchedule({ ...header, members: [input] }, { ...toParseOptions(criteria), maxIssues: MAX_ISSUES });
  if (!parsed.ok) return { ok: false, issues: parsed.issues };
  const member = parsed.schedule.members[0];
  if (!member) return { ok: false, issues: [{ path: "members[0]", message: "the member could not be read" }] };
  try {
    const result = checkMember(member, parsed.schedule.profile, criteria?.catalogue, { shape: true });
    return { ok: true, result, model: describeMemberModel(member, parsed.schedule.profile, result.checks, parsed.schedule.unitSystem, parsed.schedule.unitDefaults) };
  } catch (error) {
    if (error instanceof EngineInputError) {
      const origins = parsed.schedule.origins[0];
      return { ok: false, issues: error.issues.slice(0, MAX_ISSUES).map((issue) => ({ path: mapEnginePath(issue.path, "members[0]", origins), message: issue.message })) };
    }
    throw error;
  }
}
