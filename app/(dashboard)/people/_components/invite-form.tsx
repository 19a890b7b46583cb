"use client";

import { ActionForm } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";

import { inviteMember } from "../actions";
import { RoleDescriptions, RoleSelect } from "./role-select";

export function InviteForm() {
  return (
    <ActionForm action={inviteMember} label="Invite a person" className="space-y-3 rounded border border-rule bg-sheet p-4">
      <h2 className="font-semibold">Invite a person</h2>
      <FormField label="E-mail" name="email" type="email" maxLength={320} autoComplete="off" />
      <div className="flex items-center gap-2">
        <RoleSelect id="invite-role" label="Role" describedBy="invite-role-descriptions" />
        <SubmitButton pendingLabel="Sending…">Send invitation</SubmitButton>
      </div>
      <RoleDescriptions id="invite-role-descriptions" />
      <p className="text-xs text-ink-soft">The link works once and expires after 72 hours.</p>
    </ActionForm>
  );
}
