// Every verification group the /verification page shows (lib/verification/index.ts), held to its
// tolerance: 1e-9 relative error unless a case names its own. Each case's reference value is its
// published formula or table value, with the source named in the case.
import { describe, expect, it } from "vitest";

import { runCases, type ClosedFormCase } from "@/lib/verification/closed-form-cases";
import { runVerificationGroups, VERIFICATION_GROUPS } from "@/lib/verification";

describe("the verification groups", () => {
  it("have unique ids, titles and at least one case each", () => {
    expect(new Set(VERIFICATION_GROUPS.map((g) => g.id)).size).toBe(VERIFICATION_GROUPS.length);
    for (const group of VERIFICATION_GROUPS) {
      expect(group.title.length, group.id).toBeGreaterThan(5);
      expect(group.cases.length, group.id).toBeGreaterThan(0);
    }
  });

  const cases = runVerificationGroups().flatMap((group) => group.cases.map((c) => [`${group.id}/${c.id}`, c] as const));

  it.each(cases)("%s agrees with its reference value", (_id, c) => {
    expect(Number.isFinite(c.computed)).toBe(true);
    expect(c.relativeError).toBeLessThanOrEqual(c.allowedRelativeError);
    expect(c.withinTolerance).toBe(true);
  });

  it.each(cases)("%s names its source and formula", (_id, c) => {
    expect(c.source.length).toBeGreaterThan(10);
    expect(c.formula.length).toBeGreaterThan(0);
    // A recalled value says so; a trade fact without a source says "common practice".
    expect(c.source).toMatch(/from memory|common practice|\d/);
  });

  it("case ids are unique across all groups", () => {
    const ids = VERIFICATION_GROUPS.flatMap((g) => g.cases.map((c) => c.id));
    expect(new Set(ids).size).toBe(ids.length);
  });

  it("a case beyond its tolerance is reported as such (the check can fail)", () => {
    const wrong: ClosedFormCase = { id: "x", title: "x", quantity: "x", formula: "x", source: "x", expected: 1, unit: "mm", compute: () => 1.001 };
    const [verified] = runCases([wrong, { ...wrong, tolerance: 0.01 }]);
    expect(verified?.withinTolerance).toBe(false);
    expect(runCases([{ ...wrong, tolerance: 0.01 }])[0]?.withinTolerance).toBe(true);
  });
});
