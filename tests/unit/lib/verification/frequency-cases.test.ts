// The frequency and minimum-I cases of the verification page, each held to its own tolerance
// (closed forms 1e-9, converged eigenvalues 0.1 %, minimum I 1e-8). Expected values and their
// sources are in the case list (lib/verification/frequency-cases.ts), recalled from memory of
// those publications.
import { describe, expect, it } from "vitest";

import { frequencyCases } from "@/lib/verification/frequency-cases";

describe("the frequency verification cases", () => {
  it.each(frequencyCases.map((c) => [c.id, c] as const))("%s agrees with its formula", (_id, c) => {
    const computed = c.compute();
    expect(Number.isFinite(computed)).toBe(true);
    expect(Math.abs(computed - c.expected) / Math.abs(c.expected)).toBeLessThanOrEqual(c.tolerance ?? 1e-9);
    // a frequency never above the reference (the safe side), a minimum I never below it
    if (c.unit === "Hz") expect(computed).toBeLessThanOrEqual(c.expected * (1 + 1e-9));
    if (c.unit === "mm^4") expect(computed).toBeGreaterThanOrEqual(c.expected * (1 - 1e-12));
  });

  it("names a source and a unit for every case, with unique ids", () => {
    for (const c of frequencyCases) {
      expect(c.source.length).toBeGreaterThan(10);
      expect(["Hz", "mm^4"]).toContain(c.unit);
    }
    expect(new Set(frequencyCases.map((c) => c.id)).size).toBe(frequencyCases.length);
  });
});
