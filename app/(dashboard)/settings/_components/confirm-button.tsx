"use client";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";
import type { ActionResult } from "@/lib/server/auth/guards";

export type ConfirmButtonProps = {
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
  /** What the button does, e.g. "Remove Verrel alloy 7". */
  label: string;
  fields: Record<string, string>;
  /** The consequence, in one or two sentences. */
  warning: string;
  confirmLabel: string;
};

/** A destructive action in two steps, working without script too: open the confirmation, then confirm. */
export function ConfirmButton({ action, label, fields, warning, confirmLabel }: ConfirmButtonProps) {
  return (
    <details className="group">
      <summary className="inline-block cursor-pointer list-none rounded border border-fail/40 bg-sheet px-2 py-1 text-xs font-medium text-fail hover:bg-red-50" aria-label={label}>
        Remove…
      </summary>
      <ActionForm action={action} label={`Confirm: ${label}`} className="mt-2 w-56 space-y-2 rounded border border-rule bg-sheet p-2">
        {Object.entries(fields).map(([name, value]) => (
          <input key={name} type="hidden" name={name} value={value} />
        ))}
        <p className="text-xs">{warning}</p>
        <SubmitButton tone="danger" pendingLabel="Removing…">
          {confirmLabel}
        </SubmitButton>
      </ActionForm>
    </details>
  );
}
