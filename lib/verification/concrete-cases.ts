/**
 * Reinforced concrete verification cases: cracked section, cracking moment, effective I and the
 * deflections and long-term factor built on them, for the unit test and the verification page.
 * Internal units (mm, N, MPa). Each expected value is the published formula written out here,
 * independently of the engine: PCA Notes on ACI 318, Table 8-2 for the transformed cracked
 * section; ACI 318-19 24.2.3.5 and Table 24.2.3.5 for M_cr and I_e; 24.2.4.1.1 and Table
 * 24.2.4.1.3 for lambda_Delta; AISC Steel Construction Manual Table 3-23 case 1 for 5wL^4/(384EI).
 * All recalled from memory of those publications. The section is invented for the cases.
 */
import { checkMember } from "@/lib/engine/check-member";
import { getCrackedSection, getCrackingMomentNmm } from "@/lib/engine/concrete/cracked-section";
import { getEffectiveInertiaMm4 } from "@/lib/engine/concrete/effective-inertia";
import { parseSchedule } from "@/lib/engine/intake";
import type { LimitProfile, Member, ReinforcedConcreteSection } from "@/lib/engine/model";

import type { ClosedFormCase } from "./closed-form-cases";

const FC_MPA = 30;
const EC = 4700 * Math.sqrt(FC_MPA); // ACI 318-19 19.2.2.1(b)
const ES = 200_000; // ACI 318-19 20.2.2.2
const N = ES / EC;
const FR = 0.62 * Math.sqrt(FC_MPA); // ACI 318-19 19.2.3.1, normal weight
const B = 300;
const H = 500;
const D = 440;
const AS = 1473;
const ASC = 628;
const DC = 60;
const IG = (B * H ** 3) / 12;
const L = 6000;
const W_DEAD = 15;
const W_LIVE = 10;

const rectangle: ReinforcedConcreteSection = { webWidthMm: B, depthMm: H, tensionSteelMm2: AS, effectiveDepthMm: D, steelEMpa: ES, ruptureMpa: FR };

// PCA Notes on ACI 318, Table 8-2, without compression steel: B' = b/(nA_s), kd = (sqrt(2dB' + 1) - 1)/B'
const B1 = B / (N * AS);
const KD = (Math.sqrt(2 * D * B1 + 1) - 1) / B1;
const ICR = (B * KD ** 3) / 3 + N * AS * (D - KD) ** 2;
// with compression steel: r = (n - 1)A's/(nA_s), kd = (sqrt(2dB'(1 + rd'/d) + (1 + r)^2) - (1 + r))/B'
const R = ((N - 1) * ASC) / (N * AS);
const KD2 = (Math.sqrt(2 * D * B1 * (1 + (R * DC) / D) + (1 + R) ** 2) - (1 + R)) / B1;
const ICR2 = (B * KD2 ** 3) / 3 + N * AS * (D - KD2) ** 2 + (N - 1) * ASC * (KD2 - DC) ** 2;
// flanged, neutral axis in the web: C = b_w/(nA_s), f = h_f(b - b_w)/(nA_s)
const TEE = { bf: 1200, hf: 100, bw: 300, h: 600, as: 4900, d: 530 };
const C = TEE.bw / (N * TEE.as);
const F = (TEE.hf * (TEE.bf - TEE.bw)) / (N * TEE.as);
const KDT = (Math.sqrt(C * (2 * TEE.d + TEE.hf * F) + (1 + F) ** 2) - (1 + F)) / C;
const ICRT = ((TEE.bf - TEE.bw) * TEE.hf ** 3) / 12 + (TEE.bw * KDT ** 3) / 3 + (TEE.bf - TEE.bw) * TEE.hf * (KDT - TEE.hf / 2) ** 2 + N * TEE.as * (TEE.d - KDT) ** 2;

const MCR = (FR * IG) / (H / 2);
const effective = (mA: number): number => (mA <= (2 / 3) * MCR ? IG : ICR / (1 - ((2 / 3) * MCR / mA) ** 2 * (1 - ICR / IG)));
const M_TOTAL = ((W_DEAD + W_LIVE) * L * L) / 8;
const M_DEAD = (W_DEAD * L * L) / 8;
const deflection = (w: number, i: number): number => (5 * w * L ** 4) / (384 * EC * i);

const profile: LimitProfile = {
  id: "verification-aci",
  label: "live and dead + live",
  source: "ACI 318-19 Table 24.2.2 (from memory)",
  cantileverSpanMultiplier: 1,
  combinations: [
    { id: "live", label: "live", factors: { live: 1 }, limitRatio: 360 },
    { id: "dead+live", label: "dead + live", factors: { dead: 1, live: 1 }, limitRatio: 240 },
  ],
};

const beam: Member = {
  mark: "V-RC",
  category: "floor_beam",
  quantity: 1,
  supports: [{ kind: "pinned" }, { kind: "roller" }],
  spans: [{ lengthMm: L, eMpa: EC, iMm4: IG, reinforcedConcrete: rectangle }],
  loads: [
    { kind: "uniform", loadCase: "dead", wNPerMm: W_DEAD },
    { kind: "uniform", loadCase: "live", wNPerMm: W_LIVE },
  ],
};

function getDeflection(combinationId: string): number {
  const result = checkMember(beam, profile);
  return result.checks.find((check) => check.combinationId === combinationId)!.deflectionMm;
}

function getParsedCreepFactor(): number {
  const parsed = parseSchedule({
    format: "sagline.schedule/v2",
    name: "Verification RC beam (invented)",
    units: { system: "SI" },
    profile: { preset: "aci-318-19-floor" },
    members: [
      {
        mark: "V-RC",
        category: "floor_beam",
        quantity: 1,
        material: "concrete-fc30",
        section: { shape: "rectangle", b: B, h: H },
        reinforcement: { tensionSteel: AS, effectiveDepth: D, compressionSteel: ASC, compressionDepth: DC },
        creep: { method: "aci", durationMonths: 60 },
        spans: [L / 1000],
        supports: ["pinned", "roller"],
        loads: [{ case: "dead", type: "uniform", w: W_DEAD }],
      },
    ],
  });
  if (!parsed.ok) throw new Error(parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; "));
  return parsed.schedule.members[0]!.materialCreepFactor!;
}

const SECTION_TEXT = "b 300 x h 500 mm, d 440 mm, A_s 1,473 mm^2, f'c 30 MPa";

export const concreteCases: ClosedFormCase[] = [
  {
    id: "rc-icr-singly",
    title: `Cracked section, rectangle, tension steel only (${SECTION_TEXT})`,
    quantity: "cracked transformed I_cr",
    formula: "kd = (sqrt(2dB + 1) - 1)/B, B = b/(nA_s); I_cr = b kd^3/3 + nA_s(d - kd)^2, n = E_s/E_c",
    source: "PCA Notes on ACI 318, Table 8-2 (from memory); E_c = 4,700 sqrt(f'c) per ACI 318-19 19.2.2.1(b), E_s = 200,000 MPa per 20.2.2.2",
    expected: ICR,
    unit: "mm^4",
    compute: () => getCrackedSection(rectangle, EC, "sagging").iCrMm4,
  },
  {
    id: "rc-icr-doubly",
    title: "Cracked section, rectangle with compression steel A's 628 mm^2 at d' 60 mm",
    quantity: "cracked transformed I_cr",
    formula: "r = (n - 1)A's/(nA_s); kd = (sqrt(2dB(1 + rd'/d) + (1 + r)^2) - (1 + r))/B; I_cr = b kd^3/3 + nA_s(d - kd)^2 + (n - 1)A's(kd - d')^2",
    source: "PCA Notes on ACI 318, Table 8-2 (from memory)",
    expected: ICR2,
    unit: "mm^4",
    compute: () => getCrackedSection({ ...rectangle, compressionSteelMm2: ASC, compressionDepthMm: DC }, EC, "sagging").iCrMm4,
  },
  {
    id: "rc-icr-flanged",
    title: "Cracked section, T: b_f 1,200, h_f 100, b_w 300, h 600, d 530 mm, A_s 4,900 mm^2",
    quantity: "cracked transformed I_cr (neutral axis in the web)",
    formula: "C = b_w/(nA_s), f = h_f(b - b_w)/(nA_s); kd = (sqrt(C(2d + h_f f) + (1 + f)^2) - (1 + f))/C; I_cr = (b - b_w)h_f^3/12 + b_w kd^3/3 + (b - b_w)h_f(kd - h_f/2)^2 + nA_s(d - kd)^2",
    source: "PCA Notes on ACI 318, Table 8-2 (from memory)",
    expected: ICRT,
    unit: "mm^4",
    compute: () =>
      getCrackedSection(
        { webWidthMm: TEE.bw, depthMm: TEE.h, flangeWidthMm: TEE.bf, flangeThicknessMm: TEE.hf, tensionSteelMm2: TEE.as, effectiveDepthMm: TEE.d, steelEMpa: ES, ruptureMpa: FR },
        EC,
        "sagging",
      ).iCrMm4,
  },
  {
    id: "rc-mcr",
    title: `Cracking moment (${SECTION_TEXT})`,
    quantity: "M_cr",
    formula: "M_cr = f_r I_g / y_t, f_r = 0.62 sqrt(f'c) MPa, I_g = bh^3/12, y_t = h/2",
    source: "ACI 318-19 24.2.3.5 and 19.2.3.1 (from memory)",
    expected: MCR,
    unit: "N*mm",
    compute: () => getCrackingMomentNmm(rectangle),
  },
  {
    id: "rc-ie",
    title: "Effective I at M_a = (15 + 10) kN/m x 6^2 m^2 / 8 = 112.5 kN*m",
    quantity: "I_e",
    formula: "I_e = I_cr / (1 - ((2/3) M_cr / M_a)^2 (1 - I_cr / I_g)) for M_a > (2/3) M_cr",
    source: "ACI 318-19 Table 24.2.3.5 (from memory)",
    expected: effective(M_TOTAL),
    unit: "mm^4",
    compute: () => getEffectiveInertiaMm4(IG, getCrackedSection(rectangle, EC, "sagging").iCrMm4, getCrackingMomentNmm(rectangle), M_TOTAL),
  },
  {
    id: "rc-deflection-total",
    title: "Simply supported RC beam, 6 m, dead 15 + live 10 kN/m",
    quantity: "dead + live deflection with I_e",
    formula: "5wL^4 / (384 E_c I_e), I_e at M_a = wL^2/8",
    source: "AISC Steel Construction Manual Table 3-23 case 1; ACI 318-19 Table 24.2.3.5 (from memory)",
    expected: deflection(W_DEAD + W_LIVE, effective(M_TOTAL)),
    unit: "mm",
    compute: () => getDeflection("dead+live"),
  },
  {
    id: "rc-deflection-live",
    title: "Simply supported RC beam, 6 m, dead 15 + live 10 kN/m",
    quantity: "immediate live deflection (incremental)",
    formula: "Delta(D + L, I_e at D + L) - Delta(D, I_e at D)",
    source: "ACI 318-19 24.2.3 and its commentary R24.2.3 (from memory); AISC Manual Table 3-23 case 1",
    expected: deflection(W_DEAD + W_LIVE, effective(M_TOTAL)) - deflection(W_DEAD, effective(M_DEAD)),
    unit: "mm",
    compute: () => getDeflection("live"),
  },
  {
    id: "rc-lambda",
    title: "Long-term factor, five years, A's 628 mm^2 on b 300 x d 440 mm",
    quantity: "lambda_Delta (the member's creep factor)",
    formula: "lambda_Delta = xi / (1 + 50 rho'), rho' = A's/(b d), xi = 2.0",
    source: "ACI 318-19 24.2.4.1.1 and Table 24.2.4.1.3 (from memory)",
    expected: 2 / (1 + (50 * ASC) / (B * D)),
    unit: "ratio",
    compute: getParsedCreepFactor,
  },
];
