"use client";

import { useState } from "react";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";
import type { DispositionKind } from "@/db/schema/reviews";

import { recordDisposition } from "../actions";
import { DispositionFields } from "./disposition-fields";

export type DispositionFormProps = { scheduleId: string; mark: string };

/** Records one decision on this member; it is added to the history, never replacing an earlier one. */
export function DispositionForm({ scheduleId, mark }: DispositionFormProps) {
  const [kind, setKind] = useState<DispositionKind>("accepted_with_justification");
  const [justification, setJustification] = useState("");
  return (
    <ActionForm action={recordDisposition} label="Record a disposition" className="mt-3 space-y-2 border-t border-rule pt-3">
      <input type="hidden" name="scheduleId" value={scheduleId} />
      <input type="hidden" name="mark" value={mark} />
      <DispositionFields kind={kind} onKindChange={setKind} justification={justification} onJustificationChange={setJustification} />
      <SubmitButton pendingLabel="Recording…">Record disposition</SubmitButton>
    </ActionForm>
  );
}
