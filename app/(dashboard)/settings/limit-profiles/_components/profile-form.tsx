"use client";

import { ActionForm, useFieldError } from "@/components/forms/action-form";
import { FormField, FormSelectField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";

import { createLimitProfile, updateLimitProfile } from "../actions";

function DefinitionField({ defaultValue, hint }: { defaultValue?: string; hint: string }) {
  const error = useFieldError("definition");
  return (
    <label className="block">
      <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">Definition (JSON, the schedule&apos;s limits.custom format)</span>
      <textarea
        name="definition"
        rows={defaultValue ? 16 : 6}
        defaultValue={defaultValue}
        spellCheck={false}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? "definition-error" : "definition-hint"}
        className="w-full rounded border border-rule bg-sheet px-2 py-1.5 font-mono text-xs aria-[invalid]:border-fail"
      />
      <span id="definition-hint" className="mt-1 block text-xs text-ink-soft">
        {hint}
      </span>
      {error ? (
        <span id="definition-error" className="mt-1 block whitespace-pre-wrap text-xs text-fail">
          {error}
        </span>
      ) : null}
    </label>
  );
}

export type NewProfileFormProps = { presets: { id: string; label: string }[] };

/** A new profile: a copy of a preset, or a definition of one's own. */
export function NewProfileForm({ presets }: NewProfileFormProps) {
  return (
    <ActionForm action={createLimitProfile} label="New limit profile" className="max-w-2xl space-y-3 rounded border border-rule bg-sheet p-4">
      <h2 className="font-semibold">New limit profile</h2>
      <FormField label="Label" name="label" maxLength={200} autoComplete="off" placeholder="Floors, in-house (live l/480)" />
      <FormField label="Source" name="source" maxLength={500} autoComplete="off" placeholder="IBC 2021 Table 1604.3, live row tightened by the firm" />
      <FormSelectField label="Copy of preset" name="basedOnPreset" defaultValue="" className="w-full rounded border border-rule bg-sheet px-2 py-1.5 text-sm">
        <option value="">None: use the definition below</option>
        {presets.map((p) => (
          <option key={p.id} value={p.id}>
            {p.label}
          </option>
        ))}
      </FormSelectField>
      <DefinitionField hint="Leave empty to copy the preset as it is; edit the copy afterwards. Quantities carry units, e.g. {&quot;value&quot;: 20, &quot;unit&quot;: &quot;mm&quot;}." />
      <SubmitButton pendingLabel="Saving…">Save profile</SubmitButton>
    </ActionForm>
  );
}

export type EditProfileFormProps = { profileId: string; version: number; label: string; source: string; definition: string };

/** An edit saves a new version; the schedules checked against older ones keep their results. */
export function EditProfileForm({ profileId, version, label, source, definition }: EditProfileFormProps) {
  return (
    <ActionForm action={updateLimitProfile} label="Edit limit profile" className="max-w-3xl space-y-3 rounded border border-rule bg-sheet p-4">
      <h2 className="font-semibold">Edit (saves version {version + 1})</h2>
      <input type="hidden" name="profileId" value={profileId} />
      <input type="hidden" name="expectedVersion" value={version} />
      <FormField label="Label" name="label" maxLength={200} defaultValue={label} autoComplete="off" />
      <FormField label="Source" name="source" maxLength={500} defaultValue={source} autoComplete="off" />
      <DefinitionField defaultValue={definition} hint="Schedules checked against earlier versions keep their results; their pages offer a recheck with the new version." />
      <SubmitButton pendingLabel="Saving…">Save as version {version + 1}</SubmitButton>
    </ActionForm>
  );
}
