"use client";

import { useActionState, useState } from "react";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { DispositionKind } from "@/db/schema/reviews";
import { dispositionKindLabels } from "@/lib/review-vocabulary";
import type { QueueQuery } from "@/lib/server/review/queue-filters";

import { applyBulkDisposition, previewBulkDisposition } from "../actions";
import { DispositionFields } from "./disposition-fields";

export type BulkDispositionFormProps = { query: QueueQuery };

/** The filter being applied, as hidden fields: the bulk action covers exactly the selection shown above. */
function FilterFields({ query }: BulkDispositionFormProps) {
  return (
    <>
      {(["scheduleId", "projectId", "category", "governingCheck", "utilizationAbove"] as const).map((name) => (
        <input key={name} type="hidden" name={name} value={query[name] === undefined ? "" : String(query[name])} />
      ))}
    </>
  );
}

/**
 * Two steps: preview how many members awaiting review the current filter holds, then confirm that
 * number. The server refuses if the selection changed in between.
 */
export function BulkDispositionForm({ query }: BulkDispositionFormProps) {
  const [kind, setKind] = useState<DispositionKind>("member_to_be_revised");
  const [justification, setJustification] = useState("");
  const [preview, previewAction, previewing] = useActionState(previewBulkDisposition, null);
  const [confirmedKey, setConfirmedKey] = useState<string | null>(null);
  const previewKey = `${kind}\u0000${justification}`;
  const previewed = preview?.ok && preview.data && confirmedKey === previewKey ? preview.data : null;

  return (
    <section aria-labelledby="bulk-heading" className="rounded border border-rule bg-sheet p-4">
      <h2 id="bulk-heading" className="font-semibold">
        Bulk disposition
      </h2>
      <p className="mt-1 text-sm text-ink-soft">Records one decision on every member awaiting review that matches the filters above, under one bulk id. Each member keeps its own history.</p>
      <form action={previewAction} onSubmit={() => setConfirmedKey(previewKey)} aria-label="Preview a bulk disposition" className="mt-3 max-w-2xl space-y-3" noValidate>
        <FilterFields query={query} />
        {preview && !preview.ok ? <Notice tone="error">{preview.fieldErrors?.justification ?? preview.message}</Notice> : null}
        <DispositionFields kind={kind} onKindChange={setKind} justification={justification} onJustificationChange={setJustification} />
        <Button type="submit" tone="quiet" disabled={previewing}>
          {previewing ? "Counting…" : "Preview the count"}
        </Button>
      </form>
      {previewed ? (
        previewed.count === 0 ? (
          <p className="mt-3 text-sm text-ink-soft">No member awaiting review matches these filters.</p>
        ) : previewed.overLimit ? (
          <Notice tone="error">More than {previewed.count} members match; narrow the filters (a bulk action decides at most {previewed.count}).</Notice>
        ) : (
          <ActionForm action={applyBulkDisposition} label="Confirm the bulk disposition" className="mt-3 max-w-2xl space-y-2 rounded border border-caution/40 bg-caution-bg p-3">
            <FilterFields query={query} />
            <input type="hidden" name="kind" value={kind} />
            <input type="hidden" name="justification" value={justification} />
            <input type="hidden" name="confirmedCount" value={previewed.count} />
            <p className="text-sm">
              This records <strong>{dispositionKindLabels[kind]}</strong> on <strong>{previewed.count}</strong> member{previewed.count === 1 ? "" : "s"}. It cannot be undone; a later decision is added to each history.
            </p>
            <SubmitButton pendingLabel="Recording…">
              Confirm: record on {previewed.count} member{previewed.count === 1 ? "" : "s"}
            </SubmitButton>
          </ActionForm>
        )
      ) : null}
    </section>
  );
}
