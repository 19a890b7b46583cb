import { getEnv } from "@/lib/env";

import type { ThrottleRule } from "./throttle";

const MINUTE_MS = 60_000;

/** Sign-in attempts from one client address, over every account (the per-account lock is in PostgreSQL). */
export function signInAddressRule(): ThrottleRule {
  const env = getEnv();
  return { name: "sign-in:address", max: env.SIGN_IN_MAX_PER_ADDRESS, windowMs: env.SIGN_IN_LOCK_MINUTES * MINUTE_MS };
}

/** Reset requests: a few per address an hour (mail bombing), and per client address. */
export const resetRequestEmailRule: ThrottleRule = { name: "reset:email", max: 3, windowMs: 60 * MINUTE_MS };
export const resetRequestAddressRule: ThrottleRule = { name: "reset:address", max: 20, windowMs: 60 * MINUTE_MS };

/** New-password submissions per client address (each one hashes a password). */
export const resetSubmitAddressRule: ThrottleRule = { name: "reset-submit:address", max: 20, windowMs: 15 * MINUTE_MS };

/** Acceptances per invitation link (an existing account proves itself with its password) and per address. */
export const invitationTokenRule: ThrottleRule = { name: "invitation:token", max: 5, windowMs: 15 * MINUTE_MS };
export const invitationAddressRule: ThrottleRule = { name: "invitation:address", max: 20, windowMs: 15 * MINUTE_MS };
