"use client";

import { ActionForm, useFieldError } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";

import { importCatalogue } from "../actions";

function FileField() {
  const error = useFieldError("file");
  return (
    <label className="block">
      <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">File (CSV or JSON)</span>
      <input type="file" name="file" accept=".csv,.json,text/csv,application/json" aria-invalid={error ? true : undefined} aria-describedby={error ? "file-error" : "file-hint"} className="text-sm" />
      <span id="file-hint" className="mt-1 block text-xs text-ink-soft">
        CSV header: name, iMm4, areaMm2, massKgPerM, shearAreaMm2 (optional). JSON: an array of those objects. Internal units: mm^4, mm^2, kg/m. Names are unique with case and spaces ignored.
      </span>
      {error ? (
        <span id="file-error" className="mt-1 block text-xs text-fail">
          {error}
        </span>
      ) : null}
    </label>
  );
}

function InUseField() {
  const error = useFieldError("inUse");
  return (
    <div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="inUse" defaultChecked aria-invalid={error ? true : undefined} aria-describedby={error ? "in-use-error" : undefined} /> In use: resolve section names in
        schedules and suggest the lightest passing section
      </label>
      {error ? (
        <span id="in-use-error" className="mt-1 block text-xs text-fail">
          {error}
        </span>
      ) : null}
    </div>
  );
}

/** Imports a catalogue: every row is checked, and any problem stores nothing. */
export function ImportCatalogueForm() {
  return (
    <ActionForm action={importCatalogue} label="Import a section catalogue" className="max-w-2xl space-y-3 rounded border border-rule bg-sheet p-4">
      <h2 className="font-semibold">Import a catalogue</h2>
      <FormField label="Name" name="name" maxLength={100} autoComplete="off" />
      <FormField label="Source of the properties" name="source" maxLength={500} autoComplete="off" placeholder="Manufacturer's table, edition; or in-house calculation" />
      <FileField />
      <InUseField />
      <SubmitButton pendingLabel="Importing…">Import</SubmitButton>
    </ActionForm>
  );
}
