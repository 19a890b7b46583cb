import type { Metadata } from "next";
import Link from "next/link";

import { ActionForm } from "@/components/forms/action-form";
import { FormField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";

import { requestPasswordReset } from "../actions";

export const metadata: Metadata = { title: "Reset password" };

export default function ForgotPasswordPage() {
  return (
    <ActionForm action={requestPasswordReset} label="Reset password">
      <h1 className="text-base font-semibold">Reset your password</h1>
      <p className="text-ink-soft">We e-mail a single-use link that expires in 60 minutes.</p>
      <FormField label="E-mail" name="email" type="email" autoComplete="username" maxLength={320} />
      <div className="flex items-center justify-between">
        <SubmitButton pendingLabel="Sending…">Send the link</SubmitButton>
        <Link href="/sign-in" className="text-xs text-action underline">
          Back to sign-in
        </Link>
      </div>
    </ActionForm>
  );
}
