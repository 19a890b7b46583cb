import type { CheckResult, FrequencyResult, RotationResult, ShapeSample } from "@/lib/engine/model";
import { getMemberResult, readStoredNotes } from "@/db/queries/schedules";
import { loadScheduleCriteria, type ScheduleCriteria } from "@/lib/server/criteria/schedule-criteria";

import type { MemberModelView } from "./describe-member-model";
import { runStoredMember } from "./run-stored-member";

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
  /** Pattern loading and spring-support figures of the check (model.ts CheckResult), when it has them. */
  loadedSpans?: Record<string, number[]>;
  chordDeflectionMm?: number;
  totalDeflectionMm?: number;
  supportSettlementMm?: number[];
  deflectionBasis?: "total" | "chord";
}

type CheckFigures = Pick<CheckResult, "loadedSpans" | "chordDeflectionMm" | "totalDeflectionMm" | "supportSettlementMm" | "deflectionBasis">;

function pickFigures(check: CheckResult): CheckFigures {
  const figures: CheckFigures = {};
  if (check.loadedSpans !== undefined) figures.loadedSpans = check.loadedSpans;
  if (check.chordDeflectionMm !== undefined) figures.chordDeflectionMm = check.chordDeflectionMm;
  if (check.totalDeflectionMm !== undefined) figures.totalDeflectionMm = check.totalDeflectionMm;
  if (check.supportSettlementMm !== undefined) figures.supportSettlementMm = check.supportSettlementMm;
  if (check.deflectionBasis !== undefined) figures.deflectionBasis = check.deflectionBasis;
  return figures;
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
  /** minIMm4 is null when no uniform I can pass (springs, shear deflection or frequency); a note says why. */
  suggestion: { minIMm4: number | null; sectionName: string | null } | null;
  /** Assumptions intake made and the engine's remarks, e.g. "gross section: cracking not included"; empty when none. */
  notes: string[];
  rotations: RotationResult[];
  shape: ShapeSample[];
  /** Only with `{ model: true }` (the member page): what the engine used. Not part of the API answer. */
  model?: MemberModelView;
}

type StoredDetail = { frequency: FrequencyResult | null; suggestion: MemberReport["suggestion"]; error: string | null; notes?: unknown };

interface MemberDiagrams extends Pick<MemberReport, "shape" | "rotations"> {
  /** Per check (combination id and span index), its pattern and spring-support figures. */
  figures: Map<string, CheckFigures>;
  model: MemberModelView | null;
}

const figuresKeyOf = (combinationId: string, spanIndex: number): string => `${combinationId}\u0000${spanIndex}`;
const noDiagrams = (): MemberDiagrams => ({ shape: [], rotations: [], figures: new Map(), model: null });

/**
 * Re-runs the engine for one stored member for what only its own page needs: the sampled shape,
 * the support rotations, each check's figures (spans loaded, chord and settlement) and the model
 * used. Cheap for one member; storing them for every member of a 100,000-member schedule is not.
 */
function computeMemberDiagrams(header: Record<string, unknown>, input: unknown, criteria: ScheduleCriteria | null): MemberDiagrams {
  // the criteria frozen with the schedule: catalogue names and organization materials read as they were checked
  const run = runStoredMember(header, input, criteria);
  if (!run.ok) return noDiagrams();
  const figures = new Map(run.result.checks.map((check) => [figuresKeyOf(check.combinationId, check.spanIndex), pickFigures(check)] as const));
  return { shape: run.result.shape ?? [], rotations: run.result.rotations, figures, model: run.model };
}

/** null when the schedule has no member with that mark. The caller has checked the schedule is the organization's. */
export async function getMemberReport(scheduleId: string, mark: string, options: { model?: boolean } = {}): Promise<MemberReport | null> {
  const found = await getMemberResult(scheduleId, mark);
  if (!found) return null;
  const { member } = found;
  // No outcome row yet: still being checked. An outcome without detail had nothing to add.
  const checked = member.checked === true;
  const detail = (member.detail ?? null) as StoredDetail | null;
  const header = member.header as Record<string, unknown>;
  const diagrams = checked && !detail?.error ? computeMemberDiagrams(header, member.input, await loadScheduleCriteria(scheduleId)) : noDiagrams();
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
      ...diagrams.figures.get(figuresKeyOf(c.combination_id as string, c.span_index as number)),
    })),
    frequency: detail?.frequency ?? null,
    suggestion: detail?.suggestion ?? null,
    notes: readStoredNotes(detail?.notes),
    shape: diagrams.shape,
    rotations: diagrams.rotations,
    ...(options.model === true && diagrams.model !== null ? { model: diagrams.model } : {}),
  };
}
