// The pattern-loading cases the verification page shows, held to the engine's promise: relative
// error <= 1e-9 against each case's closed form (sources named in lib/verification/pattern-cases.ts).
import { describe, expect, it } from "vitest";

import { patternCases } from "@/lib/verification/pattern-cases";

describe("the pattern-loading verification cases", () => {
  it.each(patternCases.map((c) => [c.id, c] as const))("%s agrees with its closed form", (_id, c) => {
    const computed = c.compute();
    expect(Number.isFinite(computed)).toBe(true);
    expect(Math.abs(computed - c.expected) / Math.abs(c.expected)).toBeLessThanOrEqual(1e-9);
  });

  it("the two-span case is the handbook's 0.0092 w L^4 / EI, to its printed precision", () => {
    const c = patternCases.find((x) => x.id === "pattern-two-span-one-loaded")!;
    expect(c.expected / ((10 * 6000 ** 4) / (200_000 * 8.0e7))).toBeCloseTo(0.0092, 3);
  });

  it("names a source for every case", () => {
    for (const c of patternCases) expect(c.source.length).toBeGreaterThan(10);
  });
});
