/**
 * The published retry schedule (README, Webhooks): the first attempt at once, then retries after
 * these delays, each with +/-20 % jitter so many failing deliveries do not retry in lock-step.
 * 9 attempts over about 10 h 43 min in total, before the delivery is given up ("dead").
 */
export const RETRY_DELAYS_MS = [5_000, 30_000, 120_000, 600_000, 1_800_000, 3_600_000, 10_800_000, 21_600_000] as const;

export const MAX_ATTEMPTS_PER_ROUND = RETRY_DELAYS_MS.length + 1;

/** A receiver's Retry-After is honoured up to this much. */
export const MAX_RETRY_AFTER_MS = 24 * 3_600_000;

const JITTER = 0.2;

/**
 * The wait before the next attempt after `attemptsMade` failed attempts in this round, or null when
 * the schedule is exhausted. `random` is in [0, 1); `scale` shortens the schedule (tests); a
 * Retry-After from the receiver (already in ms, unscaled) is a floor, not a replacement.
 */
export function computeRetryDelayMs(input: { attemptsMade: number; scale: number; random: number; retryAfterMs?: number }): number | null {
  const base = RETRY_DELAYS_MS[input.attemptsMade - 1];
  if (base === undefined || input.attemptsMade < 1) return null;
  const jittered = base * input.scale * (1 - JITTER + 2 * JITTER * input.random);
  const floor = input.retryAfterMs === undefined ? 0 : Math.min(input.retryAfterMs, MAX_RETRY_AFTER_MS);
  return Math.max(Math.round(jittered), floor);
}

/** RFC 9110 Retry-After: delay-seconds or an HTTP-date. Anything else is ignored (undefined). */
export function parseRetryAfterMs(value: string | undefined, now: Date): number | undefined {
  if (!value) return undefined;
  const trimmed = value.trim();
  if (/^\d+$/.test(trimmed)) return Number(trimmed) * 1000;
  const at = Date.parse(trimmed);
  if (Number.isNaN(at) || !/[a-z]/i.test(trimmed)) return undefined;
  return Math.max(0, at - now.getTime());
}

export type ResponseClass = "success" | "gone" | "retry";

/** 2xx succeeds; 410 Gone disables the endpoint; everything else (3xx included: redirects are not followed) is retried. */
export function classifyStatus(statusCode: number): ResponseClass {
  if (statusCode >= 200 && statusCode < 300) return "success";
  if (statusCode === 410) return "gone";
  return "retry";
}
