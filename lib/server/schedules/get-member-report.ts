import { checkMember } from "@/lib/engine/check-member";
import { parseSchedule } from "@/lib/engine/intake";
import type { FrequencyResult, RotationResult, ShapeSample } from "@/lib/engine/model";
import { getMemberResult, readStoredNotes } from "@/db/queries/schedules";

export interface MemberCheckRow {
  checkKey: string;
  combinationId: string;
  spanIndex: number;
  spanKind: string;
  deflectionMm: number;
  atMm: number;
  allowedMm: number;
  utilization: number;
  factorOfSafety: number | null;
  pass: boolean;
  /** Limit l/N and achieved l/N (null for zero deflection, and on rows stored before they were). */
  limitRatio: number | null;
  achievedRatio: number | null;
}

/** One member's whole result, as both the member page and the member API route show it. */
export interface MemberReport {
  mark: string;
  category: string;
  input: Record<string, unknown>;
  /** The schedule's units block: bare numbers in `input` are in these units. */
  units: unknown;
  status: "pending" | "pass" | "fail" | "error";
  error: string | null;
  /** `combinationId@spanIndex`, or "frequency" when the frequency governs. */
  governingCheck: string | null;
  utilization: number | null;
  factorOfSafety: number | null;
  checks: MemberCheckRow[];
  frequency: FrequencyResult | null;
  suggestion: { minIMm4: number; sectionName: string | null } | null;
  /** Assumptions intake made and the engine's remarks, e.g. "gross section: cracking not included"; empty when none. */
  notes: string[];
  rotations: RotationResult[];
  shape: ShapeSample[];
}

type StoredDetail = { frequency: FrequencyResult | null; suggestion: MemberReport["suggestion"]; error: string | null; notes?: unknown };

/**
 * Re-runs the engine for one stored member for what only its own page needs: the sampled shape
 * and the support rotations. Cheap for one member; storing them for every member of a 100,000-
 * member schedule is not.
 */
function computeMemberDiagrams(header: Record<string, unknown>, input: unknown): Pick<MemberReport, "shape" | "rotations"> {
  const parsed = parseSchedule({ ...header, members: [input] });
  if (!parsed.ok) return { shape: [], rotations: [] };
  try {
    const result = checkMember(parsed.schedule.members[0]!, parsed.schedule.profile, undefined, { shape: true });
    return { shape: result.shape ?? [], rotations: result.rotations };
  } catch {
    return { shape: [], rotations: [] };
  }
}

/** null when the schedule has no member with that mark. The caller has checked the schedule is the organization's. */
export async function getMemberReport(scheduleId: string, mark: string): Promise<MemberReport | null> {
  const found = await getMemberResult(scheduleId, mark);
  if (!found) return null;
  const { member } = found;
  // No outcome row yet: still being checked. An outcome without detail had nothing to add.
  const checked = member.checked === true;
  const detail = (member.detail ?? null) as StoredDetail | null;
  const header = member.header as Record<string, unknown>;
  return {
    mark: member.mark as string,
    category: member.category as string,
    input: (member.input ?? {}) as Record<string, unknown>,
    units: header.units,
    status: !checked ? "pending" : detail?.error ? "error" : member.pass ? "pass" : "fail",
    error: detail?.error ?? null,
    governingCheck: (member.governing_check as string | null) ?? null,
    utilization: (member.utilization as number | null) ?? null,
    factorOfSafety: (member.factor_of_safety as number | null) ?? null,
    checks: found.checks.map((c) => ({
      checkKey: c.check_key as string,
      combinationId: c.combination_id as string,
      spanIndex: c.span_index as number,
      spanKind: c.span_kind as string,
      deflectionMm: c.deflection_mm as number,
      atMm: c.at_mm as number,
      allowedMm: c.allowed_mm as number,
      utilization: c.utilization as number,
      factorOfSafety: (c.factor_of_safety as number | null) ?? null,
      pass: c.pass as boolean,
      limitRatio: (c.limit_ratio as number | null) ?? null,
      achievedRatio: (c.achieved_ratio as number | null) ?? null,
    })),
    frequency: detail?.frequency ?? null,
    suggestion: detail?.suggestion ?? null,
    notes: readStoredNotes(detail?.notes),
    ...(checked && !detail?.error ? computeMemberDiagrams(header, member.input) : { shape: [], rotations: [] }),
  };
}
