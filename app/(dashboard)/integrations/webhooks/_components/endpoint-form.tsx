"use client";

import { ActionForm, useFieldError } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";

import { createEndpoint, updateEndpoint } from "../actions";
import { EventCheckboxes } from "./event-checkboxes";

export type EndpointFormProps = {
  endpoint?: { id: string; url: string; description: string; eventTypes: string[] };
};

function EventsField({ idPrefix, selected }: { idPrefix: string; selected: readonly string[] }) {
  return <EventCheckboxes idPrefix={idPrefix} selected={selected} error={useFieldError("eventTypes")} />;
}

/** Adds an endpoint, or edits one when given. */
export function EndpointForm({ endpoint }: EndpointFormProps) {
  const idPrefix = endpoint ? `edit-${endpoint.id}` : "new-endpoint";
  return (
    <ActionForm
      action={endpoint ? updateEndpoint : createEndpoint}
      label={endpoint ? `Edit endpoint ${endpoint.url}` : "Add an endpoint"}
      className="space-y-3 rounded border border-rule bg-sheet p-4"
    >
      {endpoint ? <input type="hidden" name="endpointId" value={endpoint.id} /> : <h2 className="font-semibold">Add an endpoint</h2>}
      <FormField label="URL" name="url" type="url" inputMode="url" maxLength={2000} defaultValue={endpoint?.url} placeholder="https://partner.example/hooks/sagline" autoComplete="off" />
      <FormField label="Description" name="description" maxLength={300} defaultValue={endpoint?.description} autoComplete="off" />
      <EventsField idPrefix={idPrefix} selected={endpoint?.eventTypes ?? ["schedule.completed", "schedule.failed"]} />
      <SubmitButton pendingLabel="Saving…">{endpoint ? "Save endpoint" : "Add endpoint"}</SubmitButton>
      {endpoint ? null : <p className="text-xs text-ink-soft">Addresses on loopback, private networks, link-local and cloud metadata are refused.</p>}
    </ActionForm>
  );
}
