import { z } from "zod";

import { getEnv } from "@/lib/env";
import { DomainError } from "@/lib/server/errors";
import { getRedis } from "@/lib/server/redis";
import { withTimeout } from "@/lib/server/with-timeout";

/**
 * Fixed one-minute windows per API key and per organization, counted in Redis (INCR + PEXPIRE).
 * When Redis cannot answer, requests are let through (fail-open) with a log line: the key check
 * itself runs against PostgreSQL, so an outage of the counters only removes throttling for a while.
 */
export const RATE_LIMIT_WINDOW_MS = 60_000;
const REDIS_TIMEOUT_MS = 250;

const limitsSchema = z.object({
  API_RATE_LIMIT_PER_KEY: z.coerce.number().int().positive().default(600),
  API_RATE_LIMIT_PER_ORGANIZATION: z.coerce.number().int().positive().default(1200),
});

export interface RateLimits {
  perKeyPerMinute: number;
  perOrganizationPerMinute: number;
}

let cachedLimits: RateLimits | undefined;

/** Limits from API_RATE_LIMIT_PER_KEY and API_RATE_LIMIT_PER_ORGANIZATION (requests per minute). */
export function getRateLimits(): RateLimits {
  if (cachedLimits) return cachedLimits;
  const parsed = limitsSchema.safeParse(process.env);
  if (!parsed.success) throw new Error(`Invalid rate limit settings: ${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`);
  cachedLimits = { perKeyPerMinute: parsed.data.API_RATE_LIMIT_PER_KEY, perOrganizationPerMinute: parsed.data.API_RATE_LIMIT_PER_ORGANIZATION };
  return cachedLimits;
}

/** The Redis counters a request at nowMs counts against, and when their window ends. */
export function getRateLimitCounters(prefix: string, who: { apiKeyId: string; organizationId: string }, nowMs: number) {
  const window = Math.floor(nowMs / RATE_LIMIT_WINDOW_MS);
  return {
    keyCounter: `${prefix}:rate:key:${who.apiKeyId}:${window}`,
    organizationCounter: `${prefix}:rate:org:${who.organizationId}:${window}`,
    windowEndsAtMs: (window + 1) * RATE_LIMIT_WINDOW_MS,
  };
}

/** Increments each counter and returns the new counts; counters expire with their window. */
export type IncrementCounters = (counters: string[], ttlMs: number) => Promise<number[]>;

export const incrementRedisCounters: IncrementCounters = async (counters, ttlMs) => {
  const pipeline = getRedis().multi();
  for (const counter of counters) pipeline.incr(counter).pexpire(counter, ttlMs);
  const results = (await pipeline.exec()) ?? [];
  return counters.map((_, i) => {
    const [error, value] = results[i * 2] ?? [new Error("no reply"), null];
    if (error) throw error;
    return Number(value);
  });
};

export interface RateLimitDecision {
  limit: number;
  remaining: number;
  resetSeconds: number;
  /** false when Redis did not answer and the request was let through. */
  counted: boolean;
}

let lastFailOpenLogMs = 0;

function logFailOpen(error: unknown, nowMs: number): void {
  // One line per 30 s is enough to notice an outage without flooding the log under load.
  if (nowMs - lastFailOpenLogMs < 30_000) return;
  lastFailOpenLogMs = nowMs;
  console.warn(`[sagline] API rate limiting skipped (fail-open): Redis unavailable: ${error instanceof Error ? error.message : String(error)}`);
}

/** Counts the request; throws rate_limited (429, Retry-After) when the key or its organization is over its limit. */
export async function assertWithinRateLimit(
  who: { apiKeyId: string; organizationId: string },
  options: { nowMs?: number; limits?: RateLimits; prefix?: string; increment?: IncrementCounters } = {},
): Promise<RateLimitDecision> {
  const nowMs = options.nowMs ?? Date.now();
  const limits = options.limits ?? getRateLimits();
  const { keyCounter, organizationCounter, windowEndsAtMs } = getRateLimitCounters(options.prefix ?? getEnv().REDIS_PREFIX, who, nowMs);
  const resetSeconds = Math.max(1, Math.ceil((windowEndsAtMs - nowMs) / 1000));
  let counts: number[];
  try {
    counts = await withTimeout((options.increment ?? incrementRedisCounters)([keyCounter, organizationCounter], RATE_LIMIT_WINDOW_MS * 2), REDIS_TIMEOUT_MS, `no answer within ${REDIS_TIMEOUT_MS} ms`);
  } catch (error) {
    logFailOpen(error, nowMs);
    return { limit: limits.perKeyPerMinute, remaining: limits.perKeyPerMinute, resetSeconds, counted: false };
  }
  const [keyCount = 0, organizationCount = 0] = counts;
  if (keyCount > limits.perKeyPerMinute) {
    throw new DomainError("rate_limited", `This API key is over its limit of ${limits.perKeyPerMinute} requests a minute; retry after ${resetSeconds} s.`, [], resetSeconds);
  }
  if (organizationCount > limits.perOrganizationPerMinute) {
    throw new DomainError(
      "rate_limited",
      `This organization's API keys together are over their limit of ${limits.perOrganizationPerMinute} requests a minute; retry after ${resetSeconds} s.`,
      [],
      resetSeconds,
    );
  }
  return { limit: limits.perKeyPerMinute, remaining: Math.max(0, limits.perKeyPerMinute - keyCount), resetSeconds, counted: true };
}
