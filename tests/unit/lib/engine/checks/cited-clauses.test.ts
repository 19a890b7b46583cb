/**
 * Each preset does what the clause it cites says, checked against closed-form deflections
 * (AISC Steel Construction Manual Table 3-23, from memory: simple beam uniform 5wL^4/(384EI),
 * cantilever uniform wL^4/(8EI)) and the first frequency of a simply supported beam,
 * f1 = (pi / (2 L^2)) sqrt(EI / m) (Roark's Formulas Table 16.1 case 1, from memory).
 */
import { describe, expect, it } from "vitest";

import { checkMember } from "@/lib/engine/check-member";
import { getPreset } from "@/lib/engine/presets";
import { STANDARD_GRAVITY_M_PER_S2, type CheckResult, type LimitProfile, type Load, type Member } from "@/lib/engine/model";

import { EI, createMember, createSpans, createSupports, expectRelative } from "../solver/fixtures";

const L = 6000;
const wDead = 3;
const wLive = 4;
const simpleSpan = (w: number): number => (5 * w * L ** 4) / (384 * EI); // AISC Table 3-23 case 1 (from memory)
const cantileverTip = (w: number, length: number): number => (w * length ** 4) / (8 * EI); // AISC Table 3-23 case 22 (from memory)

function getPresetOrThrow(id: string, options?: Parameters<typeof getPreset>[1]): LimitProfile {
  const preset = getPreset(id, options);
  if (!preset) throw new Error(`no preset ${id}`);
  return preset;
}

function uniformLoads(cases: Record<string, number>): Load[] {
  return Object.entries(cases).map(([loadCase, wNPerMm]) => ({ kind: "uniform", loadCase, wNPerMm }));
}

function createSimpleBeam(cases: Record<string, number>, extra: Partial<Member> = {}): Member {
  return createMember(createSpans([L]), createSupports("pinned", "roller"), uniformLoads(cases), extra);
}

function createCantilever(lengthMm: number, cases: Record<string, number>, extra: Partial<Member> = {}): Member {
  return createMember(createSpans([lengthMm]), createSupports("fixed", "free"), uniformLoads(cases), extra);
}

function findCheck(checks: CheckResult[], combinationId: string): CheckResult {
  const check = checks.find((c) => c.combinationId === combinationId);
  if (!check) throw new Error(`no check ${combinationId}`);
  return check;
}

describe("cantilever length (defect 2)", () => {
  const lengthMm = 2000;
  it("ACI 318-19 Table 24.2.2 judges a cantilever on its own length: allowed = l/360, not 2l/360 (from memory)", () => {
    const result = checkMember(createCantilever(lengthMm, { live: wLive }, { materialCreepFactor: 2 }), getPresetOrThrow("aci-318-19-floor"));
    const live = findCheck(result.checks, "live");
    expectRelative(live.deflectionMm, cantileverTip(wLive, lengthMm));
    expect(live.effectiveSpanMm).toBe(lengthMm);
    expectRelative(live.allowedMm, lengthMm / 360);
  });
  it("IBC 2021 Table 1604.3 footnote doubles it: allowed = 2l/360 (from memory)", () => {
    const result = checkMember(createCantilever(lengthMm, { live: wLive }, { ibcCreepComponentFactor: 0 }), getPresetOrThrow("ibc-2021-floor"));
    const live = findCheck(result.checks, "live");
    expect(live.effectiveSpanMm).toBe(2 * lengthMm);
    expectRelative(live.allowedMm, (2 * lengthMm) / 360);
  });
  it("EN 1995-1-1 Table 7.2 gives cantilevers their own ratios on their own length: w_inst l/150, w_net,fin l/125, w_fin l/75 (from memory)", () => {
    const result = checkMember(createCantilever(lengthMm, { dead: wDead, live: wLive }, { materialCreepFactor: 0.6 }), getPresetOrThrow("en1995-timber-floor"));
    for (const [id, ratio] of [["w_inst", 150], ["w_net_fin", 125], ["w_fin", 75]] as const) {
      const check = findCheck(result.checks, id);
      expect(check.effectiveSpanMm).toBe(lengthMm);
      expect(check.limitRatio).toBe(ratio);
      expectRelative(check.allowedMm, lengthMm / ratio);
    }
  });
});

describe("IBC 2021 Table 1604.3 D + L row (defect 3)", () => {
  it.each([
    ["steel (footnote: dead taken as zero, from memory)", 0],
    ["wood seasoned and dry (footnote: 0.5 D, from memory)", 0.5],
    ["wood at other moisture conditions (footnote: 1.0 D, from memory)", 1],
    ["concrete, ACI 318-19 24.2.4.1 lambda = 2 / (1 + 50 x 0.005) = 1.6 (from memory)", 2 / (1 + 50 * 0.005)],
  ])("%s: creep component K x dead + immediate live against l/240", (_name, k) => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { ibcCreepComponentFactor: k }), getPresetOrThrow("ibc-2021-floor"));
    const total = findCheck(result.checks, "dead+live");
    expectRelative(total.deflectionMm, simpleSpan(wLive) + k * simpleSpan(wDead));
    expectRelative(total.allowedMm, L / 240);
  });
  it("the conservative variant adds immediate dead + live at l/240 under its own id", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { ibcCreepComponentFactor: 0.5 }), getPresetOrThrow("floor-conservative-immediate-total"));
    expectRelative(findCheck(result.checks, "dead+live_immediate").deflectionMm, simpleSpan(wDead + wLive));
    expectRelative(findCheck(result.checks, "dead+live").deflectionMm, simpleSpan(wLive) + 0.5 * simpleSpan(wDead));
  });
  it("a member without the IBC creep factor is refused by name, not checked as zero", () => {
    expect(() => checkMember(createSimpleBeam({ dead: wDead, live: wLive }), getPresetOrThrow("ibc-2021-floor"))).toThrow(/ibcCreepComponentFactor/);
  });
});

describe("EN 1995-1-1 w_inst (defect 4)", () => {
  it("2.2.3(2): w_inst is the characteristic combination dead + live, against l/300 (from memory)", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { materialCreepFactor: 0.6 }), getPresetOrThrow("en1995-timber-floor"));
    const inst = findCheck(result.checks, "w_inst");
    expectRelative(inst.deflectionMm, simpleSpan(wDead + wLive));
    expectRelative(inst.allowedMm, L / 300);
  });
  it("w_fin = w_inst,G (1 + k_def) + w_inst,Q (1 + psi2 k_def), psi2 = 0.3 (2.2.3(5); EN 1990 Table A1.1, from memory)", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { materialCreepFactor: 0.6 }), getPresetOrThrow("en1995-timber-floor"));
    expectRelative(findCheck(result.checks, "w_fin").deflectionMm, simpleSpan(wDead) * 1.6 + simpleSpan(wLive) * (1 + 0.3 * 0.6));
  });
  it("the national-annex variant w_inst,Q takes the live load alone", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { materialCreepFactor: 0.6 }), getPresetOrThrow("en1995-timber-floor-na-variable-inst"));
    expectRelative(findCheck(result.checks, "w_inst_q").deflectionMm, simpleSpan(wLive));
  });
});

describe("ACI 318-19 Table 24.2.2 after attachment (defect 5)", () => {
  const lambda = 2; // 24.2.4.1.1: xi = 2.0 at five years or more, rho' = 0 (from memory)
  it("time-dependent lambda x (dead + sustained live) plus the immediate live, default fraction 1.0", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { materialCreepFactor: lambda }), getPresetOrThrow("aci-318-19-floor"));
    const after = findCheck(result.checks, "after_attachment_live");
    expectRelative(after.deflectionMm, simpleSpan(wLive) + lambda * (simpleSpan(wDead) + 1.0 * simpleSpan(wLive)));
    expectRelative(after.allowedMm, L / 240);
  });
  it("with a given sustained fraction 0.25", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { materialCreepFactor: lambda }), getPresetOrThrow("aci-318-19-floor-sensitive", { sustainedLiveFraction: 0.25 }));
    const after = findCheck(result.checks, "after_attachment_live");
    expectRelative(after.deflectionMm, simpleSpan(wLive) + lambda * (simpleSpan(wDead) + 0.25 * simpleSpan(wLive)));
    expectRelative(after.allowedMm, L / 480);
  });
});

describe("governing check includes frequency (defect 6)", () => {
  // Dead load only as mass: m = w / g. f1 = (pi / (2 L^2)) sqrt(EI / m), SI units.
  const massKgPerM = (wDead * 1000) / STANDARD_GRAVITY_M_PER_S2;
  const f1Hz = (Math.PI / (2 * (L / 1000) ** 2)) * Math.sqrt((EI * 1e-6) / massKgPerM);
  const profile: LimitProfile = {
    id: "freq-test",
    label: "live l/360 and a frequency minimum",
    source: "test",
    cantileverSpanMultiplier: 2,
    combinations: [{ id: "live", label: "live", factors: { live: 1 }, limitRatio: 360 }],
    frequency: { minHz: 1.2 * f1Hz, massFactors: { dead: 1 } },
  };
  it("a member that fails only on frequency shows frequency as governing, utilization minHz / f1", () => {
    const member = createSimpleBeam({ dead: wDead, live: 0.1 });
    const result = checkMember(member, profile);
    expect(result.checks.every((c) => c.pass)).toBe(true);
    expect(result.pass).toBe(false);
    expect(result.governingCheck?.kind).toBe("frequency");
    expect(result.governingCheck?.key).toBe("frequency");
    expect(result.governingCheck?.pass).toBe(false);
    expectRelative(result.governingCheck!.utilization, (1.2 * f1Hz) / f1Hz, 5e-3);
    expectRelative(result.governingCheck!.factorOfSafety!, 1 / 1.2, 5e-3);
  });
  it("a deflection check governs when its utilization is the higher, with the span's key", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: 40 }), { ...profile, frequency: { minHz: 0.5 * f1Hz, massFactors: { dead: 1 } } });
    expect(result.governingCheck).toMatchObject({ kind: "deflection", key: "live@0", pass: false });
    expectRelative(result.governingCheck!.utilization, simpleSpan(40) / (L / 360));
  });
});

describe("engineers' figures: achieved l/N beside the limit l/N", () => {
  it("achieved = span / deflection, limit = the ratio used", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { ibcCreepComponentFactor: 0 }), getPresetOrThrow("ibc-2021-floor"));
    const live = findCheck(result.checks, "live");
    expect(live.limitRatio).toBe(360);
    expectRelative(live.achievedRatio!, L / simpleSpan(wLive));
    // utilization is limit / achieved for a check without a cap
    expectRelative(live.utilization, 360 / live.achievedRatio!);
  });
  it("a zero deflection has no achieved ratio", () => {
    const result = checkMember(createSimpleBeam({ dead: wDead, live: 0 }, { ibcCreepComponentFactor: 0 }), getPresetOrThrow("ibc-2021-floor"));
    expect(findCheck(result.checks, "live").achievedRatio).toBeNull();
  });
});

describe("profile validation of the new fields", () => {
  it("refuses a non-positive cantilever limit ratio and a negative IBC creep factor, by path", () => {
    const profile: LimitProfile = {
      id: "p",
      label: "p",
      source: "test",
      cantileverSpanMultiplier: 2,
      combinations: [{ id: "total", label: "total", factors: { live: 1 }, sustainedFactors: { dead: 1 }, creep: "ibc_creep_component", limitRatio: 240, cantileverLimitRatio: 0 }],
    };
    expect(() => checkMember(createSimpleBeam({ dead: wDead, live: wLive }, { ibcCreepComponentFactor: -1 }), profile)).toThrow(
      expect.objectContaining({
        issues: [
          { path: "profile.combinations[0].cantileverLimitRatio", message: "the cantilever limit ratio (length / N) must be a positive finite number" },
          { path: "profile.combinations[0].creep", message: 'combination "total" uses the IBC 2021 Table 1604.3 creep component but the member has no ibcCreepComponentFactor (a finite number >= 0)' },
        ],
      }),
    );
  });
});
