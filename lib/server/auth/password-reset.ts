import { and, eq, isNull, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { passwordResets, users } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { DomainError } from "@/lib/server/errors";
import { createId, createSecretToken, hashToken } from "@/lib/server/ids";
import { sendMail } from "@/lib/server/mail/send-mail";
import { buildPasswordResetMail } from "@/lib/server/mail/templates";

import { enqueuePasswordResetMail } from "./enqueue-account-mail";
import { hashPassword } from "./passwords";
import { normaliseEmail } from "./sign-in";
import { assertAttemptsAllowed } from "./throttle";
import { resetRequestAddressRule, resetRequestEmailRule, resetSubmitAddressRule } from "./throttle-rules";

export const RESET_TTL_MINUTES = 60;

const linkRefused = "This reset link has expired or was already used. Ask for a new one.";

/**
 * The web side of "forgot password": throttled per address and per client, then one job queued,
 * whether or not the account exists. The request never reads the users table, so its answer and
 * its timing are the same for every address; the worker looks the account up and sends the mail.
 */
export async function requestPasswordReset(email: string, clientAddress: string): Promise<void> {
  const emailKey = normaliseEmail(email);
  await assertAttemptsAllowed(
    [
      { rule: resetRequestEmailRule, subject: emailKey },
      { rule: resetRequestAddressRule, subject: clientAddress },
    ],
    "Too many reset requests.",
  );
  await enqueuePasswordResetMail(emailKey).catch((error: Error) => {
    console.error(`[sagline] reset mail not queued: ${error.message}`);
    throw new DomainError("unavailable", "The reset e-mail could not be queued. Try again in a minute.");
  });
}

/**
 * The worker side: when the account exists, issues a new link (only the newest works) and mails
 * it. A job run twice mails twice; the second link replaces the first.
 */
export async function sendPasswordResetMail(emailKey: string): Promise<"sent" | "no-account"> {
  const db = getDb();
  const [user] = await db.select({ id: users.id, email: users.email }).from(users).where(sql`lower(${users.email}) = ${emailKey}`);
  if (!user) return "no-account";
  const token = createSecretToken();
  await db.transaction(async (tx) => {
    await tx.update(passwordResets).set({ usedAt: sql`now()` }).where(and(eq(passwordResets.userId, user.id), isNull(passwordResets.usedAt)));
    await tx.insert(passwordResets).values({
      id: createId("rst"),
      userId: user.id,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + RESET_TTL_MINUTES * 60_000),
    });
  });
  await sendMail(buildPasswordResetMail({ to: user.email, url: `${getEnv().APP_URL}/reset-password/${token}`, expiresInMinutes: RESET_TTL_MINUTES }));
  return "sent";
}

export async function isResetTokenOpen(token: string): Promise<boolean> {
  const [row] = await getDb()
    .select({ id: passwordResets.id })
    .from(passwordResets)
    .where(and(eq(passwordResets.tokenHash, hashToken(token)), isNull(passwordResets.usedAt), sql`${passwordResets.expiresAt} > now()`));
  return !!row;
}

/**
 * Sets the new password once per link and signs out every session issued before. The password is
 * hashed only for a link that checks out, so a stream of made-up tokens costs a lookup each.
 */
export async function resetPassword(token: string, password: string, clientAddress: string): Promise<void> {
  await assertAttemptsAllowed([{ rule: resetSubmitAddressRule, subject: clientAddress }], "Too many password changes from your network.");
  if (!(await isResetTokenOpen(token))) throw new DomainError("not_found", linkRefused);
  const passwordHash = await hashPassword(password);
  await getDb().transaction(async (tx) => {
    // Checked again under the row lock: of two submissions of one link, only the first applies.
    const [reset] = await tx
      .select()
      .from(passwordResets)
      .where(and(eq(passwordResets.tokenHash, hashToken(token)), isNull(passwordResets.usedAt), sql`${passwordResets.expiresAt} > now()`))
      .for("update");
    if (!reset) throw new DomainError("not_found", linkRefused);
    await tx.update(passwordResets).set({ usedAt: sql`now()`, updatedAt: sql`now()` }).where(eq(passwordResets.id, reset.id));
    await tx.update(users).set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: sql`now()` }).where(eq(users.id, reset.userId));
  });
}
