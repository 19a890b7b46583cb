import { afterEach, describe, expect, it, vi } from "vitest";

import { assertWithinRateLimit, getRateLimitCounters, RATE_LIMIT_WINDOW_MS, type IncrementCounters } from "@/app/api/v1/_lib/rate-limit";
import { DomainError } from "@/lib/server/errors";

const who = { apiKeyId: "key_a", organizationId: "org_a" };
const limits = { perKeyPerMinute: 3, perOrganizationPerMinute: 5 };

// An in-memory stand-in for Redis INCR with the same counter names.
function createCounters() {
  const counts = new Map<string, number>();
  const increment: IncrementCounters = async (names) => names.map((n) => {
    const next = (counts.get(n) ?? 0) + 1;
    counts.set(n, next);
    return next;
  });
  return { counts, increment };
}

afterEach(() => vi.restoreAllMocks());

describe("rate limit windows", () => {
  it("count per key and per organization in one-minute windows", () => {
    const a = getRateLimitCounters("p", who, 120_000);
    expect(a).toEqual({ keyCounter: "p:rate:key:key_a:2", organizationCounter: "p:rate:org:org_a:2", windowEndsAtMs: 180_000 });
    expect(getRateLimitCounters("p", who, 179_999).keyCounter).toBe(a.keyCounter);
    expect(getRateLimitCounters("p", who, 180_000).keyCounter).toBe("p:rate:key:key_a:3");
  });

  it("lets requests through up to the per-key limit, then answers 429 with the seconds left in the window", async () => {
    const { increment } = createCounters();
    const nowMs = 10 * RATE_LIMIT_WINDOW_MS + 45_500;
    for (let i = 0; i < limits.perKeyPerMinute; i++) {
      const decision = await assertWithinRateLimit(who, { nowMs, limits, prefix: "p", increment });
      expect(decision.remaining).toBe(limits.perKeyPerMinute - i - 1);
    }
    const error = await assertWithinRateLimit(who, { nowMs, limits, prefix: "p", increment }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(DomainError);
    expect((error as DomainError).code).toBe("rate_limited");
    // 60 s window, 45.5 s gone: 14.5 s left, rounded up.
    expect((error as DomainError).retryAfterSeconds).toBe(15);
    // The next window starts afresh.
    await expect(assertWithinRateLimit(who, { nowMs: 11 * RATE_LIMIT_WINDOW_MS, limits, prefix: "p", increment })).resolves.toMatchObject({ counted: true });
  });

  it("limits the organization's keys together", async () => {
    const { increment } = createCounters();
    const nowMs = 5 * RATE_LIMIT_WINDOW_MS;
    for (let i = 0; i < limits.perOrganizationPerMinute; i++) {
      await assertWithinRateLimit({ apiKeyId: `key_${i}`, organizationId: "org_a" }, { nowMs, limits, prefix: "p", increment });
    }
    const error = await assertWithinRateLimit({ apiKeyId: "key_new", organizationId: "org_a" }, { nowMs, limits, prefix: "p", increment }).catch((e: unknown) => e);
    expect((error as DomainError).code).toBe("rate_limited");
    expect((error as DomainError).message).toContain("organization");
    // Another organization is not affected.
    await expect(assertWithinRateLimit({ apiKeyId: "key_b", organizationId: "org_b" }, { nowMs, limits, prefix: "p", increment })).resolves.toMatchObject({ counted: true });
  });

  it("fails open with a log line when Redis errors", async () => {
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const increment: IncrementCounters = async () => {
      throw new Error("Connection is closed.");
    };
    const decision = await assertWithinRateLimit(who, { nowMs: 1e12, limits, prefix: "p", increment });
    expect(decision.counted).toBe(false);
    expect(warn).toHaveBeenCalledWith(expect.stringContaining("fail-open"));
  });

  it("fails open when Redis does not answer within its timeout", async () => {
    vi.spyOn(console, "warn").mockImplementation(() => {});
    const increment: IncrementCounters = () => new Promise(() => {});
    const started = Date.now();
    const decision = await assertWithinRateLimit(who, { nowMs: 2e12, limits, prefix: "p", increment });
    expect(decision.counted).toBe(false);
    expect(Date.now() - started).toBeLessThan(2_000);
  });
});
