/**
 * Top steel for negative-moment regions. Check values are written out here: the doubly reinforced
 * transformed cracked section of PCA Notes on ACI 318, Table 8-2 (from memory),
 *   B = b/(n A_s), r = (n - 1) A's / (n A_s), kd = (sqrt(2 d B (1 + r d'/d) + (1 + r)^2) - (1 + r)) / B,
 *   I_cr = b kd^3/3 + n A_s (d - kd)^2 + (n - 1) A's (kd - d')^2,
 * I_e per ACI 318-19 Table 24.2.3.5 (from memory), and the propped cantilever under uniform load:
 * fixed-end moment wL^2/8, deflection w x (L^3 - 3 L x^2 + 2 x^3) / (48 EI) from the pinned end,
 * largest at x = L (1 + sqrt 33) / 16 (AISC Steel Construction Manual Table 3-23 case 12, from memory).
 */
import { describe, expect, it } from "vitest";
import { checkMember } from "../../../../../lib/engine/check-member";
import { getCrackedSection, getCrackingMomentNmm } from "../../../../../lib/engine/concrete/cracked-section";
import { solveCrackedState } from "../../../../../lib/engine/concrete/cracked-state";
import { EngineInputError } from "../../../../../lib/engine/solver";
import type { LimitProfile, Member, ReinforcedConcreteSection } from "../../../../../lib/engine/model";

const EC_MPA = 4700 * Math.sqrt(30); // ACI 318-19 19.2.2.1(b) (from memory)
const ES_MPA = 200_000; // ACI 318-19 20.2.2.2 (from memory)
const N = ES_MPA / EC_MPA;
const B = 300;
const H = 500;
const D = 440;
const AS = 1473;
const A_TOP = 2454;
const D_TOP = 445;
const IG = (B * H ** 3) / 12;
const BOTTOM: ReinforcedConcreteSection = { webWidthMm: B, depthMm: H, tensionSteelMm2: AS, effectiveDepthMm: D, steelEMpa: ES_MPA, ruptureMpa: 0.62 * Math.sqrt(30) };
const WITH_TOP: ReinforcedConcreteSection = { ...BOTTOM, topSteelMm2: A_TOP, topEffectiveDepthMm: D_TOP };

/** PCA Notes Table 8-2, rectangle, tension A_s at d and compression A's at d' (A's = 0: singly reinforced). */
function getDoublyReinforcedICr(tensionMm2: number, dMm: number, compressionMm2: number, dPrimeMm: number): number {
  const b1 = B / (N * tensionMm2);
  const r = ((N - 1) * compressionMm2) / (N * tensionMm2);
  const kd = (Math.sqrt(2 * dMm * b1 * (1 + (r * dPrimeMm) / dMm) + (1 + r) ** 2) - (1 + r)) / b1;
  return (B * kd ** 3) / 3 + N * tensionMm2 * (dMm - kd) ** 2 + (N - 1) * compressionMm2 * (kd - dPrimeMm) ** 2;
}

describe("cracked section under hogging", () => {
  it("with top steel: A_s,top at d_top in tension, the bottom steel at h - d in compression", () => {
    const expected = getDoublyReinforcedICr(A_TOP, D_TOP, AS, H - D);
    expect(getCrackedSection(WITH_TOP, EC_MPA, "hogging").iCrMm4 / expected).toBeCloseTo(1, 10);
    // sagging is unchanged by the top steel
    expect(getCrackedSection(WITH_TOP, EC_MPA, "sagging").iCrMm4).toBe(getCrackedSection(BOTTOM, EC_MPA, "sagging").iCrMm4);
  });

  it("without top steel, hogging takes the layout as given: a cantilever's tension steel is its top steel", () => {
    const doubly: ReinforcedConcreteSection = { ...BOTTOM, compressionSteelMm2: 628, compressionDepthMm: 60 };
    expect(getCrackedSection(doubly, EC_MPA, "hogging").iCrMm4 / getDoublyReinforcedICr(AS, D, 628, 60)).toBeCloseTo(1, 10);
  });
});

describe("a propped cantilever, where the hogging moment wL^2/8 at the fixed end governs I_e", () => {
  const L = 6000;
  const W = 25; // N/mm, dead 15 + live 10
  const profile: LimitProfile = { id: "aci", label: "dead + live", source: "ACI 318-19 Table 24.2.2 (from memory)", cantileverSpanMultiplier: 1, combinations: [{ id: "D+L", label: "dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 }] };
  const createMember = (section: ReinforcedConcreteSection): Member => ({
    mark: "RC3",
    category: "floor_beam",
    quantity: 1,
    supports: [{ kind: "roller" }, { kind: "fixed" }],
    spans: [{ lengthMm: L, eMpa: EC_MPA, iMm4: IG, reinforcedConcrete: section }],
    loads: [{ kind: "uniform", loadCase: "dead", wNPerMm: 15 }, { kind: "uniform", loadCase: "live", wNPerMm: 10 }],
  });
  const mCr = getCrackingMomentNmm(BOTTOM);
  const mA = (W * L * L) / 8;
  // largest sagging moment of the propped cantilever: 9wL^2/128 (AISC Table 3-23 case 12, from memory)
  const mSagging = (9 * W * L * L) / 128;
  const effective = (iCr: number, moment = mA): number => iCr / (1 - ((2 / 3) * mCr / moment) ** 2 * (1 - iCr / IG));
  const x = (L * (1 + Math.sqrt(33))) / 16;
  const deflection = (i: number): number => (W * x * (L ** 3 - 3 * L * x * x + 2 * x ** 3)) / (48 * EC_MPA * i);

  it("with top steel: the lower of I_e at the fixed end (top steel's I_cr) and at the largest sagging moment", () => {
    const hogging = effective(getDoublyReinforcedICr(A_TOP, D_TOP, AS, H - D));
    const sagging = effective(getDoublyReinforcedICr(AS, D, 0, 0), mSagging);
    const result = checkMember(createMember(WITH_TOP), profile);
    expect(result.checks[0]!.deflectionMm).toBeCloseTo(deflection(Math.min(hogging, sagging)), 6);
    // with ten times the top steel the sagging section governs: the span is never stiffer than its softer section
    const heavyTop = { ...WITH_TOP, topSteelMm2: 0.08 * B * D_TOP };
    const heavy = checkMember(createMember(heavyTop), profile).checks[0]!.deflectionMm;
    expect(heavy).toBeCloseTo(deflection(Math.min(effective(getDoublyReinforcedICr(heavyTop.topSteelMm2, D_TOP, AS, H - D)), sagging)), 6);
    expect(heavy).toBeCloseTo(deflection(sagging), 6);
  });

  // Any guess of the unknown top steel (the bottom steel mirrored, say) overstates the stiffness
  // whenever the real top steel is lighter: the member is refused on the field it lacks.
  it("without top steel: refused on spans[0] topSteel, naming the fixed end", () => {
    try {
      checkMember(createMember(BOTTOM), profile);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(EngineInputError);
      const issues = (error as EngineInputError).issues;
      expect(issues.map((issue) => issue.path)).toEqual(["spans[0].reinforcedConcrete.topSteelMm2"]);
      expect(issues[0]!.message).toContain("fixed end");
      expect(issues[0]!.message).toContain("topSteel");
    }
  });

  it("the solver refuses a cracking hogging state without top steel even past validation", () => {
    expect(() => solveCrackedState(createMember(BOTTOM), { dead: 1, live: 1 })).toThrow(/hogging \(negative\) moment past \(2\/3\) M_cr/);
    // below (2/3) M_cr, I_e = I_g whatever the steel (Table 24.2.3.5): nothing is missing
    const light: Member = { ...createMember(BOTTOM), loads: [{ kind: "uniform", loadCase: "dead", wNPerMm: 1 }] };
    expect(solveCrackedState(light, { dead: 1 }).inertiaMm4[0]).toBe(IG);
  });

  it("a simple span (sagging only) needs no top steel", () => {
    const simple = { ...createMember(BOTTOM), supports: [{ kind: "pinned" as const }, { kind: "roller" as const }] };
    expect(checkMember(simple, profile).checks[0]!.deflectionMm).toBeGreaterThan(0);
  });

  it("a simple span with an applied moment or an upward load can hog: top steel is required", () => {
    const simple = { ...createMember(BOTTOM), supports: [{ kind: "pinned" as const }, { kind: "roller" as const }] };
    const withMoment: Member = { ...simple, loads: [...simple.loads, { kind: "moment", loadCase: "dead", atMm: 0, mNmm: -5e7 }] };
    expect(() => checkMember(withMoment, profile)).toThrow(/applied moment/);
    const uplift: Member = { ...simple, loads: [...simple.loads, { kind: "point", loadCase: "live", atMm: 3000, pN: -20_000 }] };
    expect(() => checkMember(uplift, profile)).toThrow(/upward load/);
  });

  it("a cantilever of overhangs only: its given steel is top steel; net uplift past cracking is refused", () => {
    const cantilever = (w: number): Member => ({
      mark: "RC4",
      category: "floor_beam",
      quantity: 1,
      supports: [{ kind: "fixed" }, { kind: "free" }],
      spans: [{ lengthMm: 2000, eMpa: EC_MPA, iMm4: IG, reinforcedConcrete: BOTTOM }],
      loads: [{ kind: "uniform", loadCase: "dead", wNPerMm: w }],
    });
    const dead: LimitProfile = { ...profile, combinations: [{ id: "D", label: "dead", factors: { dead: 1 }, limitRatio: 180 }] };
    // M = w L^2 / 2 = 6e7 N*mm against (2/3) M_cr = (2/3) f_r I_g / (h/2) = 2.83e7 N*mm
    expect(checkMember(cantilever(30), dead).checks[0]!.deflectionMm).toBeGreaterThan(0);
    expect(() => checkMember(cantilever(-30), dead)).toThrow(/sags \(net upward load\)/);
  });

  it("top steel without its depth, or deeper than h, is refused on its field", () => {
    const missing = { ...BOTTOM, topSteelMm2: A_TOP };
    expect(() => checkMember(createMember(missing), profile)).toThrow(EngineInputError);
    try {
      checkMember(createMember({ ...BOTTOM, topSteelMm2: A_TOP, topEffectiveDepthMm: 520 }), profile);
      expect.unreachable();
    } catch (error) {
      expect((error as EngineInputError).issues.map((issue) => issue.path)).toEqual(["spans[0].reinforcedConcrete.topEffectiveDepthMm"]);
    }
  });
});
