import type { DigestFrequency, DispositionKind, ReviewState } from "@/db/schema/reviews";

/**
 * Display names of the review flow, safe to import from client components (no runtime imports).
 * The stored values are the keys; these are the words people read.
 */
export const dispositionKindLabels: Record<DispositionKind, string> = {
  accepted_with_justification: "Accepted with justification",
  member_to_be_revised: "Member to be revised",
  information_requested: "Information requested from the sender",
};

export const dispositionKindDescriptions: Record<DispositionKind, string> = {
  accepted_with_justification: "The engineer accepts the result as it stands and writes down why.",
  member_to_be_revised: "The member must change (section, material, span or support) and be submitted again.",
  information_requested: "The inputs are doubtful or incomplete; the sender is asked for more.",
};

export const reviewStateLabels: Record<ReviewState | "not_required", string> = {
  awaiting_review: "Awaiting review",
  ...dispositionKindLabels,
  not_required: "No review needed",
};

/** Marks an earlier decision shown on a later submission of the same reference. */
export const CARRIED_OVER_LABEL = "Carried over";

export const digestFrequencyLabels: Record<DigestFrequency, string> = {
  immediate: "Immediately, when a schedule completes with failures",
  daily: "Once a day, a summary of the previous day",
  none: "No digest e-mail",
};

export const queueSortLabels = {
  utilization: "Highest utilization first",
  age: "Longest waiting first",
  schedule: "Newest schedule first",
} as const;

/** The review states in the order the console lists them (same values as db/schema/reviews.ts reviewStates). */
export const reviewStateOrder: readonly ReviewState[] = ["awaiting_review", "accepted_with_justification", "member_to_be_revised", "information_requested"];
export const dispositionKindOrder: readonly DispositionKind[] = ["accepted_with_justification", "member_to_be_revised", "information_requested"];
export const digestFrequencyOrder: readonly DigestFrequency[] = ["immediate", "daily", "none"];
