/**
 * Pattern (partial) live load cases for the verification page: the engine's worst arrangement of
 * a uniform live load against closed forms for the arrangement that governs. Uniform EI,
 * Euler-Bernoulli, internal units (mm, N, MPa). Sources are named beside each case and were
 * recalled from memory of those publications; the three-moment results follow from Clapeyron's
 * theorem directly.
 */
import { checkMember } from "@/lib/engine/check-member";
import type { LimitProfile, Member, SupportKind } from "@/lib/engine/model";

import { CASE_E_MPA, CASE_I_MM4, type ClosedFormCase } from "./closed-form-cases";

const EI = CASE_E_MPA * CASE_I_MM4;
const W = 10; // N/mm

const liveOnly: LimitProfile = {
  id: "verification-pattern",
  label: "Live load, patterned",
  source: "verification",
  cantileverSpanMultiplier: 2,
  combinations: [{ id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 }],
};

function createLiveMember(lengthsMm: number[], supports: SupportKind[]): Member {
  return {
    mark: "V",
    category: "other",
    quantity: 1,
    spans: lengthsMm.map((lengthMm) => ({ lengthMm, eMpa: CASE_E_MPA, iMm4: CASE_I_MM4 })),
    supports: supports.map((kind) => ({ kind })),
    loads: [{ kind: "uniform", loadCase: "live", wNPerMm: W }],
  };
}

function getCheckDeflection(member: Member, spanIndex: number): number {
  const check = checkMember(member, liveOnly).checks.find((c) => c.spanIndex === spanIndex);
  return check === undefined ? Number.NaN : check.deflectionMm;
}

/** Root of 16 t^3 - 21 t^2 + 3 in (0, 1) by bisection: where the loaded span's slope is zero. */
function getTwoSpanPeakRatio(): number {
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (16 * mid ** 3 - 21 * mid ** 2 + 3 > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

const L2 = 6000;
const t = getTwoSpanPeakRatio();
const L3 = 5000;
const l = 4000;
const a = 2000;
const lLong = 6000;

export const patternCases: ClosedFormCase[] = [
  {
    id: "pattern-two-span-one-loaded",
    title: "Two equal continuous spans, live load on every span as given",
    quantity: "span 1 judged with only span 1 loaded: largest deflection",
    formula: "w L^4 / EI x [t (1 - 2t^2 + t^3) / 24 - t (1 - t^2) / 96], 16t^3 - 21t^2 + 3 = 0 (about 0.0092 w L^4 / EI at 0.472 L)",
    source: "AISC Steel Construction Manual, Table 3-23, continuous beam, two equal spans, uniform load on one span (from memory); M_B = w L^2 / 16 by the three-moment equation",
    expected: ((W * L2 ** 4) / EI) * ((t * (1 - 2 * t * t + t ** 3)) / 24 - (t * (1 - t * t)) / 96),
    unit: "mm",
    compute: () => getCheckDeflection(createLiveMember([L2, L2], ["pinned", "roller", "roller"]), 0),
  },
  {
    id: "pattern-three-span-middle",
    title: "Three equal continuous spans, live load on every span as given",
    quantity: "middle span judged with only itself loaded: midspan deflection",
    formula: "(5/384 - 1/160) w L^4 / EI",
    source: "Three-moment equation (Clapeyron): middle span loaded alone gives M_B = M_C = w L^2 / 20; AISC Manual Table 3-23 case 1 with end moments (from memory)",
    expected: ((5 / 384 - 1 / 160) * W * L3 ** 4) / EI,
    unit: "mm",
    compute: () => getCheckDeflection(createLiveMember([L3, L3, L3], ["pinned", "roller", "roller", "roller"]), 1),
  },
  {
    id: "pattern-overhang-tip-down",
    title: "Beam overhanging one support (l = 4 m, a = 2 m), live load everywhere as given",
    quantity: "tip judged with the back span unloaded: tip deflection",
    formula: "w a^3 (4l + 3a) / (24EI)",
    source: "AISC Steel Construction Manual, Table 3-23, beam overhanging one support, uniform load on overhang (from memory)",
    expected: (W * a ** 3 * (4 * l + 3 * a)) / (24 * EI),
    unit: "mm",
    compute: () => getCheckDeflection(createLiveMember([l, a], ["pinned", "roller", "free"]), 1),
  },
  {
    id: "pattern-overhang-tip-up",
    title: "Beam overhanging one support (l = 6 m, a = 2 m), live load everywhere as given",
    quantity: "tip judged with the overhang unloaded: tip uplift (negative = upward)",
    formula: "-w l^3 a / (24EI)",
    source: "AISC Steel Construction Manual, Table 3-23, beam overhanging one support, uniform load between supports (from memory)",
    expected: -(W * lLong ** 3 * a) / (24 * EI),
    unit: "mm",
    compute: () => getCheckDeflection(createLiveMember([lLong, a], ["pinned", "roller", "free"]), 1),
  },
];
