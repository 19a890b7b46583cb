import { getRequestContext, can } from "@/lib/server/auth/request-context";
import { reviewStateLabels } from "@/lib/review-vocabulary";
import { getMemberReview } from "@/lib/server/review/get-member-review";

import { DispositionForm } from "./disposition-form";
import { DispositionHistory } from "./disposition-history";

export type DispositionPanelProps = { organizationId: string; scheduleId: string; mark: string };

/**
 * The member page's review panel: state, the append-only history (with any decision carried over
 * from an earlier submission, marked as such) and, for engineers and administrators, the form.
 * Self-contained: the member page only places it.
 */
export async function DispositionPanel({ organizationId, scheduleId, mark }: DispositionPanelProps) {
  const [context, review] = await Promise.all([getRequestContext(), getMemberReview(organizationId, scheduleId, mark)]);
  if (review.state === "not_required") return null;
  const canDisposition = can(context, "review:disposition");
  return (
    <section aria-labelledby="review-heading" className="rounded border border-rule bg-sheet p-4">
      <h2 id="review-heading" className="font-semibold">
        Review
      </h2>
      <p className="mt-1 text-sm">
        State: <strong data-testid="review-state">{reviewStateLabels[review.state]}</strong>
      </p>
      <DispositionHistory history={review.history} />
      {canDisposition ? (
        <DispositionForm scheduleId={scheduleId} mark={mark} />
      ) : (
        <p className="mt-3 text-xs text-ink-soft">Your role reads this history. Engineers and administrators record dispositions.</p>
      )}
    </section>
  );
}
