/**
 * Reinforced concrete members beyond the simple span: pattern live load on a span with an
 * overhang, a spring support judged from the chord, and top steel under hogging. Internal units
 * (mm, N, MPa). Expected values are the published formulas written out here, independently of the
 * engine: PCA Notes on ACI 318, Table 8-2 for the transformed cracked section; ACI 318-19 Table
 * 24.2.3.5 for I_e, 24.2.4.1.1 for lambda_Delta; AISC Steel Construction Manual Table 3-23 cases
 * 1, 9 and 22 for the end slopes of a simple span (wL^3/(24EI) under uniform load, ML/(3EI) under
 * an end moment) and the cantilever tip (wL^4/(8EI)). All recalled from memory of those
 * publications. The member is invented for the cases.
 */
import { checkMember } from "@/lib/engine/check-member";
import { getCrackedSection } from "@/lib/engine/concrete/cracked-section";
import type { LimitProfile, Member, ReinforcedConcreteSection, Support } from "@/lib/engine/model";

import type { ClosedFormCase } from "./closed-form-cases";

const EC = 4700 * Math.sqrt(30); // ACI 318-19 19.2.2.1(b)
const ES = 200_000; // ACI 318-19 20.2.2.2
const N = ES / EC;
const FR = 0.62 * Math.sqrt(30); // ACI 318-19 19.2.3.1
const B = 300;
const H = 500;
const D = 440;
const AS = 1473;
const IG = (B * H ** 3) / 12;
const MCR = (FR * IG) / (H / 2);
const L = 6000; // back span
const A = 2400; // overhang
const W_DEAD = 15;
const W_LIVE = 10;
const LAMBDA = 2; // xi = 2.0 (five years), rho' = 0

const A_TOP = 2454;
const D_TOP = 445;
// the overhang hogs the member over its support, so the member gives its top steel (hogging-causes.ts)
const MEMBER_TOP = 1473;
const section: ReinforcedConcreteSection = { webWidthMm: B, depthMm: H, tensionSteelMm2: AS, effectiveDepthMm: D, topSteelMm2: MEMBER_TOP, topEffectiveDepthMm: D_TOP, steelEMpa: ES, ruptureMpa: FR };

/** PCA Notes Table 8-2, rectangle b x h, tension A_s at d, compression A's at d' (0: none). */
function getICr(tension: number, d: number, compression: number, dPrime: number): number {
  const b1 = B / (N * tension);
  const r = ((N - 1) * compression) / (N * tension);
  const kd = (Math.sqrt(2 * d * b1 * (1 + (r * dPrime) / d) + (1 + r) ** 2) - (1 + r)) / b1;
  return (B * kd ** 3) / 3 + N * tension * (d - kd) ** 2 + (N - 1) * compression * (kd - dPrime) ** 2;
}

// sagging: the bottom steel alone; hogging: the top steel in tension, the bottom steel at h - d in compression
const ICR_SAGGING = getICr(AS, D, 0, 0);
const ICR_HOGGING = getICr(MEMBER_TOP, D_TOP, AS, H - D);
/** I_e (Table 24.2.3.5) at a signed moment, + sagging. */
function effective(moment: number): number {
  const iCr = moment >= 0 ? ICR_SAGGING : ICR_HOGGING;
  return Math.abs(moment) <= (2 / 3) * MCR ? IG : iCr / (1 - ((2 / 3) * MCR / Math.abs(moment)) ** 2 * (1 - iCr / IG));
}

/** Largest-magnitude moment of the back span under w1 (signed, + sagging), with the overhang's w2 hogging it at the support. */
function getBackSpanMoment(w1: number, w2: number): number {
  const mB = (w2 * A * A) / 2;
  const x = L / 2 - mB / (w1 * L);
  const sagging = x > 0 ? (w1 * x * (L - x)) / 2 - (mB * x) / L : 0;
  return sagging >= mB ? sagging : -mB;
}

/** Overhang tip (mm, + down): w2 a^4/(8 E I2) + a (M_B L/3 - w1 L^3/24) / (E I1), M_B = w2 a^2/2. */
function getTip(w1: number, w2: number, i1: number, i2: number): number {
  const mB = (w2 * A * A) / 2;
  return (w2 * A ** 4) / (8 * EC * i2) + (A * ((mB * L) / 3 - (w1 * L ** 3) / 24)) / (EC * i1);
}

const crackedTip = (w1: number, w2: number, load: { w1: number; w2: number } = { w1, w2 }): number =>
  getTip(load.w1, load.w2, effective(getBackSpanMoment(w1, w2)), effective(-(w2 * A * A) / 2));

const profile: LimitProfile = {
  id: "verification-aci-members",
  label: "live and after attachment",
  source: "ACI 318-19 Table 24.2.2 (from memory)",
  cantileverSpanMultiplier: 1,
  combinations: [
    { id: "live", label: "live", factors: { live: 1 }, limitRatio: 360 },
    { id: "after", label: "after attachment", factors: { live: 1 }, sustainedFactors: { dead: 1 }, creep: "material", limitRatio: 240 },
  ],
};

function createMember(supports: Support[], loads: Member["loads"], spanSection: ReinforcedConcreteSection = section, spans: number[] = [L, A]): Member {
  return { mark: "V-RC2", category: "floor_beam", quantity: 1, supports, spans: spans.map((lengthMm) => ({ lengthMm, eMpa: EC, iMm4: IG, reinforcedConcrete: spanSection })), loads, materialCreepFactor: LAMBDA };
}

function getCheck(member: Member, combinationId: string, span: number, patterns = true): number {
  const result = checkMember(member, patterns ? profile : { ...profile, patternLoads: false });
  return result.checks.find((check) => check.combinationId === combinationId && check.spanIndex === span)!.deflectionMm;
}

const K_SPRING = 20_000; // N/mm
const settlement = (w: number): number => (w * L) / (2 * K_SPRING);
const chordTip = (w: number): number => A * (settlement(w) / L - (w * L ** 3) / (24 * EC * effective((w * L * L) / 8)));

export const crackedMemberCases: ClosedFormCase[] = [
  {
    id: "rc-overhang-pattern-after",
    title: "RC span 6 m with a 2.4 m overhang, dead 15 + live 10 kN/m, live patterned; b 300 x h 500, d 440, A_s 1,473 mm^2, top A_s,top 1,473 mm^2 at d_top 445 mm, f'c 30 MPa",
    quantity: "overhang tip, after attachment, live on the back span alone (the tip rises)",
    formula: "Delta(D + L_back, I_e at D + L_back) - Delta(D, I_e at D) + lambda Delta(D, I_e at D + L_back); tip = w2 a^4/(8EI2) + a (M_B L/3 - w1 L^3/24)/(EI1)",
    source: "ACI 318-19 Table 24.2.3.5, 24.2.4.1.1 and R24.2.3; AISC Steel Construction Manual Table 3-23 cases 1, 9 and 22; PCA Notes on ACI 318 Table 8-2 (all from memory)",
    expected: crackedTip(W_DEAD + W_LIVE, W_DEAD) - crackedTip(W_DEAD, W_DEAD) + LAMBDA * crackedTip(W_DEAD + W_LIVE, W_DEAD, { w1: W_DEAD, w2: W_DEAD }),
    unit: "mm",
    compute: () => getCheck(createMember([{ kind: "pinned" }, { kind: "roller" }, { kind: "free" }], [{ kind: "uniform", loadCase: "dead", wNPerMm: W_DEAD }, { kind: "uniform", loadCase: "live", wNPerMm: W_LIVE }]), "after", 1),
  },
  {
    id: "rc-spring-chord",
    title: "The same member on a 20 kN/mm spring at the overhang's support, loads on the back span only",
    quantity: "overhang tip from the level line through its support, immediate live",
    formula: "a (wL/(2k L) - wL^3/(24 E I_e)) at D + L minus the same at D; settlement wL/(2k) reported beside it",
    source: "ACI 318-19 Table 24.2.3.5 and R24.2.3; AISC Steel Construction Manual Table 3-23 case 1 (all from memory); statics",
    expected: chordTip(W_DEAD + W_LIVE) - chordTip(W_DEAD),
    unit: "mm",
    compute: () =>
      getCheck(
        createMember([{ kind: "pinned" }, { kind: "spring", springNPerMm: K_SPRING }, { kind: "free" }], [
          { kind: "uniform", loadCase: "dead", wNPerMm: W_DEAD, startMm: 0, endMm: L },
          { kind: "uniform", loadCase: "live", wNPerMm: W_LIVE, startMm: 0, endMm: L },
        ]),
        "live",
        1,
        false,
      ),
  },
  {
    id: "rc-icr-hogging-top",
    title: "Cracked section under hogging with top steel A_s,top 2,454 mm^2 at d_top 445 mm (bottom A_s 1,473 mm^2 at h - d = 60 mm in compression)",
    quantity: "cracked transformed I_cr, negative moment",
    formula: "r = (n - 1)A's/(nA_s); kd = (sqrt(2dB(1 + rd'/d) + (1 + r)^2) - (1 + r))/B; I_cr = b kd^3/3 + nA_s(d - kd)^2 + (n - 1)A's(kd - d')^2",
    source: "PCA Notes on ACI 318, Table 8-2 (from memory)",
    expected: getICr(A_TOP, D_TOP, AS, H - D),
    unit: "mm^4",
    compute: () => getCrackedSection({ ...section, topSteelMm2: A_TOP }, EC, "hogging").iCrMm4,
  },
];
