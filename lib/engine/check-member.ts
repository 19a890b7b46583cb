import type { CatalogueSection, LimitProfile, Member, MemberResult, ShapeSample } from "./model";
import { assertMemberAndProfileValid, evaluateValidatedMember } from "./checks/evaluate-member";
import { sampleSpanDeflections, type CaseFactors } from "./solver/deflection-field";
import type { MemberSolution } from "./solver/solve-member";
import { suggestResize, type SuggestionOutcome } from "./suggest";
import { sampleCombinedSpanDeflections, type DeflectionTerm } from "./concrete/combined-deflection";
import { getConcreteNotes, getCrackedSuggestionOutcome } from "./concrete/concrete-notes";

/** Points per span in the sampled shape, both ends included (shared nodes appear once). */
export const SHAPE_POINTS_PER_SPAN = 21;

const shapeValues = new Float64Array(SHAPE_POINTS_PER_SPAN * 8);
const localPositions = new Float64Array(SHAPE_POINTS_PER_SPAN);

/**
 * The deflected shape for diagrams: SHAPE_POINTS_PER_SPAN evenly spaced points per span (the
 * support nodes included), deflection in mm (+ down) per combination id.
 */
function sampleShape(solution: MemberSolution, combinationIds: string[], combinationFactors: CaseFactors[], combinationTerms?: DeflectionTerm[][]): ShapeSample[] {
  const samples: ShapeSample[] = [];
  const intervals = SHAPE_POINTS_PER_SPAN - 1;
  const combinationCount = combinationIds.length;
  const values = shapeValues.length >= SHAPE_POINTS_PER_SPAN * combinationCount ? shapeValues : new Float64Array(SHAPE_POINTS_PER_SPAN * combinationCount);
  const template: Record<string, number> = {};
  for (const id of combinationIds) template[id] = 0;
  for (let span = 0; span < solution.spanCount; span++) {
    const x0 = solution.nodeXMm[span] as number;
    const length = solution.lengthMm[span] as number;
    for (let k = 0; k <= intervals; k++) localPositions[k] = k === intervals ? length : (length * k) / intervals;
    for (let c = 0; c < combinationCount; c++) {
      const terms = combinationTerms?.[c];
      if (terms !== undefined) sampleCombinedSpanDeflections(terms, span, localPositions, values, c, combinationCount);
      else sampleSpanDeflections(solution, combinationFactors[c] as CaseFactors, span, localPositions, values, c, combinationCount);
    }
    for (let k = span === 0 ? 0 : 1; k <= intervals; k++) {
      // cloning a template keeps one hidden class: the stores below then hit existing fields
      const deflectionMm: Record<string, number> = { ...template };
      for (let c = 0; c < combinationCount; c++) deflectionMm[combinationIds[c] as string] = values[k * combinationCount + c] as number;
      samples.push({ xMm: k === intervals ? (solution.nodeXMm[span + 1] as number) : x0 + (localPositions[k] as number), deflectionMm });
    }
  }
  return samples;
}

export interface CheckMemberOptions {
  /** Also sample the deflected shape for diagrams (MemberResult.shape). */
  shape?: boolean;
}

/**
 * Checks one member against a limit profile: every combination on every span (largest deflection
 * and where, allowed = effective span / N capped by capMm, utilization, factor of safety), the
 * rotation at every node, the first natural frequency when the profile asks, the governing check,
 * and for a failing member the minimum uniform I and the lightest passing catalogue section.
 * Internal units (model.ts). Throws EngineInputError (paths relative to the member; profile
 * issues under `profile.`, catalogue issues under `catalogue[i]`) for input it cannot analyse.
 * `shape` only when options.shape is set: sampling it costs more than the checks, and only a
 * member's own page draws it.
 */
export function checkMember(member: Member, profile: LimitProfile, catalogue?: CatalogueSection[], options: CheckMemberOptions = {}): MemberResult {
  assertMemberAndProfileValid(member, profile);
  const evaluation = evaluateValidatedMember(member, profile);
  // a cracked member's I_e is not a section property that scales: no minimum I (concrete-notes.ts)
  const outcome: SuggestionOutcome | null = evaluation.pass ? null : evaluation.cracked !== undefined ? getCrackedSuggestionOutcome() : suggestResize(member, profile, evaluation, catalogue);
  const result: MemberResult = {
    mark: member.mark,
    category: member.category,
    checks: evaluation.checks,
    governing: evaluation.governing,
    governingCheck: evaluation.governingCheck,
    rotations: evaluation.rotations,
    frequency: evaluation.frequency,
    pass: evaluation.pass,
    suggestion: outcome === null ? null : outcome.suggestion,
  };
  if (options.shape === true) {
    result.shape = sampleShape(evaluation.solution, profile.combinations.map((combination) => combination.id), evaluation.combinationFactors, evaluation.cracked?.combinationTerms);
  }
  // most members have no notes: build the list only when there is one
  const concreteNotes = getConcreteNotes(member, evaluation.cracked);
  const intakeNotes = member.intakeNotes ?? [];
  const suggestionNotes = outcome === null ? [] : outcome.notes;
  if (intakeNotes.length + concreteNotes.length + suggestionNotes.length > 0) result.notes = [...intakeNotes, ...concreteNotes, ...suggestionNotes];
  return result;
}
