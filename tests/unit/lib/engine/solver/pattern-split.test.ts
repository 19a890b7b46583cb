/**
 * Per-span parts of a variable case: superposition (linear elastic theory) says the parts sum to
 * the whole case, anywhere along the member, and a load that straddles a support is split there.
 */
import { describe, expect, it } from "vitest";
import { createCaseFactors, deflectionAt, solveMember } from "../../../../../lib/engine/solver";
import type { Member } from "../../../../../lib/engine/model";
import { createMember, createSpans, createSupports } from "./fixtures";

const member: Member = createMember(createSpans([4000, 5000, 1500]), createSupports("pinned", "roller", "spring", "free"), [
  { kind: "uniform", loadCase: "live", wNPerMm: 6, startMm: 2500, endMm: 9800 },
  { kind: "point", loadCase: "live", atMm: 4000, pN: 8000 },
  { kind: "linear", loadCase: "live", startMm: 0, endMm: 10500, wStartNPerMm: 1, wEndNPerMm: 4 },
  { kind: "uniform", loadCase: "dead", wNPerMm: 2 },
]);

describe("solveMember with a pattern split", () => {
  const whole = solveMember(member);
  const split = solveMember(member, { cases: new Set(["live"]), groupOfSpan: [0, 1, 2] });

  it("solves live once per span group it reaches, dead whole", () => {
    expect(split.caseNames.filter((name) => name === "live")).toHaveLength(3);
    expect(split.casePatternGroup.filter((group) => group >= 0).sort()).toEqual([0, 1, 2]);
    expect(split.casePatternGroup[split.caseNames.indexOf("dead")]).toBe(-1);
  });

  it("the parts sum to the whole case everywhere", () => {
    const wholeFactors = createCaseFactors(whole, { live: 1, dead: 1 });
    const splitFactors = createCaseFactors(split, { live: 1, dead: 1 });
    for (let x = 0; x <= 10500; x += 175) {
      const expected = deflectionAt(whole, wholeFactors, x);
      expect(Math.abs(deflectionAt(split, splitFactors, x) - expected)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
    }
  });

  it("a point load on a support belongs to the span on its right", () => {
    const onSupport = solveMember(createMember(createSpans([4000, 5000]), createSupports("pinned", "spring", "roller"), [{ kind: "point", loadCase: "live", atMm: 4000, pN: 8000 }]), {
      cases: new Set(["live"]),
      groupOfSpan: [0, 1],
    });
    expect(onSupport.casePatternGroup).toEqual([1]);
  });
});
