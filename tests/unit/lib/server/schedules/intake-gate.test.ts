// The intake budget (issue 13): reservations sized from the declared length; beyond the budget a
// submission is refused with 503 and Retry-After before anything runs.
import { describe, expect, it } from "vitest";

import { DomainError } from "@/lib/server/errors";
import { computeIntakeReservationBytes, DEFAULT_INTAKE_MEMORY_MB, MAX_SCHEDULE_BODY_BYTES, withIntakePermit } from "@/lib/server/schedules/intake-gate";

const MiB = 1024 * 1024;
const post = (bytes: number | null) => new Request("http://127.0.0.1/api/v1/schedules", { method: "POST", headers: bytes === null ? {} : { "content-length": String(bytes) } });

describe("computeIntakeReservationBytes", () => {
  it("reserves 2x the largest body plus 64 MiB of bookkeeping and 1 MiB, and the same without a declared length", () => {
    expect(computeIntakeReservationBytes(MAX_SCHEDULE_BODY_BYTES)).toBe(2 * MAX_SCHEDULE_BODY_BYTES + 65 * MiB);
    expect(computeIntakeReservationBytes(null)).toBe(computeIntakeReservationBytes(MAX_SCHEDULE_BODY_BYTES));
  });
  it("reserves 6x a small body plus 1 MiB", () => {
    expect(computeIntakeReservationBytes(10_000)).toBe(60_000 + MiB);
  });
});

describe("withIntakePermit (default budget)", () => {
  it("runs two of the largest at once, refuses a third with 503 and Retry-After, and runs it once one is done", async () => {
    expect(DEFAULT_INTAKE_MEMORY_MB).toBe(512);
    const releases: (() => void)[] = [];
    const hold = () => new Promise<void>((resolve) => releases.push(resolve));
    const first = withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), hold);
    const second = withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), hold);
    const refused = await withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), async () => "ran").catch((error: unknown) => error);
    expect(refused).toBeInstanceOf(DomainError);
    expect(refused).toMatchObject({ code: "unavailable", retryAfterSeconds: 5 });
    // Small submissions still fit beside the two.
    await expect(withIntakePermit(post(20_000), async () => "small")).resolves.toBe("small");
    releases.forEach((release) => release());
    await Promise.all([first, second]);
    await expect(withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), async () => "ran")).resolves.toBe("ran");
  });

  it("gives the reservation back when the submission fails", async () => {
    await expect(withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), async () => Promise.reject(new Error("bad body")))).rejects.toThrow("bad body");
    const both = [withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), async () => 1), withIntakePermit(post(MAX_SCHEDULE_BODY_BYTES), async () => 2)];
    await expect(Promise.all(both)).resolves.toEqual([1, 2]);
  });
});
