import type { ReactNode } from "react";

export type ConfirmStepProps = {
  /** The visible opener, e.g. "Delete…" (the ellipsis says a question follows). */
  opener: string;
  /** The opener's accessible name, e.g. "Delete https://partner.example/hook". */
  openerLabel: string;
  tone?: "quiet" | "danger";
  children: ReactNode;
};

const openerTones = {
  quiet: "border-rule text-ink hover:bg-paper",
  danger: "border-fail/40 text-fail hover:bg-red-50",
};

/**
 * Two steps for an action that cannot be taken back: the opener reveals the question and the
 * confirming form inside. Plain details/summary, so it works by keyboard and without script.
 */
export function ConfirmStep({ opener, openerLabel, tone = "danger", children }: ConfirmStepProps) {
  return (
    <details className="group">
      <summary className={`inline-block cursor-pointer list-none rounded border bg-sheet px-3 py-1.5 text-sm font-medium ${openerTones[tone]}`} aria-label={openerLabel}>
        {opener}
      </summary>
      <div className="mt-2 w-60 space-y-2 rounded border border-rule bg-sheet p-2 text-xs">{children}</div>
    </details>
  );
}
