import { and, eq, isNull, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { passwordResets, users } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { DomainError } from "@/lib/server/errors";
import { createId, createSecretToken, hashToken } from "@/lib/server/ids";
import { sendMail } from "@/lib/server/mail/send-mail";
import { buildPasswordResetMail } from "@/lib/server/mail/templates";

import { hashPassword } from "./passwords";
import { normaliseEmail } from "./sign-in";

export const RESET_TTL_MINUTES = 60;

/** Sends a reset link when the account exists; the caller answers the same either way. */
export async function requestPasswordReset(email: string): Promise<void> {
  const db = getDb();
  const [user] = await db.select({ id: users.id, email: users.email }).from(users).where(sql`lower(${users.email}) = ${normaliseEmail(email)}`);
  if (!user) return;
  const token = createSecretToken();
  await db.transaction(async (tx) => {
    // Only the newest link works.
    await tx.update(passwordResets).set({ usedAt: sql`now()` }).where(and(eq(passwordResets.userId, user.id), isNull(passwordResets.usedAt)));
    await tx.insert(passwordResets).values({
      id: createId("rst"),
      userId: user.id,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + RESET_TTL_MINUTES * 60_000),
    });
  });
  await sendMail(buildPasswordResetMail({ to: user.email, url: `${getEnv().APP_URL}/reset-password/${token}`, expiresInMinutes: RESET_TTL_MINUTES }));
}

export async function isResetTokenOpen(token: string): Promise<boolean> {
  const [row] = await getDb()
    .select({ id: passwordResets.id })
    .from(passwordResets)
    .where(and(eq(passwordResets.tokenHash, hashToken(token)), isNull(passwordResets.usedAt), sql`${passwordResets.expiresAt} > now()`));
  return !!row;
}

/** Sets the new password once per link and signs out every session issued before. */
export async function resetPassword(token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await getDb().transaction(async (tx) => {
    const [reset] = await tx
      .select()
      .from(passwordResets)
      .where(and(eq(passwordResets.tokenHash, hashToken(token)), isNull(passwordResets.usedAt), sql`${passwordResets.expiresAt} > now()`))
      .for("update");
    if (!reset) throw new DomainError("not_found", "This reset link has expired or was already used. Ask for a new one.");
    await tx.update(passwordResets).set({ usedAt: sql`now()`, updatedAt: sql`now()` }).where(eq(passwordResets.id, reset.id));
    await tx.update(users).set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: sql`now()` }).where(eq(users.id, reset.userId));
  });
}
