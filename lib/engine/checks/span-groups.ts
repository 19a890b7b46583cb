import type { LimitProfile, Member } from "../model";
import type { PatternSplit } from "../solver/solve-member";

/** How one span is judged: the clear span between supports it belongs to, or an overhang. */
export interface SpanJudgement {
  spanKind: "span" | "cantilever";
  /** Length judged, mm: the distance between the supports around the span, or the overhang. */
  judgedLengthMm: number;
  /** Group index: consecutive spans without a support between them share one. */
  groupIndex: number;
  /**
   * Nodes of the supports the span's deflection is measured from when measured from the chord:
   * the supports at the ends of its group; for an overhang, its one support (both the same).
   */
  chordStartNode: number;
  chordEndNode: number;
}

function isSupported(member: Member, node: number): boolean {
  const support = member.supports[node];
  return support !== undefined && support.kind !== "free";
}

/**
 * Groups spans into the clear spans between supported nodes (springs count as supports). A group
 * that reaches a free member end is an overhang ("cantilever"): IBC 2021 Table 1604.3 footnote
 * (from memory) judges it on a multiple of its length. A span with an unsupported interior node
 * is judged on the whole distance between the supports around it (common practice).
 */
export function getSpanJudgements(member: Member): SpanJudgement[] {
  const spanCount = member.spans.length;
  const judgements: SpanJudgement[] = [];
  let groupStart = 0;
  let groupIndex = 0;
  for (let e = 0; e < spanCount; e++) {
    if (e < spanCount - 1 && !isSupported(member, e + 1)) continue;
    let lengthMm = 0;
    for (let k = groupStart; k <= e; k++) lengthMm += member.spans[k]!.lengthMm;
    const startSupported = isSupported(member, groupStart);
    const endSupported = isSupported(member, e + 1);
    const isOverhang = !startSupported || !endSupported;
    const chordStartNode = startSupported ? groupStart : e + 1;
    const chordEndNode = endSupported ? e + 1 : groupStart;
    for (let k = groupStart; k <= e; k++) {
      judgements.push({ spanKind: isOverhang ? "cantilever" : "span", judgedLengthMm: lengthMm, groupIndex, chordStartNode, chordEndNode });
    }
    groupStart = e + 1;
    groupIndex += 1;
  }
  return judgements;
}

/**
 * Load cases that are variable by name: live, roof live and snow, the variable actions of
 * ASCE 7-16 Chapters 4 and 7 (from memory) and EN 1990 4.1.1 (from memory). Other cases
 * (dead, user cases) are permanent unless the profile lists them in variableCases.
 */
export const NAMED_VARIABLE_CASES: readonly string[] = ["live", "roof_live", "snow"];

/** The profile's variable (patterned) cases; empty when the profile switches patterns off. */
export function getVariableCases(profile: LimitProfile): Set<string> {
  if (profile.patternLoads === false) return new Set();
  return new Set([...NAMED_VARIABLE_CASES, ...(profile.variableCases ?? [])]);
}

/**
 * How the solver splits variable loads for pattern loading (ASCE 7-16 4.3.3 partial loading,
 * from memory; EN 1990 6.3.1 and EN 1992-1-1 5.1.3 load arrangements, from memory): every
 * variable case's loads not marked fixed, per pattern group (a clear span between supports, or
 * an overhang). Undefined, so the member is solved whole, when there is one group only, patterns
 * are off, or no such load exists.
 */
export function getPatternSplit(member: Member, profile: LimitProfile, judgements: readonly SpanJudgement[]): PatternSplit | undefined {
  const last = judgements[judgements.length - 1];
  if (last === undefined || last.groupIndex === 0 || profile.patternLoads === false) return undefined;
  const cases = getVariableCases(profile);
  let any = false;
  for (const load of member.loads) if (load.fixed !== true && cases.has(load.loadCase)) any = true;
  if (!any) return undefined;
  return { cases, groupOfSpan: judgements.map((judgement) => judgement.groupIndex) };
}
