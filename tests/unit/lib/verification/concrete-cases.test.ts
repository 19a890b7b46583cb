// The reinforced concrete cases the verification page shows, held to the engine's promise:
// relative error <= 1e-9 against the formulas written out in lib/verification/concrete-cases.ts
// (PCA Notes on ACI 318 Table 8-2; ACI 318-19 24.2.3.5, Table 24.2.3.5, 24.2.4.1.1; all from memory).
import { describe, expect, it } from "vitest";

import { concreteCases } from "@/lib/verification/concrete-cases";

describe("the reinforced concrete verification cases", () => {
  it.each(concreteCases.map((c) => [c.id, c] as const))("%s agrees with its formula", (_id, c) => {
    const computed = c.compute();
    expect(Number.isFinite(computed)).toBe(true);
    expect(Math.abs(computed - c.expected) / Math.abs(c.expected)).toBeLessThanOrEqual(1e-9);
  });

  it("names a source for every case, and the ids are unique", () => {
    for (const c of concreteCases) expect(c.source.length).toBeGreaterThan(10);
    expect(new Set(concreteCases.map((c) => c.id)).size).toBe(concreteCases.length);
  });

  it("the cracked deflection exceeds the gross-section one (the point of the rule)", () => {
    const total = concreteCases.find((c) => c.id === "rc-deflection-total")!;
    expect(total.expected).toBeGreaterThan((5 * 25 * 6000 ** 4) / (384 * 4700 * Math.sqrt(30) * ((300 * 500 ** 3) / 12)));
  });
});
