"use client";

import { ActionForm } from "@/components/forms/action-form";
import { ConfirmStep } from "@/components/forms/confirm-step";
import { SubmitButton } from "@/components/forms/submit-button";
import type { Role } from "@/db/schema";

import { changeMemberRole, removeMember } from "../actions";
import { RoleSelect } from "./role-select";

export type MemberRowProps = { membershipId: string; name: string; email: string; role: Role; isSelf: boolean };

export function MemberRow({ membershipId, name, email, role, isSelf }: MemberRowProps) {
  return (
    <tr className="border-t border-rule align-top">
      <td className="py-2 pr-3">
        <span className="font-medium">{name}</span>
        {isSelf ? <span className="ml-1 text-xs text-ink-soft">(you)</span> : null}
      </td>
      <td className="py-2 pr-3 text-ink-soft">{email}</td>
      <td className="py-2 pr-3">
        <ActionForm action={changeMemberRole} label={`Role of ${name}`} className="flex flex-wrap items-center gap-2">
          <input type="hidden" name="membershipId" value={membershipId} />
          <RoleSelect id={`role-${membershipId}`} defaultValue={role} label={`Role of ${name}`} />
          <SubmitButton tone="quiet" pendingLabel="Saving…">
            Save role
          </SubmitButton>
        </ActionForm>
      </td>
      <td className="py-2">
        <ConfirmStep opener="Remove…" openerLabel={`Remove ${name}`}>
          <ActionForm action={removeMember} label={`Confirm removing ${name}`} className="flex flex-col gap-1">
            <p>
              Remove <strong>{name}</strong> from this organization? They lose access at once.
            </p>
            <input type="hidden" name="membershipId" value={membershipId} />
            <fieldset className="text-xs">
              <legend className="text-ink-soft">API keys {name} made</legend>
              <label className="mr-3 inline-flex items-center gap-1">
                <input type="radio" name="creatorKeys" value="revoke" required /> revoke them
              </label>
              <label className="inline-flex items-center gap-1">
                <input type="radio" name="creatorKeys" value="keep" required /> keep them working
              </label>
            </fieldset>
            <SubmitButton tone="danger" pendingLabel="Removing…">
              Yes, remove {name}
            </SubmitButton>
          </ActionForm>
        </ConfirmStep>
      </td>
    </tr>
  );
}
