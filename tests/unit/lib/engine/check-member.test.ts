/** checkMember end to end: result structure, sampled shape, serialisation, errors. */
import { describe, expect, it } from "vitest";
import { SHAPE_POINTS_PER_SPAN, checkMember } from "../../../../lib/engine/check-member";
import type { LimitProfile } from "../../../../lib/engine/model";
import { EngineInputError } from "../../../../lib/engine/solver";
import { EI, createMember, createSpans, createSupports, expectRelative } from "./solver/fixtures";

const profile: LimitProfile = {
  id: "floor",
  label: "Floor",
  source: "IBC 2021 Table 1604.3 (from memory)",
  cantileverSpanMultiplier: 2,
  combinations: [
    { id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 },
    { id: "D+L", label: "Dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 },
  ],
  frequency: { minHz: 3, massFactors: { dead: 1, live: 0.1 } },
};

const L = 5000;
const member = createMember(createSpans([L, L, 2000]), createSupports("pinned", "roller", "roller", "free"), [
  { kind: "uniform", loadCase: "dead", wNPerMm: 3 },
  { kind: "uniform", loadCase: "live", wNPerMm: 5, startMm: 0, endMm: L },
  { kind: "point", loadCase: "live", atMm: 11_500, pN: 2000 },
], { mark: "B-12", category: "floor_beam" });

describe("checkMember", () => {
  it("returns every check, rotations, frequency, governing and pass for a continuous member", () => {
    const result = checkMember(member, profile);
    expect(result.mark).toBe("B-12");
    expect(result.category).toBe("floor_beam");
    expect(result.checks).toHaveLength(2 * 3);
    expect(result.checks.map((c) => `${c.combinationId}/${c.spanIndex}/${c.spanKind}`)).toEqual(["L/0/span", "L/1/span", "L/2/cantilever", "D+L/0/span", "D+L/1/span", "D+L/2/cantilever"]);
    expect(result.rotations).toHaveLength(2 * 4);
    expect(result.frequency?.method).toBe("finite_element");
    const highest = Math.max(...result.checks.map((c) => c.utilization));
    expect(result.governing?.utilization).toBe(highest);
    expect(result.pass).toBe(result.checks.every((c) => c.pass) && result.frequency!.pass);
    for (const check of result.checks) {
      for (const value of [check.deflectionMm, check.atMm, check.allowedMm, check.utilization, check.effectiveSpanMm]) expect(Number.isFinite(value)).toBe(true);
    }
  });

  it("samples the shape: 21 points per span, shared nodes once, values equal to the closed form", () => {
    const single = createMember(createSpans([L]), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: 4 }]);
    const shape = checkMember(single, { ...profile, frequency: undefined }, undefined, { shape: true }).shape!;
    expect(shape).toHaveLength(SHAPE_POINTS_PER_SPAN);
    expect(shape[0]!.xMm).toBe(0);
    expect(shape[20]!.xMm).toBe(L);
    // AISC Manual Table 3-23, simple beam - uniformly distributed load (from memory):
    // delta_x = w x (L^3 - 2 L x^2 + x^3) / (24 E I)
    for (const sample of shape.slice(1, -1)) {
      const x = sample.xMm;
      expectRelative(sample.deflectionMm["D+L"]!, (4 * x * (L ** 3 - 2 * L * x * x + x ** 3)) / (24 * EI));
      expect(sample.deflectionMm["L"]).toBe(0);
    }
    expect(checkMember(member, profile, undefined, { shape: true }).shape).toHaveLength(3 * (SHAPE_POINTS_PER_SPAN - 1) + 1);
  });

  it("samples the shape only when asked, as an ordinary field that JSON, spread and structuredClone carry", () => {
    expect(Object.keys(checkMember(member, profile))).not.toContain("shape");
    const result = checkMember(member, profile, undefined, { shape: true });
    const json = JSON.parse(JSON.stringify(result));
    expect(json.shape).toHaveLength(61);
    expect(json.shape[30].deflectionMm["D+L"]).toBeCloseTo(result.shape![30]!.deflectionMm["D+L"]!, 12);
    expect({ ...result }.shape).toHaveLength(61);
    expect(structuredClone(result).shape).toHaveLength(61);
    expect(Object.keys(result)).toContain("shape");
    expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity/);
  });

  it("a profile without combinations gives no checks and a null governing check", () => {
    const result = checkMember(member, { ...profile, combinations: [], frequency: undefined });
    expect(result.checks).toEqual([]);
    expect(result.governing).toBeNull();
    expect(result.pass).toBe(true);
    expect(result.suggestion).toBeNull();
  });

  it("member and profile issues are reported together with their paths", () => {
    const bad = { ...member, spans: [{ ...member.spans[0]!, eMpa: 0 }, ...member.spans.slice(1)] };
    const badProfile: LimitProfile = { ...profile, combinations: [{ ...profile.combinations[0]!, limitRatio: 0 }] };
    try {
      checkMember(bad, badProfile);
      throw new Error("expected an error");
    } catch (error) {
      expect(error).toBeInstanceOf(EngineInputError);
      expect((error as EngineInputError).issues.map((issue) => issue.path)).toEqual(["spans[0].eMpa", "profile.combinations[0].limitRatio"]);
    }
  });
});
