import type { Member } from "../model";
import type { SuggestionOutcome } from "../suggest";
import type { CrackedMemberExtras } from "./evaluate-cracked-member";

/** The flag every view shows for a concrete member checked with its gross section. */
export const GROSS_SECTION_NOTE = "gross section: cracking not included";

const NO_NOTES: readonly string[] = [];

/**
 * Concrete remarks for a member's result: the gross-section flag (model.ts
 * Member.concreteGrossSection) or the cracked evaluation's own notes; an empty, shared list for
 * every other member.
 */
export function getConcreteNotes(member: Member, cracked: CrackedMemberExtras | undefined): readonly string[] {
  if (member.concreteGrossSection === true) return [GROSS_SECTION_NOTE];
  return cracked === undefined ? NO_NOTES : cracked.notes;
}

/**
 * A failing cracked member gets no minimum I: I_e follows the reinforcement and the moment, not a
 * uniform scaling of the section, so "I x utilization" would not be an I that passes.
 */
export function getCrackedSuggestionOutcome(): SuggestionOutcome {
  return {
    suggestion: null,
    notes: ["No minimum I is suggested for cracked reinforced concrete: I_e depends on the reinforcement and the moment; add tension or compression steel, deepen the section, or shorten the span."],
  };
}
