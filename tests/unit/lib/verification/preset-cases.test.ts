// The preset verification cases (lib/verification/preset-cases.ts) held to the engine's promise:
// each case's expected value is the cited clause's rule written out with the handbook deflection,
// sources named in the case list, recalled from memory of those publications.
import { describe, expect, it } from "vitest";

import { closedFormCases } from "@/lib/verification/closed-form-cases";
import { presetCases } from "@/lib/verification/preset-cases";

describe("the preset verification cases", () => {
  it.each(presetCases.map((c) => [c.id, c] as const))("%s agrees with its clause", (_id, c) => {
    const computed = c.compute();
    expect(Number.isFinite(computed)).toBe(true);
    expect(Math.abs(computed - c.expected)).toBeLessThanOrEqual(1e-9 * Math.abs(c.expected));
  });

  it("names a source for every case, and no id repeats a closed-form case's", () => {
    for (const c of presetCases) expect(c.source.length).toBeGreaterThan(10);
    const ids = [...presetCases, ...closedFormCases].map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it("distinguishes the rules it verifies: the cases' expected values are not all one number", () => {
    expect(new Set(presetCases.map((c) => c.expected.toPrecision(9))).size).toBeGreaterThan(8);
  });
});
