import type { ResultStatus } from "@/db/queries/schedules";
import { OUTCOME_LABELS } from "@/lib/vocabulary";

export type OutcomeLabelProps = { status: ResultStatus | "pending" };

// Pass, fail and error differ by word and by icon shape (circle, triangle, square), not only by colour.
const outcomes = {
  pass: { text: OUTCOME_LABELS.pass, tone: "text-pass", icon: <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.6" /> },
  fail: { text: OUTCOME_LABELS.fail, tone: "text-fail font-semibold", icon: <path d="M6 1.2 11 10.5H1Z" fill="currentColor" /> },
  error: { text: OUTCOME_LABELS.error, tone: "text-caution font-semibold", icon: <rect x="1.5" y="1.5" width="9" height="9" fill="none" stroke="currentColor" strokeWidth="1.6" /> },
  pending: { text: "Pending", tone: "text-ink-soft", icon: <circle cx="6" cy="6" r="2" fill="currentColor" /> },
} as const;

export function OutcomeLabel({ status }: OutcomeLabelProps) {
  const outcome = outcomes[status];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap ${outcome.tone}`} data-outcome={status}>
      <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12">
        {outcome.icon}
      </svg>
      {outcome.text}
    </span>
  );
}
