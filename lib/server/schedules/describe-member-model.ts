import { getSpanJudgements } from "@/lib/engine/checks";
import { getCreepFactor } from "@/lib/engine/checks/validate-profile";
import type { CheckResult, Combination, LimitProfile, Load, Member, SupportKind } from "@/lib/engine/model";
import type { UnitSystem } from "@/lib/engine/units";

/** Where a combination's creep factor came from (model.ts Combination.creep). */
export type CreepSource = "material" | "ibc_creep_component" | "fixed" | "none";

export interface CombinationUsed {
  id: string;
  label: string;
  factors: Record<string, number>;
  sustainedFactors: Record<string, number> | null;
  /** The factor the engine applied to the sustained part for this member (0 when none). */
  creepFactor: number;
  creepSource: CreepSource;
  limitRatio: number;
  cantileverLimitRatio: number | null;
  capMm: number | null;
}

export interface SpanUsed {
  startMm: number;
  lengthMm: number;
  kind: "span" | "cantilever";
  /** The length the limit is taken on before any cantilever multiplier, mm. */
  judgedLengthMm: number;
  eMpa: number;
  /** The section's I (for reinforced concrete, the gross I_g: the checks used I_e, see the notes). */
  iMm4: number;
  areaMm2: number | null;
  densityKgPerM3: number | null;
  crackedConcrete: boolean;
}

export interface SupportUsed {
  kind: SupportKind;
  atMm: number;
  springNPerMm: number | null;
}

/** How one check's allowed deflection was set (the stored row has the allowed value, not why). */
export interface CheckLimitUsed {
  combinationId: string;
  spanIndex: number;
  /** The span the limit was taken on, the cantilever multiplier included, mm. */
  effectiveSpanMm: number;
  /** The combination's absolute cap, not span / N, set the allowed deflection. */
  capGoverned: boolean;
}

/** The engine model one member was checked with, internal units (model.ts), for "what was used" and the diagram. */
export interface MemberModelView {
  unitSystem: UnitSystem | null;
  /** The unit per quantity kind that the schedule's bare numbers took. */
  unitDefaults: Record<string, string>;
  profile: { label: string; source: string; cantileverSpanMultiplier: number; patternLoads: boolean };
  combinations: CombinationUsed[];
  spans: SpanUsed[];
  /** One per node, left to right; overhang tips are "free". */
  supports: SupportUsed[];
  loads: Load[];
  selfWeightCase: string | null;
  shearDeformation: boolean;
  sectionName: string | null;
  materialName: string | null;
  checkLimits: CheckLimitUsed[];
}

function getCreepSource(combination: Combination): CreepSource {
  if (combination.creep === "material" || combination.creep === "ibc_creep_component") return combination.creep;
  return combination.creep === undefined ? "none" : "fixed";
}

/** As createCheckResult decides it (lib/engine/checks/evaluate-checks.ts): the cap is below effective span / N. */
function isCapGoverning(check: CheckResult, profile: LimitProfile): boolean {
  const combination = profile.combinations.find((c) => c.id === check.combinationId);
  if (combination?.capMm === undefined) return false;
  const ratio = check.spanKind === "cantilever" ? (combination.cantileverLimitRatio ?? combination.limitRatio) : combination.limitRatio;
  return combination.capMm < check.effectiveSpanMm / ratio;
}

/** Describes what the engine used for one parsed member: combinations with this member's creep factors, spans, supports, loads. */
export function describeMemberModel(member: Member, profile: LimitProfile, checks: readonly CheckResult[], unitSystem: UnitSystem | null, unitDefaults: Record<string, string>): MemberModelView {
  const judgements = getSpanJudgements(member);
  let startMm = 0;
  const spans = member.spans.map((span, index): SpanUsed => {
    const judgement = judgements[index];
    const used: SpanUsed = {
      startMm,
      lengthMm: span.lengthMm,
      kind: judgement?.spanKind ?? "span",
      judgedLengthMm: judgement?.judgedLengthMm ?? span.lengthMm,
      eMpa: span.eMpa,
      iMm4: span.iMm4,
      areaMm2: span.areaMm2 ?? null,
      densityKgPerM3: span.densityKgPerM3 ?? null,
      crackedConcrete: span.reinforcedConcrete !== undefined,
    };
    startMm += span.lengthMm;
    return used;
  });
  const nodeXMm = [0, ...spans.map((s) => s.startMm + s.lengthMm)];
  return {
    unitSystem,
    unitDefaults,
    profile: { label: profile.label, source: profile.source, cantileverSpanMultiplier: profile.cantileverSpanMultiplier, patternLoads: profile.patternLoads !== false },
    combinations: profile.combinations.map((combination) => ({
      id: combination.id,
      label: combination.label,
      factors: combination.factors,
      sustainedFactors: combination.sustainedFactors ?? null,
      creepFactor: getCreepFactor(combination, member),
      creepSource: getCreepSource(combination),
      limitRatio: combination.limitRatio,
      cantileverLimitRatio: combination.cantileverLimitRatio ?? null,
      capMm: combination.capMm ?? null,
    })),
    spans,
    supports: member.supports.map((support, index) => ({ kind: support.kind, atMm: nodeXMm[index] ?? 0, springNPerMm: support.springNPerMm ?? null })),
    loads: member.loads,
    selfWeightCase: member.selfWeightCase ?? null,
    shearDeformation: member.includeShearDeformation === true,
    sectionName: member.sectionName ?? null,
    materialName: member.materialName ?? null,
    checkLimits: checks.map((check) => ({ combinationId: check.combinationId, spanIndex: check.spanIndex, effectiveSpanMm: check.effectiveSpanMm, capGoverned: isCapGoverning(check, profile) })),
  };
}
