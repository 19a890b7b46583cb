import { eq, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { signInThrottles, users } from "@/db/schema";
import { getEnv } from "@/lib/env";

import { verifyPassword } from "./passwords";

export type SignInOutcome =
  | { ok: true; userId: string; sessionVersion: number }
  | { ok: false; reason: "invalid" | "locked" };

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/**
 * Verifies e-mail and password with a per-account throttle. Unknown accounts are throttled and
 * timed exactly like known ones, so neither the answer nor its timing tells whether an e-mail exists.
 */
export async function signInWithPassword(email: string, password: string): Promise<SignInOutcome> {
  const env = getEnv();
  const emailKey = normaliseEmail(email).slice(0, 320);
  const db = getDb();
  const [throttle] = await db.select().from(signInThrottles).where(eq(signInThrottles.emailKey, emailKey));
  if (throttle?.lockedUntil && throttle.lockedUntil > new Date()) return { ok: false, reason: "locked" };

  const [user] = await db
    .select({ id: users.id, passwordHash: users.passwordHash, sessionVersion: users.sessionVersion })
    .from(users)
    .where(sql`lower(${users.email}) = ${emailKey}`);
  const valid = await verifyPassword(user?.passwordHash ?? null, password);
  if (valid && user) {
    if (throttle) await db.delete(signInThrottles).where(eq(signInThrottles.emailKey, emailKey));
    return { ok: true, userId: user.id, sessionVersion: user.sessionVersion };
  }

  // Failures count within a rolling window; reaching the limit locks the account for a while.
  const windowMs = env.SIGN_IN_LOCK_MINUTES * 60_000;
  await db
    .insert(signInThrottles)
    .values({ emailKey, failures: 1 })
    .onConflictDoUpdate({
      target: signInThrottles.emailKey,
      set: {
        failures: sql`case when ${signInThrottles.windowStartedAt} < now() - ${`${windowMs} milliseconds`}::interval then 1 else ${signInThrottles.failures} + 1 end`,
        windowStartedAt: sql`case when ${signInThrottles.windowStartedAt} < now() - ${`${windowMs} milliseconds`}::interval then now() else ${signInThrottles.windowStartedAt} end`,
        updatedAt: sql`now()`,
      },
    });
  await db
    .update(signInThrottles)
    .set({ lockedUntil: sql`now() + ${`${windowMs} milliseconds`}::interval`, failures: 0, windowStartedAt: sql`now()` })
    .where(sql`${signInThrottles.emailKey} = ${emailKey} and ${signInThrottles.failures} >= ${env.SIGN_IN_MAX_FAILURES}`);
  return { ok: false, reason: "invalid" };
}
