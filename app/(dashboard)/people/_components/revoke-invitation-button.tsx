"use client";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";

import { revokeInvitation } from "../actions";

export function RevokeInvitationButton({ invitationId, email }: { invitationId: string; email: string }) {
  return (
    <ActionForm action={revokeInvitation} label={`Withdraw invitation for ${email}`} className="inline">
      <input type="hidden" name="invitationId" value={invitationId} />
      <SubmitButton tone="quiet" pendingLabel="Withdrawing…" aria-label={`Withdraw invitation for ${email}`}>
        Withdraw
      </SubmitButton>
    </ActionForm>
  );
}
