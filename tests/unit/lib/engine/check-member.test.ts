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

describe("governing check and continuous members against closed forms, not the engine's own output", () => {
  // Limits as in `profile` above: l/360 live, l/240 dead + live (IBC 2021 Table 1604.3, from memory).
  const deflectionOnly: LimitProfile = { ...profile, frequency: undefined };
  const span = 5000;
  // AISC Manual Table 3-23, simple beam - uniformly distributed load (from memory): 5wL^4/(384EI).
  const getSimpleMm = (wNPerMm: number) => (5 * wNPerMm * span ** 4) / (384 * EI);

  function createSimpleBeam(wDead: number, wLive: number) {
    return createMember(createSpans([span]), createSupports("pinned", "roller"), [
      { kind: "uniform", loadCase: "dead", wNPerMm: wDead },
      { kind: "uniform", loadCase: "live", wNPerMm: wLive },
    ]);
  }

  it("dead + live governs when (wD + wL) x 240 > wL x 360: 5 x 8 x L^4/(384EI) over L/240", () => {
    const result = checkMember(createSimpleBeam(3, 5), deflectionOnly);
    const expected = getSimpleMm(8) / (span / 240);
    expect(expected).toBeGreaterThan(getSimpleMm(5) / (span / 360));
    expect(result.governing?.combinationId).toBe("D+L");
    expectRelative(result.governing!.utilization, expected);
    expectRelative(result.governing!.deflectionMm, getSimpleMm(8));
    expectRelative(result.governing!.allowedMm, span / 240);
    expect(result.pass).toBe(expected <= 1);
  });

  it("live governs when (wD + wL) x 240 < wL x 360: 5 x 5 x L^4/(384EI) over L/360", () => {
    const result = checkMember(createSimpleBeam(1, 5), deflectionOnly);
    const expected = getSimpleMm(5) / (span / 360);
    expect(expected).toBeGreaterThan(getSimpleMm(6) / (span / 240));
    expect(result.governing?.combinationId).toBe("L");
    expectRelative(result.governing!.utilization, expected);
  });

  it("fails when the closed form exceeds the limit: a 1e6 mm^4 section gives utilization 5wL^4/(384EI) / (L/240) > 1", () => {
    const weak = createMember(createSpans([span], 200_000, 1e6), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: 3 }]);
    const expected = (5 * 3 * span ** 4) / (384 * 200_000 * 1e6) / (span / 240);
    expect(expected).toBeGreaterThan(1);
    const result = checkMember(weak, deflectionOnly);
    expectRelative(result.governing!.utilization, expected);
    expect(result.pass).toBe(false);
  });

  it("two equal spans under dead load: each span deflects w x (L^3 - 3 L x^2 + 2 x^3)/(48EI) at x = L(1 + sqrt33)/16 from its outer support", () => {
    // AISC Manual Table 3-23, continuous beam - two equal spans - uniform load on both spans, and
    // beam fixed at one end, supported at the other - uniform load (both from memory): zero slope
    // over the middle support, so each span is the propped cantilever, about wL^4/(185EI) at 0.4215L.
    const w = 4;
    const member = createMember(createSpans([span, span]), createSupports("pinned", "roller", "roller"), [{ kind: "uniform", loadCase: "dead", wNPerMm: w }]);
    const xMax = (span * (1 + Math.sqrt(33))) / 16;
    const expectedMm = (w * xMax * (span ** 3 - 3 * span * xMax ** 2 + 2 * xMax ** 3)) / (48 * EI);
    expectRelative(expectedMm, (w * span ** 4) / (185 * EI), 5e-3); // the table's rounded 185
    const result = checkMember(member, deflectionOnly);
    const [left, right] = result.checks.filter((c) => c.combinationId === "D+L");
    expectRelative(left!.deflectionMm, expectedMm);
    expectRelative(right!.deflectionMm, expectedMm);
    expect(Math.abs(left!.atMm - xMax)).toBeLessThanOrEqual(1e-6 * span);
    expect(Math.abs(right!.atMm - (2 * span - xMax))).toBeLessThanOrEqual(1e-6 * span);
    expectRelative(result.governing!.utilization, expectedMm / (span / 240));
    // dead only: the live combination carries nothing
    for (const c of result.checks.filter((c) => c.combinationId === "L")) expect(c.deflectionMm).toBe(0);
  });

  it("a span with an overhang under dead load on the whole length: back span and tip from the closed forms, the tip judged on 2a", () => {
    // AISC Manual Table 3-23, beam overhanging one support - uniformly distributed load (from memory):
    // between supports delta_x = w x (l^4 - 2 l^2 x^2 + l x^3 - 2 a^2 l^2 + 2 a^2 x^2) / (24 E I l);
    // at the tip delta = w a (4 a^2 l - l^3 + 3 a^3) / (24 E I), upward (negative) for this short overhang.
    const w = 4;
    const l = 5000;
    const a = 1500;
    const member = createMember(createSpans([l, a]), createSupports("pinned", "roller", "free"), [{ kind: "uniform", loadCase: "dead", wNPerMm: w }]);
    const getBackMm = (x: number) => (w * x * (l ** 4 - 2 * l * l * x * x + l * x ** 3 - 2 * a * a * l * l + 2 * a * a * x * x)) / (24 * EI * l);
    // The back-span maximum found independently by golden-section search on the closed form.
    let lo = 0;
    let hi = l;
    const ratio = (Math.sqrt(5) - 1) / 2;
    for (let i = 0; i < 200; i++) {
      const x1 = hi - ratio * (hi - lo);
      const x2 = lo + ratio * (hi - lo);
      if (getBackMm(x1) > getBackMm(x2)) hi = x2;
      else lo = x1;
    }
    const xBack = (lo + hi) / 2;
    const tipMm = (w * a * (4 * a * a * l - l ** 3 + 3 * a ** 3)) / (24 * EI);
    expect(tipMm).toBeLessThan(0);
    const result = checkMember(member, deflectionOnly);
    const [back, tip] = result.checks.filter((c) => c.combinationId === "D+L");
    expectRelative(back!.deflectionMm, getBackMm(xBack));
    expect(Math.abs(back!.atMm - xBack)).toBeLessThanOrEqual(1e-6 * l);
    expectRelative(tip!.deflectionMm, tipMm);
    expect(tip!.spanKind).toBe("cantilever");
    expectRelative(tip!.allowedMm, (2 * a) / 240); // IBC 2021 Table 1604.3 footnote: twice the cantilever (from memory)
    const backUtilization = getBackMm(xBack) / (l / 240);
    const tipUtilization = Math.abs(tipMm) / ((2 * a) / 240);
    expectRelative(result.governing!.utilization, Math.max(backUtilization, tipUtilization));
    expect(result.governing!.spanKind).toBe(backUtilization > tipUtilization ? "span" : "cantilever");
  });
});
