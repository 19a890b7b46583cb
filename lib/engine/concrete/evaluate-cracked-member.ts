import type { LimitProfile, Member } from "../model";
import { getGoverningCheck, getMemberGoverningCheck } from "../checks/evaluate-checks";
import type { MemberEvaluation } from "../checks/evaluate-member";
import { computeFrequency } from "../frequency";
import type { DeflectionTerm } from "./combined-deflection";
import { applyCrackedPatterns, CRACKED_PATTERN_NOTE } from "./cracked-patterns";
import { describeCrackedEvaluation, evaluateCrackedDeflectionChecks, PERMANENT_CASE_FACTORS } from "./cracked-evaluation";
import { createMemberWithInertia, hasReinforcedSpan, solveCrackedState } from "./cracked-state";

export { hasReinforcedSpan };

/** What a cracked evaluation adds to the member evaluation. */
export interface CrackedMemberExtras {
  /** Per combination (profile order), the weighted solutions whose sum is its deflection. */
  combinationTerms: DeflectionTerm[][];
  /** Plain-language remarks for the member's result (lowest I_e / I_g, non-convergence). */
  notes: string[];
}

/** A member evaluation with its cracked extras (the type only: evaluate-member.ts calls this module). */
export type CrackedMemberEvaluation = MemberEvaluation & { cracked: CrackedMemberExtras };

/**
 * The frequency of a cracked member is computed with each span's I_e under the vibrating mass's
 * own load (mass factors plus the permanent dead load): lower than I_g, so the frequency is not
 * overstated (conservative; the codes cited give no rule for it).
 */
function getFrequencyMember(member: Member, profile: LimitProfile): Member {
  if (profile.frequency === undefined) return member;
  const levels: Record<string, number> = { ...profile.frequency.massFactors };
  for (const name in PERMANENT_CASE_FACTORS) levels[name] = Math.max(levels[name] ?? 0, PERMANENT_CASE_FACTORS[name] as number);
  return createMemberWithInertia(member, solveCrackedState(member, levels).inertiaMm4);
}

/**
 * Solves and checks a validated member with reinforced concrete spans: every combination with
 * cracked, load-dependent I_e (cracked-evaluation.ts; on springs judged from the chord and in
 * total, as other members), pattern loading (cracked-patterns.ts), rotations, the frequency with
 * I_e under the vibrating mass. `solution` and `combinationFactors` are those of each combination's total load
 * level (the first term), kept for callers that read one solution; the deflections are the
 * weighted sums in cracked.combinationTerms.
 */
export function evaluateCrackedMember(member: Member, profile: LimitProfile): CrackedMemberEvaluation {
  const evaluation = evaluateCrackedDeflectionChecks(member, profile);
  const patterned = applyCrackedPatterns(member, profile, evaluation.checks, evaluation.solveState);
  const checks = patterned ?? evaluation.checks;
  const governing = getGoverningCheck(checks);
  const frequency = computeFrequency(getFrequencyMember(member, profile), profile);
  let pass = frequency === null || frequency.pass;
  for (const check of checks) if (!check.pass) pass = false;
  const first = evaluation.combinationTerms[0]?.[0];
  const solution = first === undefined ? solveCrackedState(member, PERMANENT_CASE_FACTORS).solution : first.solution;
  return {
    solution,
    checks,
    governing,
    governingCheck: getMemberGoverningCheck(governing, frequency),
    rotations: evaluation.rotations,
    frequency,
    pass,
    combinationFactors: evaluation.combinationTerms.map((terms) => terms[0]!.factors),
    cracked: { combinationTerms: evaluation.combinationTerms, notes: [...describeCrackedEvaluation(member, evaluation), ...(patterned === null ? [] : [CRACKED_PATTERN_NOTE])] },
  };
}
