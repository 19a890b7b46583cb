"use client";

import { ActionForm } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";
import { SelectField } from "@/components/ui/field";

import { resendFailedSince } from "../actions";

export type ResendFailedFormProps = { endpoints: { id: string; url: string }[]; defaultSince: string };

export function ResendFailedForm({ endpoints, defaultSince }: ResendFailedFormProps) {
  return (
    <ActionForm action={resendFailedSince} label="Resend failed deliveries" className="flex flex-wrap items-end gap-3 rounded border border-rule bg-sheet p-3">
      <FormField label="Failed since (UTC)" name="since" type="datetime-local" defaultValue={defaultSince} />
      <SelectField label="Endpoint" name="endpointId" defaultValue="">
        <option value="">All endpoints</option>
        {endpoints.map((e) => (
          <option key={e.id} value={e.id}>
            {e.url}
          </option>
        ))}
      </SelectField>
      <SubmitButton tone="quiet" pendingLabel="Resending…">
        Resend failed
      </SubmitButton>
    </ActionForm>
  );
}
