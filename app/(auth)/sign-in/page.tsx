import type { Metadata } from "next";

import { getEnv } from "@/lib/env";
import { toSameOriginPath } from "@/lib/server/auth/safe-callback";

import { SignInForm } from "../_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const notices: Record<string, string> = {
  "password-changed": "Password changed. Sign in with the new one.",
  "invitation-accepted": "Invitation accepted. Sign in to continue.",
  "signed-out": "You are signed out.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  // A crafted callbackUrl must not send people to another site after they sign in.
  const callbackUrl = toSameOriginPath(params.callbackUrl, getEnv().APP_URL);
  const notice = typeof params.notice === "string" ? notices[params.notice] : undefined;
  return <SignInForm callbackUrl={callbackUrl} notice={notice} />;
}
