"use client";

import { ActionForm } from "@/components/forms/action-form";
import { ConfirmStep } from "@/components/forms/confirm-step";
import { SubmitButton } from "@/components/forms/submit-button";

import { revokeInvitation } from "../actions";

export function RevokeInvitationButton({ invitationId, email }: { invitationId: string; email: string }) {
  return (
    <ConfirmStep opener="Withdraw…" openerLabel={`Withdraw invitation for ${email}`} tone="quiet">
      <ActionForm action={revokeInvitation} label={`Confirm withdrawing the invitation for ${email}`} className="space-y-2">
        <input type="hidden" name="invitationId" value={invitationId} />
        <p>Withdraw the invitation for {email}? Its link stops working.</p>
        <SubmitButton tone="danger" pendingLabel="Withdrawing…">
          Yes, withdraw it
        </SubmitButton>
      </ActionForm>
    </ConfirmStep>
  );
}
