"use client";

import { useId } from "react";

import { useFieldError } from "@/components/forms/action-form";
import { dispositionKindDescriptions, dispositionKindLabels, dispositionKindOrder } from "@/lib/review-vocabulary";
import type { DispositionKind } from "@/db/schema/reviews";

export type DispositionFieldsProps = {
  kind: DispositionKind;
  onKindChange: (kind: DispositionKind) => void;
  justification: string;
  onJustificationChange: (text: string) => void;
};

/** The decision (three kinds, each described in words) and the written reason, shared by the single and bulk forms. */
export function DispositionFields({ kind, onKindChange, justification, onJustificationChange }: DispositionFieldsProps) {
  const id = useId();
  const kindError = useFieldError("kind");
  const justificationError = useFieldError("justification");
  const required = kind === "accepted_with_justification";
  return (
    <>
      <fieldset className="space-y-1">
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Disposition</legend>
        {dispositionKindOrder.map((k) => (
          <label key={k} className="flex gap-2 text-sm">
            <input type="radio" name="kind" value={k} checked={kind === k} onChange={() => onKindChange(k)} className="mt-1" />
            <span>
              <span className="font-medium">{dispositionKindLabels[k]}</span>
              <span className="block text-xs text-ink-soft">{dispositionKindDescriptions[k]}</span>
            </span>
          </label>
        ))}
        {kindError ? <span className="block text-xs text-fail">{kindError}</span> : null}
      </fieldset>
      <label className="block" htmlFor={`${id}-justification`}>
        <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">
          {required ? "Justification (required)" : "Note (optional)"}
        </span>
      </label>
      <textarea
        id={`${id}-justification`}
        name="justification"
        rows={3}
        maxLength={4000}
        required={required}
        value={justification}
        onChange={(e) => onJustificationChange(e.target.value)}
        aria-invalid={justificationError ? true : undefined}
        aria-describedby={justificationError ? `${id}-justification-error` : `${id}-justification-hint`}
        className="w-full rounded border border-rule bg-sheet px-2 py-1.5 text-sm aria-[invalid]:border-fail"
      />
      {justificationError ? (
        <span id={`${id}-justification-error`} className="block text-xs text-fail">
          {justificationError}
        </span>
      ) : (
        <span id={`${id}-justification-hint`} className="block text-xs text-ink-soft">
          {required ? "Say why the result is acceptable as it stands: what was verified, by whom, against what." : "What needs to change, or what the sender should provide."}
        </span>
      )}
    </>
  );
}
