import type { Metadata } from "next";

import { SignInForm } from "../_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const notices: Record<string, string> = {
  "password-changed": "Password changed. Sign in with the new one.",
  "invitation-accepted": "Invitation accepted. Sign in to continue.",
  "signed-out": "You are signed out.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const callbackUrl = typeof params.callbackUrl === "string" ? params.callbackUrl : "/schedules";
  const notice = typeof params.notice === "string" ? notices[params.notice] : undefined;
  return <SignInForm callbackUrl={callbackUrl} notice={notice} />;
}
