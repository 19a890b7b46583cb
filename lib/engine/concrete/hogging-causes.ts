/**
 * When a reinforced member needs its top steel. A span between supports is given with its bottom
 * steel; wherever it takes hogging (negative) moment the cracked stiffness there depends on the
 * top steel, which nothing else tells us. Guessing it (the bottom steel mirrored, say) overstates
 * the stiffness whenever the real top steel is lighter, the unsafe side, so such a member must
 * give it. The structural causes below are read from the member alone, before any solve, so the
 * sender hears at submission; cracked-state.ts still refuses any solved state that would need
 * the unknown steel (a negative combination factor, for one).
 */
import type { Load, Member } from "../model";
import { getSpanJudgements } from "../checks/span-groups";
import { hasTopSteel } from "./cracked-section";

function reversesMoment(load: Load): boolean {
  switch (load.kind) {
    case "uniform":
      return load.wNPerMm < 0;
    case "linear":
      return load.wStartNPerMm < 0 || load.wEndNPerMm < 0;
    case "point":
      return load.pN < 0;
    case "moment":
      return load.mNmm !== 0;
  }
}

/**
 * Whether the member has a span between supports. Its given steel is then bottom steel; in a
 * member of overhangs only it is top steel (model.ts ReinforcedConcreteSection).
 */
export function hasSpanBetweenSupports(member: Member): boolean {
  for (const judgement of getSpanJudgements(member)) if (judgement.spanKind === "span") return true;
  return false;
}

/**
 * Why the member can take hogging moment in a span between supports, in words ("continuous over
 * an interior support"), or null when it cannot: a member of overhangs alone (its given steel is
 * its top steel, model.ts), or a single span on two simple supports under downward loads.
 */
export function findHoggingCause(member: Member): string | null {
  let betweenSupports = 0;
  let overhangs = 0;
  let lastGroup = -1;
  for (const judgement of getSpanJudgements(member)) {
    if (judgement.spanKind === "cantilever") overhangs += 1;
    else if (judgement.groupIndex !== lastGroup) betweenSupports += 1;
    lastGroup = judgement.groupIndex;
  }
  if (betweenSupports === 0) return null;
  if (betweenSupports > 1) return "it is continuous over an interior support";
  if (overhangs > 0) return "it has an overhang beyond a support";
  if (member.supports.some((support) => support.kind === "fixed")) return "it has a fixed end";
  const upward = member.loads.find(reversesMoment);
  if (upward !== undefined) return upward.kind === "moment" ? "it carries an applied moment" : "it carries an upward load";
  return null;
}

/** Indexes of the reinforced spans given without top steel (each needs it when findHoggingCause answers). */
export function findSpansWithoutTopSteel(member: Member): number[] {
  const indexes: number[] = [];
  member.spans.forEach((span, index) => {
    if (span.reinforcedConcrete !== undefined && !hasTopSteel(span.reinforcedConcrete)) indexes.push(index);
  });
  return indexes;
}

/** The sentence that asks for the top steel, public names, so it reads the same from every surface. */
export function describeMissingTopSteel(cause: string): string {
  return `is required because ${cause}: the top steel sets the cracked stiffness where the moment is hogging (ACI 318-19 24.2.3.5); give topSteel (area) and topDepth (d_top, from the bottom face); CSV columns top_steel and top_depth`;
}
