"use client";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";
import { ConfirmStep } from "@/components/forms/confirm-step";
import type { ActionResult } from "@/lib/server/auth/guards";

export type EndpointButtonProps = {
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
  label: string;
  fields: Record<string, string>;
  children: string;
  tone?: "primary" | "quiet" | "danger";
  /** For an action that cannot be taken back: the question asked before it runs. */
  confirm?: { question: string; confirmLabel: string };
};

/** One small action on an endpoint or delivery, with its outcome shown beside it; `confirm` asks first. */
export function EndpointButton({ action, label, fields, children, tone = "quiet", confirm }: EndpointButtonProps) {
  if (confirm) {
    return (
      <ConfirmStep opener={`${children}…`} openerLabel={label} tone={tone === "danger" ? "danger" : "quiet"}>
        <ActionForm action={action} label={`Confirm: ${label}`} className="space-y-2">
          {Object.entries(fields).map(([name, value]) => (
            <input key={name} type="hidden" name={name} value={value} />
          ))}
          <p>{confirm.question}</p>
          <SubmitButton tone="danger" pendingLabel="Working…">
            {confirm.confirmLabel}
          </SubmitButton>
        </ActionForm>
      </ConfirmStep>
    );
  }
  return (
    <ActionForm action={action} label={label} className="space-y-1">
      {Object.entries(fields).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      <SubmitButton tone={tone} pendingLabel="Working…" aria-label={label}>
        {children}
      </SubmitButton>
    </ActionForm>
  );
}
