import { getMemberResult, getSchedule } from "@/db/queries/schedules";
import { getCheckKey, getMemberGoverningCheck } from "@/lib/engine/checks/evaluate-checks";
import type { InputIssue } from "@/lib/engine/model";
import { loadScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";
import { DomainError } from "@/lib/server/errors";

import { applyWhatIf, describeChange, type WhatIfChange } from "./apply-what-if";
import type { MemberModelView } from "./describe-member-model";
import type { MemberReport } from "./get-member-report";
import { runStoredMember } from "./run-stored-member";

export { WHAT_IF_SHAPES, type WhatIfChange, type WhatIfShape } from "./apply-what-if";

type Json = Record<string, unknown>;

/** The trial's answer, in the member report's own terms (get-member-report.ts). */
export interface WhatIfOutcome extends Pick<MemberReport, "governingCheck" | "utilization" | "factorOfSafety" | "checks" | "frequency" | "suggestion" | "notes" | "shape"> {
  /** Plain words for what was changed, e.g. "section rectangle: b 200 mm, h 400 mm". */
  changes: string[];
  pass: boolean;
  model: MemberModelView;
}

export type WhatIfResult = { ok: true; outcome: WhatIfOutcome } | { ok: false; issues: InputIssue[] };

/**
 * Checks a stored member again with a trial section and/or material, on the spot, with the same
 * engine and the schedule's own limits and units. Reads only: the record, its outcome and its
 * checks are never written. Throws not_found for a schedule or mark outside the organization.
 */
export async function recheckMember(organizationId: string, scheduleId: string, mark: string, change: WhatIfChange): Promise<WhatIfResult> {
  const schedule = await getSchedule(organizationId, scheduleId);
  if (!schedule) throw new DomainError("not_found", "The schedule was not found.");
  const found = await getMemberResult(schedule.id, mark);
  if (!found) throw new DomainError("not_found", "The member was not found.");
  const header = found.member.header as Json;
  const input = (found.member.input ?? {}) as Json;
  const run = runStoredMember(header, applyWhatIf(header, input, change), await loadScheduleCriteria(schedule.id));
  if (!run.ok) return { ok: false, issues: run.issues.map((issue) => ({ path: issue.path.replace(/^members\[0\]\.?/, ""), message: issue.message })) };
  const { result, model } = run;
  const governing = result.governingCheck ?? getMemberGoverningCheck(result.governing, result.frequency);
  return {
    ok: true,
    outcome: {
      changes: describeChange(header, change),
      pass: result.pass,
      governingCheck: governing?.key ?? null,
      utilization: governing?.utilization ?? null,
      factorOfSafety: governing?.factorOfSafety ?? null,
      checks: result.checks.map((check) => ({
        checkKey: getCheckKey(check.combinationId, check.spanIndex),
        combinationId: check.combinationId,
        spanIndex: check.spanIndex,
        spanKind: check.spanKind,
        deflectionMm: check.deflectionMm,
        atMm: check.atMm,
        allowedMm: check.allowedMm,
        utilization: check.utilization,
        factorOfSafety: check.factorOfSafety,
        pass: check.pass,
        limitRatio: check.limitRatio ?? null,
        achievedRatio: check.achievedRatio ?? null,
        ...(check.loadedSpans !== undefined ? { loadedSpans: check.loadedSpans } : {}),
      })),
      frequency: result.frequency,
      suggestion: result.suggestion,
      notes: result.notes ?? [],
      shape: result.shape ?? [],
      model,
    },
  };
}
