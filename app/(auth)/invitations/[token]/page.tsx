import type { Metadata } from "next";

import { ActionForm } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";
import { roleLabels } from "@/lib/server/auth/permissions";
import { getOpenInvitation } from "@/lib/server/people/accept-invitation";
import { tokenSchema } from "@/lib/server/validation";

import { acceptInvitation } from "../../actions";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = tokenSchema.safeParse(token).success ? await getOpenInvitation(token) : null;
  if (!invitation) {
    return (
      <div className="space-y-3">
        <h1 className="text-base font-semibold">This invitation no longer works</h1>
        <p className="text-ink-soft">
          Invitation links work once and expire after 72 hours, and an administrator may have withdrawn it. Ask them for
          a new one.
        </p>
      </div>
    );
  }
  return (
    <ActionForm action={acceptInvitation} label="Accept invitation">
      <h1 className="text-base font-semibold">Join {invitation.organizationName}</h1>
      <p className="text-ink-soft">
        As {roleLabels[invitation.role]}, signing in as <strong className="text-ink">{invitation.email}</strong>.
      </p>
      <input type="hidden" name="token" value={token} />
      <input type="hidden" name="accountExists" value={invitation.accountExists ? "yes" : "no"} />
      {invitation.accountExists ? (
        <FormField label="Password of your Sagline account" name="password" type="password" autoComplete="current-password" maxLength={256} />
      ) : (
        <>
          <FormField label="Your name" name="name" autoComplete="name" maxLength={120} />
          <FormField label="Choose a password (12 characters or more)" name="password" type="password" autoComplete="new-password" maxLength={256} />
        </>
      )}
      <SubmitButton pendingLabel="Joining…">Accept and join</SubmitButton>
    </ActionForm>
  );
}
