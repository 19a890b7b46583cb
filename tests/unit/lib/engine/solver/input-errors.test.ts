/** Bad input and mechanisms give EngineInputError naming the field, never NaN or Infinity. */
import { describe, expect, it } from "vitest";
import type { Load, Member, Support } from "../../../../../lib/engine/model";
import { EngineInputError, collectMemberIssues, solveMember } from "../../../../../lib/engine/solver";
import { createMember, createSpans, createSupports } from "./fixtures";

const uniform: Load = { kind: "uniform", loadCase: "A", wNPerMm: 5 };

function getIssues(member: Member): { path: string; message: string }[] {
  try {
    solveMember(member);
  } catch (error) {
    expect(error).toBeInstanceOf(EngineInputError);
    return (error as EngineInputError).issues;
  }
  throw new Error("expected an EngineInputError");
}

describe("mechanisms and unsupported members", () => {
  it.each<[string, Support[], number]>([
    ["all free", createSupports("free", "free"), 1],
    ["a single roller alone", createSupports("roller", "free"), 1],
    ["a single spring alone", [{ kind: "spring", springNPerMm: 100 }, { kind: "free" }], 1],
    ["one pin under a two-span member", createSupports("free", "pinned", "free"), 2],
  ])("%s is reported on `supports`", (_name, supports, spanCount) => {
    const issues = getIssues(createMember(createSpans(Array(spanCount).fill(3000)), supports, [uniform]));
    expect(issues).toHaveLength(1);
    expect(issues[0]!.path).toBe("supports");
    expect(issues[0]!.message).toMatch(/mechanism|unsupported/);
  });

  it("a free interior node between supports is not a mechanism (the member is continuous)", () => {
    const solution = solveMember(createMember(createSpans([2000, 2000, 2000]), createSupports("pinned", "free", "free", "roller"), [uniform]));
    expect(Array.from(solution.caseStates).every(Number.isFinite)).toBe(true);
  });

  it("one fixed support alone is enough (a cantilever)", () => {
    expect(() => solveMember(createMember(createSpans([3000, 1000]), createSupports("free", "fixed", "free"), [uniform]))).not.toThrow();
  });

  it("a spring softer than 1 N/mm is refused on its own field (input-bounds.ts range, common practice)", () => {
    const member = createMember(createSpans([3000]), [{ kind: "pinned" }, { kind: "spring", springNPerMm: 1e-20 }], [uniform]);
    const issues = getIssues(member);
    expect(issues.map((issue) => issue.path)).toEqual(["supports[1].springNPerMm"]);
    expect(issues[0]!.message).toMatch(/at least 1 N\/mm/);
  });

  it("a spring too soft to register against the beam stiffness is still reported as singular, not NaN", () => {
    // Every value is inside its range, yet a 1 N/mm spring under a 1 mm span with EI = 1e21 N*mm^2
    // restrains the rotation about the pin only below round-off.
    const member = createMember([{ lengthMm: 1, eMpa: 1e6, iMm4: 1e15 }], [{ kind: "pinned" }, { kind: "spring", springNPerMm: 1 }], [uniform]);
    const issues = getIssues(member);
    expect(issues[0]!.path).toMatch(/^supports\[\d\]$/);
    expect(issues[0]!.message).toMatch(/singular/);
  });

  it("a very soft segment is still solved with finite numbers", () => {
    const member = createMember(
      [{ lengthMm: 3000, eMpa: 200000, iMm4: 1e8 }, { lengthMm: 3000, eMpa: 200000, iMm4: 1 }],
      createSupports("fixed", "free", "free"),
      [{ kind: "point", loadCase: "A", atMm: 6000, pN: 1000 }],
    );
    expect(Array.from(solveMember(member).caseStates).every(Number.isFinite)).toBe(true);
  });
});

describe("invalid fields", () => {
  it.each<[string, Partial<Member["spans"][number]>, string]>([
    ["zero length", { lengthMm: 0 }, "spans[0].lengthMm"],
    ["negative E", { eMpa: -200000 }, "spans[0].eMpa"],
    ["zero I", { iMm4: 0 }, "spans[0].iMm4"],
    ["NaN I", { iMm4: Number.NaN }, "spans[0].iMm4"],
    ["infinite length", { lengthMm: Infinity }, "spans[0].lengthMm"],
  ])("%s names the field", (_name, patch, path) => {
    const member = createMember([{ ...createSpans([3000])[0]!, ...patch }], createSupports("pinned", "roller"), [uniform]);
    expect(getIssues(member).map((issue) => issue.path)).toContain(path);
  });

  it("a spring without a positive stiffness names it", () => {
    for (const springNPerMm of [0, -5, undefined, Number.NaN]) {
      const member = createMember(createSpans([3000]), [{ kind: "pinned" }, { kind: "spring", springNPerMm }], [uniform]);
      expect(getIssues(member).map((issue) => issue.path)).toContain("supports[1].springNPerMm");
    }
  });

  it("the support count must match the spans", () => {
    expect(getIssues(createMember(createSpans([3000, 3000]), createSupports("pinned", "roller"), [uniform]))[0]!.path).toBe("supports");
  });

  it("loads outside the member, reversed ranges and non-finite values name the load field", () => {
    const member = createMember(createSpans([3000]), createSupports("pinned", "roller"), [
      { kind: "point", loadCase: "A", atMm: 3500, pN: 10 },
      { kind: "uniform", loadCase: "A", wNPerMm: 2, startMm: 2000, endMm: 1000 },
      { kind: "linear", loadCase: "A", startMm: 0, endMm: 1000, wStartNPerMm: Number.NaN, wEndNPerMm: 1 },
      { kind: "moment", loadCase: "", atMm: 100, mNmm: 5 },
    ]);
    const paths = getIssues(member).map((issue) => issue.path);
    expect(paths).toEqual(expect.arrayContaining(["loads[0].atMm", "loads[1].endMm", "loads[2].wStartNPerMm", "loads[3].loadCase"]));
  });

  it("self-weight without area or density, shear deformation without G or kA", () => {
    const member = createMember(createSpans([3000]), createSupports("pinned", "roller"), [uniform], { selfWeightCase: "dead", includeShearDeformation: true });
    const paths = getIssues(member).map((issue) => issue.path);
    expect(paths).toEqual(expect.arrayContaining(["spans[0].areaMm2", "spans[0].densityKgPerM3", "spans[0].gMpa", "spans[0].shearAreaMm2"]));
  });

  it("collectMemberIssues lists every problem at once and nothing for a valid member", () => {
    expect(collectMemberIssues(createMember(createSpans([3000]), createSupports("pinned", "roller"), [uniform]))).toEqual([]);
    const bad = createMember([{ lengthMm: -1, eMpa: 0, iMm4: 1 }], createSupports("free", "free"), [uniform]);
    expect(collectMemberIssues(bad).length).toBeGreaterThanOrEqual(2);
  });

  it("the error message lists path and reason", () => {
    const error = new EngineInputError([{ path: "spans[2].eMpa", message: "must be positive" }]);
    expect(error.message).toBe("spans[2].eMpa: must be positive");
    expect(error.name).toBe("EngineInputError");
  });
});

describe("physical ranges (lib/engine/input-bounds.ts, common practice)", () => {
  it.each<[string, Partial<Member["spans"][number]>, string, RegExp]>([
    ["a 1e308 mm span", { lengthMm: 1e308 }, "spans[0].lengthMm", /span length must be at most 1,000,000 mm/],
    ["E = 13.8 MPa (GPa written bare)", { eMpa: 13.8 }, "spans[0].eMpa", /at least 100 MPa.*GPa/],
    ["E = 2e8 MPa (GPa taken for MPa twice)", { eMpa: 2e8 }, "spans[0].eMpa", /at most 1,000,000 MPa/],
    ["I = 1e300 mm^4", { iMm4: 1e300 }, "spans[0].iMm4", /at most 1e15 mm\^4/],
    ["I = 1e-6 mm^4", { iMm4: 1e-6 }, "spans[0].iMm4", /at least 1 mm\^4/],
  ])("%s is refused on its own field, not as a singular matrix", (_name, patch, path, message) => {
    const member = createMember([{ ...createSpans([3000])[0]!, ...patch }], createSupports("pinned", "roller"), [uniform]);
    const issues = getIssues(member);
    expect(issues.map((issue) => issue.path)).toEqual([path]);
    expect(issues[0]!.message).toMatch(message);
    expect(issues[0]!.message).not.toMatch(/singular/);
  });

  it("a spring stiffer than 1e10 N/mm is refused, pointing to a pinned support", () => {
    const member = createMember(createSpans([3000]), [{ kind: "pinned" }, { kind: "spring", springNPerMm: 1e15 }], [uniform]);
    const issues = getIssues(member);
    expect(issues.map((issue) => issue.path)).toEqual(["supports[1].springNPerMm"]);
    expect(issues[0]!.message).toMatch(/use pinned/);
  });

  it("loads beyond any building member's are refused on their own field, whatever their sign", () => {
    const member = createMember(createSpans([3000]), createSupports("pinned", "roller"), [
      { kind: "uniform", loadCase: "A", wNPerMm: 1e300 },
      { kind: "point", loadCase: "A", atMm: 1000, pN: -1e12 },
      { kind: "moment", loadCase: "A", atMm: 1000, mNmm: 1e15 },
      { kind: "point", loadCase: "A", atMm: 1000, pN: 1e-9 },
    ]);
    const issues = getIssues(member);
    expect(issues.map((issue) => issue.path)).toEqual(["loads[0].wNPerMm", "loads[1].pN", "loads[2].mNmm"]);
    expect(issues[1]!.message).toMatch(/point load must be at most 1e9 N in magnitude/);
  });

  it("the largest values inside every range still solve to finite numbers", () => {
    const member = createMember([{ lengthMm: 1e6, eMpa: 100, iMm4: 1 }], createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: 1e5 }]);
    expect(Array.from(solveMember(member).caseStates).every(Number.isFinite)).toBe(true);
  });
});
