"use client";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";
import { SelectField } from "@/components/ui/field";
import type { DigestFrequency } from "@/db/schema/reviews";
import { digestFrequencyLabels, digestFrequencyOrder } from "@/lib/review-vocabulary";

import { saveDigestPreference } from "../actions";

export type DigestPreferenceFormProps = { frequency: DigestFrequency };

/** Each engineer's own choice of the digest of schedules that completed with failures. */
export function DigestPreferenceForm({ frequency }: DigestPreferenceFormProps) {
  return (
    <ActionForm action={saveDigestPreference} label="Digest e-mail" className="max-w-2xl space-y-2 rounded border border-rule bg-sheet p-4">
      <h2 className="font-semibold">Digest e-mail</h2>
      <p className="text-sm text-ink-soft">One e-mail listing the schedules of this organization that completed with failures, with links to their members in review.</p>
      <div className="flex flex-wrap items-end gap-2">
        <SelectField label="Send me the digest" name="frequency" defaultValue={frequency}>
          {digestFrequencyOrder.map((f) => (
            <option key={f} value={f}>
              {digestFrequencyLabels[f]}
            </option>
          ))}
        </SelectField>
        <SubmitButton pendingLabel="Saving…">Save</SubmitButton>
      </div>
    </ActionForm>
  );
}
