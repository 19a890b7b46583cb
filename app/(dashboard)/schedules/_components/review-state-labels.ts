/** Display names of a member's review state (db/schema/reviews.ts); the vocabulary module may take these over. */
export const reviewStateLabels: Record<string, string> = {
  awaiting_review: "Awaiting review",
  accepted_with_justification: "Accepted with justification",
  member_to_be_revised: "Member to be revised",
  information_requested: "Information requested from the sender",
};
