import { z } from "zod";

import { dispositionKinds } from "@/db/schema";

export const JUSTIFICATION_MAX_CHARS = 4_000;
/** A justification says why: a word or two is not one. */
export const JUSTIFICATION_MIN_CHARS = 15;

export { dispositionKindDescriptions, dispositionKindLabels } from "@/lib/review-vocabulary";

/**
 * A decision as entered: the kind, and the written reason (`justification`), required and at
 * least JUSTIFICATION_MIN_CHARS long to accept a failure; optional context for the other kinds.
 */
export const dispositionInputSchema = z
  .object({
    kind: z.enum(dispositionKinds, { error: `must be one of: ${dispositionKinds.join(", ")}` }),
    justification: z
      .string()
      .max(JUSTIFICATION_MAX_CHARS, `must be at most ${JUSTIFICATION_MAX_CHARS} characters`)
      .transform((s) => s.trim())
      .optional()
      .nullable(),
  })
  .superRefine((value, ctx) => {
    if (value.kind === "accepted_with_justification" && (value.justification ?? "").length < JUSTIFICATION_MIN_CHARS) {
      ctx.addIssue({ code: "custom", path: ["justification"], message: `accepting a failure needs a written justification of at least ${JUSTIFICATION_MIN_CHARS} characters` });
    }
    if (value.justification?.includes("\u0000")) ctx.addIssue({ code: "custom", path: ["justification"], message: "must not contain NUL characters" });
  })
  .transform((value) => ({ kind: value.kind, justification: value.justification ? value.justification : null }));
export type DispositionInput = z.infer<typeof dispositionInputSchema>;

/** Who records a decision: a signed-in person, or an API key (named by its label). */
export type DispositionActor = { kind: "user"; userId: string; name: string } | { kind: "api_key"; apiKeyId: string; name: string };

export function describeActor(actor: DispositionActor): string {
  return actor.kind === "user" ? actor.name : `API key "${actor.name}"`;
}
