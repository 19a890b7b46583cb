"use client";

import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";

import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { toSameOriginPath } from "@/lib/server/auth/safe-callback";

const messages: Record<string, string> = {
  invalid: "That e-mail and password do not match an account.",
  locked: "Too many attempts for this account. Wait 15 minutes or reset the password.",
  throttled: "Too many sign-in attempts from your network. Wait 15 minutes and try again.",
};

export type SignInFormProps = { callbackUrl: string; notice?: string };

export function SignInForm({ callbackUrl, notice }: SignInFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const email = String(data.get("email") ?? "").trim();
    const password = String(data.get("password") ?? "");
    if (!email || !password) return setError("Enter your e-mail and password.");
    setPending(true);
    setError(null);
    const result = await signIn("credentials", { email, password, redirect: false });
    setPending(false);
    if (!result || result.error) return setError(messages[result?.error ?? ""] ?? messages.invalid!);
    // The page already reduced callbackUrl to a path of ours; checked again where it is used.
    router.push(toSameOriginPath(callbackUrl, window.location.origin));
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" aria-label="Sign in" noValidate>
      <h1 className="text-base font-semibold">Sign in</h1>
      {notice ? <Notice tone="ok">{notice}</Notice> : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Field label="E-mail" name="email" type="email" autoComplete="username" required maxLength={320} />
      <Field label="Password" name="password" type="password" autoComplete="current-password" required maxLength={256} />
      <div className="flex items-center justify-between">
        <Button type="submit" disabled={pending}>
          {pending ? "Signing in…" : "Sign in"}
        </Button>
        <Link href="/forgot-password" className="text-xs text-action underline">
          Forgot your password?
        </Link>
      </div>
    </form>
  );
}
