/**
 * Pattern (partial) live load on a cracked concrete member, by an amplification taken from its
 * gross section. The cracked evaluation (cracked-evaluation.ts) loads every span at once, because
 * I_e depends on each arrangement's own moments. For each check, the worst arrangement's effect on
 * the same member with I_g (patterned extreme / all-spans-loaded extreme, never below 1) scales
 * the cracked deflection. This is an approximation, named on the result: it assumes the arrangement
 * amplifies the cracked member's deflection no more, relatively, than the elastic one's. That fails
 * for overhangs (an unloaded overhang removes hogging, so the back span's I_e drops too): a 6 m span
 * with a 2.4 m overhang came out about 10 % low at the tip. Solving the cracked member for the
 * chosen arrangement itself is the fix still to come.
 */
import type { CheckResult, LimitProfile, Member } from "../model";
import { createCheckResult, evaluateDeflectionChecks } from "../checks/evaluate-checks";
import { getPatternSplit, getSpanJudgements } from "../checks/span-groups";
import { solveValidatedMember } from "../solver/solve-member";

export const CRACKED_PATTERN_NOTE =
  "pattern loading on cracked concrete: each check's cracked deflection is scaled by the worst arrangement's amplification on the gross section; an approximation that can understate an overhang's tip (by about 10 % in a reviewed case), because an unloaded overhang also softens the back span: check the worst arrangement by hand";

/** The member's spans without their reinforcement: the gross, linear member. */
function createGrossMember(member: Member): Member {
  return { ...member, spans: member.spans.map(({ reinforcedConcrete: _omitted, ...span }) => span) };
}

/**
 * The cracked checks with pattern loading applied by amplification, or null when no pattern
 * applies (one span group, patterns off, no variable load). Checks keep their order.
 */
export function amplifyCrackedChecksForPatterns(member: Member, profile: LimitProfile, checks: readonly CheckResult[]): CheckResult[] | null {
  const judgements = getSpanJudgements(member);
  const split = getPatternSplit(member, profile, judgements);
  if (split === undefined) return null;
  const gross = createGrossMember(member);
  const patterned = evaluateDeflectionChecks(gross, profile, solveValidatedMember(gross, split), judgements).checks;
  const allLoaded = evaluateDeflectionChecks(gross, profile, solveValidatedMember(gross), judgements).checks;
  const combinations = new Map(profile.combinations.map((c) => [c.id, c]));
  return checks.map((check, index) => {
    const worst = patterned[index];
    const whole = allLoaded[index];
    const combination = combinations.get(check.combinationId);
    if (worst === undefined || whole === undefined || combination === undefined || worst.combinationId !== check.combinationId || worst.spanIndex !== check.spanIndex) return check;
    const wholeMm = Math.abs(whole.deflectionMm);
    const factor = wholeMm > 0 ? Math.max(1, Math.abs(worst.deflectionMm) / wholeMm) : 1;
    const amplified = createCheckResult(combination, check.spanIndex, judgements[check.spanIndex]!, profile.cantileverSpanMultiplier, {
      deflectionMm: check.deflectionMm * factor,
      atMm: check.atMm,
    });
    return worst.loadedSpans === undefined ? amplified : { ...amplified, loadedSpans: worst.loadedSpans };
  });
}
