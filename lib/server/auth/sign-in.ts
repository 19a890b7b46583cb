import { eq, sql } from "drizzle-orm";

import { getDb, getSql } from "@/db/client";
import { signInThrottles, users } from "@/db/schema";
import { getEnv } from "@/lib/env";

import { verifyPassword } from "./passwords";
import { countAttempt } from "./throttle";
import { signInAddressRule } from "./throttle-rules";

export type SignInOutcome =
  | { ok: true; userId: string; sessionVersion: number }
  | { ok: false; reason: "invalid" | "locked" | "throttled" };

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/**
 * Counts this attempt against the account before the password is looked at, in one statement, so
 * parallel guesses queue on the row and at most SIGN_IN_MAX_FAILURES of them per window reach the
 * password check; the next one starts a lock of SIGN_IN_LOCK_MINUTES. A success clears the row,
 * so `failures` counts the attempts since the last success. True when this attempt may proceed.
 */
async function countAccountAttempt(emailKey: string): Promise<boolean> {
  const env = getEnv();
  const window = `${env.SIGN_IN_LOCK_MINUTES} minutes`;
  const [row] = await getSql()`
    insert into sign_in_throttles as t (email_key, failures, window_started_at)
    values (${emailKey}, 1, now())
    on conflict (email_key) do update set
      failures = case
        when t.locked_until > now() then t.failures
        when t.locked_until is not null or t.window_started_at < now() - ${window}::interval then 1
        else t.failures + 1 end,
      window_started_at = case
        when t.locked_until > now() then t.window_started_at
        when t.locked_until is not null or t.window_started_at < now() - ${window}::interval then now()
        else t.window_started_at end,
      locked_until = case
        when t.locked_until > now() then t.locked_until
        when t.locked_until is null and t.window_started_at >= now() - ${window}::interval and t.failures + 1 > ${env.SIGN_IN_MAX_FAILURES}
          then now() + ${window}::interval
        else null end,
      updated_at = now()
    returning coalesce(locked_until > now(), false) as locked`;
  return !row!.locked;
}

/**
 * Verifies e-mail and password behind two throttles, both counted before the password check: per
 * client address in Redis (shared by every web process) and per account in PostgreSQL. Unknown
 * accounts are counted and timed exactly like known ones, so neither the answer nor its timing
 * tells whether an e-mail exists.
 */
export async function signInWithPassword(email: string, password: string, clientAddress: string): Promise<SignInOutcome> {
  const emailKey = normaliseEmail(email).slice(0, 320);
  const address = await countAttempt(signInAddressRule(), clientAddress);
  if (!address.allowed) return { ok: false, reason: "throttled" };
  if (!(await countAccountAttempt(emailKey))) return { ok: false, reason: "locked" };

  const db = getDb();
  const [user] = await db
    .select({ id: users.id, passwordHash: users.passwordHash, sessionVersion: users.sessionVersion })
    .from(users)
    .where(sql`lower(${users.email}) = ${emailKey}`);
  const valid = await verifyPassword(user?.passwordHash ?? null, password);
  if (!valid || !user) return { ok: false, reason: "invalid" };
  await db.delete(signInThrottles).where(eq(signInThrottles.emailKey, emailKey));
  return { ok: true, userId: user.id, sessionVersion: user.sessionVersion };
}
