import { describe, expect, it } from "vitest";

import { classifyStatus, computeRetryDelayMs, MAX_ATTEMPTS_PER_ROUND, parseRetryAfterMs, RETRY_DELAYS_MS } from "@/lib/server/webhooks/retry-schedule";

describe("the published retry schedule", () => {
  it("is 5 s, 30 s, 2 min, 10 min, 30 min, 1 h, 3 h, 6 h after attempts 1 to 8 (README, Webhooks)", () => {
    expect(RETRY_DELAYS_MS).toEqual([5e3, 30e3, 2 * 60e3, 10 * 60e3, 30 * 60e3, 3_600e3, 3 * 3_600e3, 6 * 3_600e3]);
    expect(MAX_ATTEMPTS_PER_ROUND).toBe(9);
    // Middle of the jitter band (random = 0.5) gives the base delay exactly.
    expect(computeRetryDelayMs({ attemptsMade: 1, scale: 1, random: 0.5 })).toBe(5_000);
    expect(computeRetryDelayMs({ attemptsMade: 8, scale: 1, random: 0.5 })).toBe(21_600_000);
    expect(computeRetryDelayMs({ attemptsMade: 9, scale: 1, random: 0.5 })).toBeNull();
    expect(computeRetryDelayMs({ attemptsMade: 0, scale: 1, random: 0.5 })).toBeNull();
  });

  it("jitters by +/-20 %", () => {
    expect(computeRetryDelayMs({ attemptsMade: 2, scale: 1, random: 0 })).toBe(24_000);
    expect(computeRetryDelayMs({ attemptsMade: 2, scale: 1, random: 0.999999 })).toBe(36_000);
  });

  it("scales for tests and takes Retry-After as a floor, capped at 24 h", () => {
    expect(computeRetryDelayMs({ attemptsMade: 3, scale: 0.001, random: 0.5 })).toBe(120);
    expect(computeRetryDelayMs({ attemptsMade: 1, scale: 0.001, random: 0.5, retryAfterMs: 2_000 })).toBe(2_000);
    expect(computeRetryDelayMs({ attemptsMade: 3, scale: 1, random: 0.5, retryAfterMs: 1_000 })).toBe(120_000);
    expect(computeRetryDelayMs({ attemptsMade: 1, scale: 1, random: 0.5, retryAfterMs: 10 * 86_400_000 })).toBe(86_400_000);
  });

  it("reads Retry-After as seconds or an HTTP-date (RFC 9110 section 10.2.3), ignoring anything else", () => {
    const now = new Date("2026-12-01T12:00:00Z");
    expect(parseRetryAfterMs("120", now)).toBe(120_000);
    expect(parseRetryAfterMs("Tue, 01 Dec 2026 12:00:30 GMT", now)).toBe(30_000);
    expect(parseRetryAfterMs("Tue, 01 Dec 2026 11:00:00 GMT", now)).toBe(0);
    expect(parseRetryAfterMs("-5", now)).toBeUndefined();
    expect(parseRetryAfterMs("soon", now)).toBeUndefined();
    expect(parseRetryAfterMs(undefined, now)).toBeUndefined();
  });

  it("treats 2xx as success, 410 as gone and everything else, redirects included, as a retry", () => {
    expect([200, 201, 204, 299].map(classifyStatus)).toEqual(["success", "success", "success", "success"]);
    expect(classifyStatus(410)).toBe("gone");
    expect([301, 302, 307, 308, 400, 401, 404, 429, 500, 503].map(classifyStatus)).toEqual(Array(10).fill("retry"));
  });
});
