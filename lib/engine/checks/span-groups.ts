import type { Member } from "../model";

/** How one span is judged: the clear span between supports it belongs to, or an overhang. */
export interface SpanJudgement {
  spanKind: "span" | "cantilever";
  /** Length judged, mm: the distance between the supports around the span, or the overhang. */
  judgedLengthMm: number;
  /** Group index: consecutive spans without a support between them share one. */
  groupIndex: number;
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
    const isOverhang = !isSupported(member, groupStart) || !isSupported(member, e + 1);
    for (let k = groupStart; k <= e; k++) {
      judgements.push({ spanKind: isOverhang ? "cantilever" : "span", judgedLengthMm: lengthMm, groupIndex });
    }
    groupStart = e + 1;
    groupIndex += 1;
  }
  return judgements;
}
