/**
 * Pattern (partial) live load on a cracked concrete member. I_e depends on each arrangement's own
 * moments, so superposition cannot pick the worst arrangement of a cracked member exactly. For
 * each check two estimates are made and the larger in magnitude is judged:
 *
 * - direct: the cracked member solved for the arrangement that the gross section's exact envelope
 *   picks for that check (its loadedSpans), every load level of the combination with its variable
 *   loads clipped to those spans, each level with its own I_e (cracked-evaluation.ts);
 * - amplified: the all-spans-loaded cracked deflection times the gross section's amplification
 *   (patterned extreme / all-spans-loaded extreme, never below 1).
 *
 * The direct figure is what the code asks for when the gross envelope's arrangement is also the
 * cracked member's worst (an overhang tip: back span unloaded, which also removes the back span's
 * sagging, so its I_e changes too; amplification alone came out about 10 % low there). The
 * amplified one guards the case where cracking moves the worst arrangement. Neither is a search
 * over every arrangement of the cracked member, and the result says so.
 */
import type { CheckResult, Combination, LimitProfile, Member } from "../model";
import { createCheckResult, evaluateDeflectionChecks } from "../checks/evaluate-checks";
import { getPatternSplit, getSpanJudgements, type SpanJudgement } from "../checks/span-groups";
import { hasSpringSupport } from "../checks/pattern-checks";
import { solveValidatedMember, type PatternSplit } from "../solver/solve-member";
import { createCrackedCheck, getCombinationTerms, type CrackedStateSolver } from "./cracked-evaluation";

export const CRACKED_PATTERN_NOTE =
  "pattern loading on cracked concrete: each check takes the larger of the cracked member solved for the arrangement that is worst for its gross section, and the all-spans-loaded cracked deflection scaled by the gross section's pattern amplification; other arrangements of the cracked member are not searched";

/** The member's spans without their reinforcement: the gross, linear member. */
function createGrossMember(member: Member): Member {
  return { ...member, spans: member.spans.map(({ reinforcedConcrete: _omitted, ...span }) => span) };
}

/** The all-loaded cracked check scaled by `factor`, its spring figures (when present) alike. */
function scaleCheck(check: CheckResult, combination: Combination, judgement: SpanJudgement, profile: LimitProfile, factor: number): CheckResult {
  const scaled = createCheckResult(combination, check.spanIndex, judgement, profile.cantileverSpanMultiplier, { deflectionMm: check.deflectionMm * factor, atMm: check.atMm });
  if (check.deflectionBasis !== undefined) {
    scaled.chordDeflectionMm = (check.chordDeflectionMm as number) * factor;
    scaled.totalDeflectionMm = (check.totalDeflectionMm as number) * factor;
    scaled.supportSettlementMm = (check.supportSettlementMm as number[]).map((value) => value * factor);
    scaled.deflectionBasis = check.deflectionBasis;
  }
  return scaled;
}

interface PatternContext {
  member: Member;
  profile: LimitProfile;
  split: PatternSplit;
  judgements: SpanJudgement[];
  springs: boolean;
  solveState: CrackedStateSolver;
}

/** The larger of the direct and the amplified estimate for one check (module doc). */
function getPatternedCheck(context: PatternContext, check: CheckResult, combination: Combination, worst: CheckResult, whole: CheckResult): CheckResult {
  const judgement = context.judgements[check.spanIndex]!;
  const wholeMm = Math.abs(whole.deflectionMm);
  const factor = wholeMm > 0 ? Math.max(1, Math.abs(worst.deflectionMm) / wholeMm) : 1;
  const amplified = scaleCheck(check, combination, judgement, context.profile, factor);
  let judged = amplified;
  if (worst.loadedSpans !== undefined) {
    const terms = getCombinationTerms(context.member, combination, context.solveState, { split: context.split, loadedSpans: worst.loadedSpans });
    const direct = createCrackedCheck(combination, check.spanIndex, judgement, context.profile, terms, context.springs);
    if (Math.abs(direct.deflectionMm) > Math.abs(amplified.deflectionMm)) judged = direct;
  }
  if (worst.loadedSpans !== undefined) judged.loadedSpans = worst.loadedSpans;
  return judged;
}

/**
 * The cracked checks with pattern loading applied (module doc), or null when no pattern applies
 * (one span group, patterns off, no variable load). `checks`: the all-spans-loaded cracked checks;
 * `solveState`: the evaluation's cached state solver. Checks keep their order.
 */
export function applyCrackedPatterns(member: Member, profile: LimitProfile, checks: readonly CheckResult[], solveState: CrackedStateSolver): CheckResult[] | null {
  const judgements = getSpanJudgements(member);
  const split = getPatternSplit(member, profile, judgements);
  if (split === undefined) return null;
  const gross = createGrossMember(member);
  const patterned = evaluateDeflectionChecks(gross, profile, solveValidatedMember(gross, split), judgements).checks;
  const allLoaded = evaluateDeflectionChecks(gross, profile, solveValidatedMember(gross), judgements).checks;
  const combinations = new Map(profile.combinations.map((c) => [c.id, c]));
  const context: PatternContext = { member, profile, split, judgements, springs: hasSpringSupport(member), solveState };
  return checks.map((check, index) => {
    const worst = patterned[index];
    const whole = allLoaded[index];
    const combination = combinations.get(check.combinationId);
    if (worst === undefined || whole === undefined || combination === undefined || worst.combinationId !== check.combinationId || worst.spanIndex !== check.spanIndex) return check;
    return getPatternedCheck(context, check, combination, worst, whole);
  });
}
