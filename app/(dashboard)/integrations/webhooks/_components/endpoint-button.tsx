"use client";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";
import type { ActionResult } from "@/lib/server/auth/guards";

export type EndpointButtonProps = {
  action: (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;
  label: string;
  fields: Record<string, string>;
  children: string;
  tone?: "primary" | "quiet" | "danger";
};

/** One small action on an endpoint or delivery, with its outcome shown beside it. */
export function EndpointButton({ action, label, fields, children, tone = "quiet" }: EndpointButtonProps) {
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
