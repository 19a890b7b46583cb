"use server";

import { redirect } from "next/navigation";
import { z } from "zod";

import { runAction, type ActionResult } from "@/lib/server/auth/guards";
import { requestPasswordReset as sendReset, resetPassword as applyReset } from "@/lib/server/auth/password-reset";
import { getRequestAddress } from "@/lib/server/auth/request-address";
import { acceptInvitation as accept } from "@/lib/server/people/accept-invitation";
import { emailSchema, newPasswordSchema, personNameSchema, tokenSchema } from "@/lib/server/validation";

const resetRequestSchema = z.object({ email: emailSchema });

export async function requestPasswordReset(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("(auth)/requestPasswordReset", resetRequestSchema, formData, async ({ email }) => {
    await sendReset(email, await getRequestAddress());
    // The same words whether or not the account exists.
    return { ok: true, message: "If an account uses that address, a reset link is on its way. It expires in 60 minutes." };
  });
}

const passwordPairSchema = z
  .object({ token: tokenSchema, password: newPasswordSchema, confirm: z.string().max(256) })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." });

export async function resetPassword(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const result = await runAction("(auth)/resetPassword", passwordPairSchema, formData, async ({ token, password }) => {
    await applyReset(token, password, await getRequestAddress());
    return { ok: true, message: "Password changed." };
  });
  if (result.ok) redirect("/sign-in?notice=password-changed");
  return result;
}

const acceptSchema = z.object({
  token: tokenSchema,
  name: personNameSchema.optional(),
  password: z.string().min(1, "Enter a password.").max(256, "Use at most 256 characters."),
  accountExists: z.enum(["yes", "no"]),
});

export async function acceptInvitation(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const schema = acceptSchema.superRefine((v, ctx) => {
    if (v.accountExists === "no") {
      const check = newPasswordSchema.safeParse(v.password);
      if (!check.success) ctx.addIssue({ code: "custom", path: ["password"], message: check.error.issues[0]?.message ?? "Invalid password." });
      if (!v.name) ctx.addIssue({ code: "custom", path: ["name"], message: "Enter your name." });
    }
  });
  const result = await runAction("(auth)/acceptInvitation", schema, formData, async ({ token, name, password }) => {
    await accept({ token, name, password, clientAddress: await getRequestAddress() });
    return { ok: true, message: "Invitation accepted." };
  });
  if (result.ok) redirect("/sign-in?notice=invitation-accepted");
  return result;
}
