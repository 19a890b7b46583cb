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

  it("a spring too soft to register against the beam stiffness is reported as singular, not NaN", () => {
    // a pin and a 1e-20 N/mm spring: the rotation about the pin is restrained only below round-off
    const member = createMember(createSpans([3000]), [{ kind: "pinned" }, { kind: "spring", springNPerMm: 1e-20 }], [uniform]);
    const issues = getIssues(member);
    expect(issues[0]!.path).toMatch(/^supports\[\d\]$/);
    expect(issues[0]!.message).toMatch(/singular/);
  });

  it("a very soft segment is still solved with finite numbers", () => {
    const member = createMember(
      [{ lengthMm: 3000, eMpa: 200000, iMm4: 1e8 }, { lengthMm: 3000, eMpa: 200000, iMm4: 1e-6 }],
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

describe("overflow", () => {
  it("loads so large that results leave double precision are an input error, not Infinity", () => {
    const member = createMember(createSpans([3000]), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "A", wNPerMm: 1e300 }]);
    const issues = getIssues(member);
    expect(issues[0]!.path).toBe("loads");
    expect(issues[0]!.message).toMatch(/double precision/);
  });
});
