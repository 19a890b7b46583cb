/**
 * Serviceability checks: allowed = effective span / N (capped), utilization, factor of safety,
 * cantilever multiplier, creep on sustained load, governing check. Limits follow IBC 2021 Table
 * 1604.3 (from memory: L/360 live, L/240 dead + live for floors; cantilevers judged on twice their
 * length); the deflections come from AISC Manual Table 3-23 (from memory) as written beside them.
 */
import { describe, expect, it } from "vitest";
import { checkMember } from "../../../../../lib/engine/check-member";
import { getSpanJudgements } from "../../../../../lib/engine/checks";
import { EngineInputError } from "../../../../../lib/engine/solver";
import type { LimitProfile, Member } from "../../../../../lib/engine/model";
import { EI, createMember, createSpans, createSupports, expectRelative } from "../solver/fixtures";

const L = 6000;
const wDead = 4;
const wLive = 6;

const floorProfile: LimitProfile = {
  id: "floor",
  label: "Floor members",
  source: "IBC 2021 Table 1604.3 (from memory)",
  cantileverSpanMultiplier: 2,
  combinations: [
    { id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 },
    { id: "D+L", label: "Dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 },
  ],
};

function createFloorBeam(extra: Partial<Member> = {}): Member {
  return createMember(createSpans([L]), createSupports("pinned", "roller"), [
    { kind: "uniform", loadCase: "dead", wNPerMm: wDead },
    { kind: "uniform", loadCase: "live", wNPerMm: wLive },
  ], extra);
}

const getSimpleSpanDeflection = (wLoad: number, length: number): number => (5 * wLoad * length ** 4) / (384 * EI); // AISC Table 3-23 simple beam uniform (from memory)

describe("span checks", () => {
  it("L/360 on live and L/240 on dead + live, utilization and factor of safety", () => {
    const result = checkMember(createFloorBeam(), floorProfile);
    expect(result.checks).toHaveLength(2);
    const [live, total] = result.checks as [NonNullable<(typeof result.checks)[0]>, NonNullable<(typeof result.checks)[0]>];
    expect(live.combinationId).toBe("L");
    expect(live.spanKind).toBe("span");
    expect(live.spanMm).toBe(L);
    expect(live.effectiveSpanMm).toBe(L);
    expectRelative(live.allowedMm, L / 360);
    expectRelative(live.deflectionMm, getSimpleSpanDeflection(wLive, L));
    expectRelative(live.utilization, getSimpleSpanDeflection(wLive, L) / (L / 360));
    expectRelative(live.factorOfSafety!, L / 360 / getSimpleSpanDeflection(wLive, L));
    expect(Math.abs(live.atMm - L / 2)).toBeLessThanOrEqual(1e-6 * L);
    expectRelative(total.deflectionMm, getSimpleSpanDeflection(wDead + wLive, L));
    expectRelative(total.allowedMm, L / 240);
    // pass when the closed-form live deflection is within L/360 (IBC 2021 Table 1604.3, from memory)
    expect(live.pass).toBe(getSimpleSpanDeflection(wLive, L) <= L / 360);
    // governing: the larger of the two utilizations
    const expectedGoverning = getSimpleSpanDeflection(wLive, L) / (L / 360) > getSimpleSpanDeflection(wDead + wLive, L) / (L / 240) ? "L" : "D+L";
    expect(result.governing?.combinationId).toBe(expectedGoverning);
  });

  it("pass exactly at utilization 1 and fail just above it", () => {
    // choose I so that the live deflection is exactly L/360: I = 5 w L^4 * 360 / (384 E L)
    const iExact = (5 * wLive * L ** 4 * 360) / (384 * 200_000 * L);
    const profile: LimitProfile = { ...floorProfile, combinations: [floorProfile.combinations[0]!] };
    const atLimit = checkMember(createMember(createSpans([L], 200_000, iExact), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "live", wNPerMm: wLive }]), profile);
    expect(Math.abs(atLimit.checks[0]!.utilization - 1)).toBeLessThan(1e-12);
    const over = checkMember(createMember(createSpans([L], 200_000, iExact * 0.999), createSupports("pinned", "roller"), [{ kind: "uniform", loadCase: "live", wNPerMm: wLive }]), profile);
    expect(over.checks[0]!.pass).toBe(false);
    expect(over.pass).toBe(false);
    expect(over.checks[0]!.factorOfSafety!).toBeLessThan(1);
  });

  it("an absolute cap governs when smaller than span / N", () => {
    const profile: LimitProfile = { ...floorProfile, combinations: [{ id: "D+L", label: "capped", factors: { dead: 1, live: 1 }, limitRatio: 240, capMm: 12 }] };
    const result = checkMember(createFloorBeam(), profile);
    expect(result.checks[0]!.allowedMm).toBe(Math.min(L / 240, 12));
    const loose: LimitProfile = { ...floorProfile, combinations: [{ id: "D+L", label: "capped", factors: { dead: 1, live: 1 }, limitRatio: 240, capMm: 1000 }] };
    expect(checkMember(createFloorBeam(), loose).checks[0]!.allowedMm).toBe(L / 240);
  });

  it("a combination whose cases the member does not carry gives zero deflection and a null factor of safety", () => {
    const profile: LimitProfile = { ...floorProfile, combinations: [{ id: "S", label: "Snow", factors: { snow: 1 }, limitRatio: 240 }] };
    const check = checkMember(createFloorBeam(), profile).checks[0]!;
    expect(check.deflectionMm).toBe(0);
    expect(check.utilization).toBe(0);
    expect(check.factorOfSafety).toBeNull();
    expect(check.pass).toBe(true);
  });

  it("creep on the sustained part: D+L long term = (1 + k_def) D + L with the material's factor", () => {
    // EN 1995-1-1 2.2.3 (from memory): w_fin = w_inst (1 + k_def) for permanent actions;
    // k_def = 0.6 for solid timber in service class 1 (EN 1995-1-1 Table 3.2, from memory)
    const profile: LimitProfile = {
      ...floorProfile,
      combinations: [{ id: "fin", label: "Final", factors: { dead: 1, live: 1 }, sustainedFactors: { dead: 1 }, creep: "material", limitRatio: 250 }],
    };
    const check = checkMember(createFloorBeam({ materialCreepFactor: 0.6 }), profile).checks[0]!;
    expectRelative(check.deflectionMm, 1.6 * getSimpleSpanDeflection(wDead, L) + getSimpleSpanDeflection(wLive, L));
    const fixed: LimitProfile = { ...profile, combinations: [{ ...profile.combinations[0]!, creep: 2, sustainedFactors: { dead: 1, live: 0.3 } }] };
    expectRelative(checkMember(createFloorBeam(), fixed).checks[0]!.deflectionMm, 3 * getSimpleSpanDeflection(wDead, L) + 1.6 * getSimpleSpanDeflection(wLive, L));
  });

  it("a material-creep combination on a member without a creep factor is an input error on the profile", () => {
    const profile: LimitProfile = { ...floorProfile, combinations: [{ id: "fin", label: "Final", factors: { dead: 1 }, sustainedFactors: { dead: 1 }, creep: "material", limitRatio: 250 }] };
    expect(() => checkMember(createFloorBeam(), profile)).toThrow(EngineInputError);
    try {
      checkMember(createFloorBeam(), profile);
    } catch (error) {
      expect((error as EngineInputError).issues[0]!.path).toBe("profile.combinations[0].creep");
    }
  });

  it("profile errors name the field", () => {
    const bad: LimitProfile = { ...floorProfile, cantileverSpanMultiplier: 0, combinations: [{ id: "L", label: "x", factors: { live: Number.NaN }, limitRatio: -360, capMm: 0 }] };
    try {
      checkMember(createFloorBeam(), bad);
      throw new Error("expected an error");
    } catch (error) {
      expect(error).toBeInstanceOf(EngineInputError);
      expect((error as EngineInputError).issues.map((issue) => issue.path)).toEqual(
        expect.arrayContaining(["profile.cantileverSpanMultiplier", "profile.combinations[0].limitRatio", "profile.combinations[0].capMm", "profile.combinations[0].factors.live"]),
      );
    }
  });
});

describe("cantilevers and overhangs", () => {
  it("a cantilever is judged on twice its length (IBC 2021 Table 1604.3 footnote, from memory)", () => {
    const length = 2000;
    const member = createMember(createSpans([length]), createSupports("fixed", "free"), [{ kind: "uniform", loadCase: "live", wNPerMm: wLive }]);
    const check = checkMember(member, floorProfile).checks[0]!;
    expect(check.spanKind).toBe("cantilever");
    expect(check.spanMm).toBe(length);
    expect(check.effectiveSpanMm).toBe(2 * length);
    expectRelative(check.allowedMm, (2 * length) / 360);
    // AISC Manual Table 3-23, cantilever beam - uniformly distributed load (from memory)
    expectRelative(check.deflectionMm, (wLive * length ** 4) / (8 * EI));
    expect(check.atMm).toBe(length);
  });

  it("a simple span with an overhang: the back span is a span, the overhang a cantilever", () => {
    const l = 5000;
    const a = 1500;
    const member = createMember(createSpans([l, a]), createSupports("pinned", "roller", "free"), [{ kind: "point", loadCase: "live", atMm: l + a, pN: 8000 }]);
    const checks = checkMember(member, { ...floorProfile, combinations: [floorProfile.combinations[0]!] }).checks;
    expect(checks.map((c) => c.spanKind)).toEqual(["span", "cantilever"]);
    expect(checks[1]!.effectiveSpanMm).toBe(2 * a);
    // AISC Manual Table 3-23, beam overhanging one support - load at end of overhang (from memory)
    expectRelative(checks[1]!.deflectionMm, (8000 * a * a * (l + a)) / (3 * EI));
    expectRelative(checks[0]!.deflectionMm, -(8000 * a * l * l) / (9 * Math.sqrt(3) * EI));
    expect(checks[0]!.effectiveSpanMm).toBe(l);
  });

  it("segments without a support between them are judged on the whole distance between supports", () => {
    const judgements = getSpanJudgements(createMember(createSpans([2000, 1000, 3000, 1200]), createSupports("pinned", "free", "roller", "free", "free"), []));
    expect(judgements.map((j) => [j.spanKind, j.judgedLengthMm])).toEqual([["span", 3000], ["span", 3000], ["cantilever", 4200], ["cantilever", 4200]]);
  });

  it("rotations are reported at every node for every combination", () => {
    const result = checkMember(createFloorBeam(), floorProfile);
    expect(result.rotations).toHaveLength(4);
    // Gere & Goodno, Appendix (from memory): end slope w L^3 / (24 E I)
    expectRelative(result.rotations[0]!.rotationRad, (wLive * L ** 3) / (24 * EI));
    expectRelative(result.rotations[3]!.rotationRad, -((wDead + wLive) * L ** 3) / (24 * EI));
    expect(result.rotations[3]!.atMm).toBe(L);
  });
});
