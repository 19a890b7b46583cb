import type { Metadata } from "next";
import Link from "next/link";

import { ActionForm } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";
import { isResetTokenOpen } from "@/lib/server/auth/password-reset";
import { tokenSchema } from "@/lib/server/validation";

import { resetPassword } from "../../actions";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const open = tokenSchema.safeParse(token).success && (await isResetTokenOpen(token));
  if (!open) {
    return (
      <div className="space-y-3">
        <h1 className="text-base font-semibold">This link no longer works</h1>
        <p className="text-ink-soft">Reset links work once and expire after 60 minutes.</p>
        <Link href="/forgot-password" className="text-action underline">
          Ask for a new link
        </Link>
      </div>
    );
  }
  return (
    <ActionForm action={resetPassword} label="Choose a new password">
      <h1 className="text-base font-semibold">Choose a new password</h1>
      <input type="hidden" name="token" value={token} />
      <FormField label="New password (12 characters or more)" name="password" type="password" autoComplete="new-password" maxLength={256} />
      <FormField label="The same again" name="confirm" type="password" autoComplete="new-password" maxLength={256} />
      <SubmitButton pendingLabel="Saving…">Save the password</SubmitButton>
    </ActionForm>
  );
}
