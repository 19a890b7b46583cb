import { createHash } from "node:crypto";

import { getEnv } from "@/lib/env";
import { DomainError } from "@/lib/server/errors";
import { getRedis, waitForRedis } from "@/lib/server/redis";
import { withTimeout } from "@/lib/server/with-timeout";

const REDIS_TIMEOUT_MS = 500;

/** A fixed-window limit: at most `max` attempts per `windowMs`, counted before the attempt runs. */
export interface ThrottleRule {
  /** Names the counter family in Redis and in logs, e.g. "sign-in:address". */
  name: string;
  max: number;
  windowMs: number;
}

export type ThrottleVerdict = { allowed: true } | { allowed: false; retryAfterSeconds: number };

// INCR and PEXPIRE in one script, so a counter can never be left without an expiry.
const INCREMENT_SCRIPT = `
local count = redis.call('INCR', KEYS[1])
if count == 1 then redis.call('PEXPIRE', KEYS[1], ARGV[1]) end
local ttl = redis.call('PTTL', KEYS[1])
if ttl < 0 then redis.call('PEXPIRE', KEYS[1], ARGV[1]); ttl = tonumber(ARGV[1]) end
return {count, ttl}`;

// Counters are keyed by a hash: e-mail addresses and tokens never sit in Redis as written.
function counterKey(rule: ThrottleRule, subject: string): string {
  const digest = createHash("sha256").update(subject).digest("base64url").slice(0, 32);
  return `${getEnv().REDIS_PREFIX}:throttle:${rule.name}:${digest}`;
}

/**
 * Counts one attempt against the rule in Redis, shared by every web process, and says whether it
 * may run. The count comes first and is atomic, so parallel attempts cannot all slip under the
 * limit. When Redis cannot answer the attempt is let through with a log line: each caller keeps a
 * second guard in PostgreSQL (the account lock) or needs Redis anyway (the mail job).
 */
export async function countAttempt(rule: ThrottleRule, subject: string): Promise<ThrottleVerdict> {
  try {
    const redis = getRedis();
    // The producer connection queues nothing offline: a fresh process waits for it to be ready.
    await waitForRedis(redis, REDIS_TIMEOUT_MS);
    const reply = (await withTimeout(
      redis.eval(INCREMENT_SCRIPT, 1, counterKey(rule, subject), String(rule.windowMs)),
      REDIS_TIMEOUT_MS,
      "throttle counter timed out",
    )) as [number, number];
    const [count, ttlMs] = reply;
    if (count <= rule.max) return { allowed: true };
    return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil(ttlMs / 1000)) };
  } catch (error) {
    console.error(`[sagline] throttle ${rule.name} not counted (${(error as Error).message}); letting the attempt through`);
    return { allowed: true };
  }
}

/** Counts against every rule (each counter moves, so an attacker cannot dodge one by tripping another). */
export async function assertAttemptsAllowed(checks: { rule: ThrottleRule; subject: string }[], message: string): Promise<void> {
  const verdicts = await Promise.all(checks.map(({ rule, subject }) => countAttempt(rule, subject)));
  const refused = verdicts.filter((v): v is Extract<ThrottleVerdict, { allowed: false }> => !v.allowed);
  if (refused.length === 0) return;
  const retryAfterSeconds = Math.max(...refused.map((v) => v.retryAfterSeconds));
  throw new DomainError("rate_limited", `${message} Try again in ${describeWait(retryAfterSeconds)}.`, [], retryAfterSeconds);
}

function describeWait(seconds: number): string {
  if (seconds < 90) return `${seconds} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}
