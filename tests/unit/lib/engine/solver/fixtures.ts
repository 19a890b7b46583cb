/** Small builders shared by the engine tests (test code only). */
import { expect } from "vitest";
import type { Load, Member, SpanSegment, Support, SupportKind } from "../../../../../lib/engine/model";
import { createCaseFactors, findSpanExtreme, solveMember, type CaseFactors, type MemberSolution } from "../../../../../lib/engine/solver";

export const E_MPA = 200_000;
export const I_MM4 = 8.0e7;
export const EI = E_MPA * I_MM4;

export function createSupports(...kinds: SupportKind[]): Support[] {
  return kinds.map((kind) => (kind === "spring" ? { kind, springNPerMm: 1e4 } : { kind }));
}

export function createSpans(lengthsMm: number[], eMpa = E_MPA, iMm4 = I_MM4): SpanSegment[] {
  return lengthsMm.map((lengthMm) => ({ lengthMm, eMpa, iMm4 }));
}

export function createMember(spans: SpanSegment[], supports: Support[], loads: Load[], extra: Partial<Member> = {}): Member {
  return { mark: "T-1", category: "other", quantity: 1, spans, supports, loads, ...extra };
}

/** Solves the member and returns factors for "case A" at factor 1. */
export function solveCase(member: Member, loadCase = "A"): { solution: MemberSolution; factors: CaseFactors } {
  const solution = solveMember(member);
  return { solution, factors: createCaseFactors(solution, { [loadCase]: 1 }) };
}

export function getExtreme(member: Member, span = 0, loadCase = "A"): { deflectionMm: number; atMm: number } {
  const { solution, factors } = solveCase(member, loadCase);
  return findSpanExtreme(solution, factors, span);
}

/** |actual - expected| <= tol * |expected| (tol defaults to the 1e-9 the engine promises). */
export function expectRelative(actual: number, expected: number, tol = 1e-9): void {
  expect(Number.isFinite(actual)).toBe(true);
  const error = Math.abs(actual - expected);
  if (!(error <= tol * Math.abs(expected))) {
    throw new Error(`expected ${expected}, got ${actual} (relative error ${error / Math.abs(expected)} > ${tol})`);
  }
}
