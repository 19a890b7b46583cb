// The cases the verification page shows, held to the engine's promise: relative error <= 1e-9.
// Each case's expected value is its handbook formula; sources are named in the case list
// (lib/verification/closed-form-cases.ts), recalled from memory of those publications.
import { describe, expect, it } from "vitest";

import { closedFormCases, runClosedFormCases } from "@/lib/verification/closed-form-cases";

describe("the closed-form verification cases", () => {
  it.each(runClosedFormCases().map((c) => [c.id, c] as const))("%s agrees with its formula", (_id, c) => {
    expect(Number.isFinite(c.computed)).toBe(true);
    expect(c.relativeError).toBeLessThanOrEqual(1e-9);
  });

  it("names a source for every case", () => {
    for (const c of closedFormCases) expect(c.source.length).toBeGreaterThan(10);
  });
});
