/**
 * Verification cases for what each preset's clause requires: the load combination the clause
 * names and the length a cantilever is judged on. Each case runs a preset through checkMember on
 * a uniform beam and compares one check's deflection or allowed deflection with the clause's rule
 * written out with the handbook deflection (AISC Steel Construction Manual Table 3-23, cases 1
 * and 22, from memory). Internal units (mm, N, MPa). The verification page lists these beside the
 * closed-form cases.
 */
import { checkMember } from "@/lib/engine/check-member";
import type { CheckResult, Load, Member, SupportKind } from "@/lib/engine/model";
import { getPreset, type PresetOptions } from "@/lib/engine/presets";

import { CASE_E_MPA, CASE_I_MM4, type ClosedFormCase } from "./closed-form-cases";

const EI = CASE_E_MPA * CASE_I_MM4;
const L = 6000;
const CANTILEVER_MM = 2000;
const W_DEAD = 3; // N/mm
const W_LIVE = 4; // N/mm
const LAMBDA = 2; // ACI 318-19 24.2.4.1: xi = 2.0 (five years or more), rho' = 0 (from memory)

/** AISC Manual Table 3-23 case 1 (from memory): simple beam, uniform load, midspan 5wL^4/(384EI). */
const simpleSpanMm = (w: number): number => (5 * w * L ** 4) / (384 * EI);

type Field = "deflectionMm" | "allowedMm";

interface CaseMember {
  supports: SupportKind[];
  lengthMm: number;
  extra: Partial<Member>;
}

function createCaseMember({ supports, lengthMm, extra }: CaseMember): Member {
  const loads: Load[] = [
    { kind: "uniform", loadCase: "dead", wNPerMm: W_DEAD },
    { kind: "uniform", loadCase: "live", wNPerMm: W_LIVE },
  ];
  return { mark: "V", category: "other", quantity: 1, spans: [{ lengthMm, eMpa: CASE_E_MPA, iMm4: CASE_I_MM4 }], supports: supports.map((kind) => ({ kind })), loads, ...extra };
}

function runPresetCheck(presetId: string, options: PresetOptions, member: CaseMember, combinationId: string, field: Field): number {
  const preset = getPreset(presetId, options);
  if (!preset) throw new Error(`no preset ${presetId}`);
  const check: CheckResult | undefined = checkMember(createCaseMember(member), preset).checks.find((c) => c.combinationId === combinationId);
  if (!check) throw new Error(`preset ${presetId} has no check ${combinationId}`);
  return check[field];
}

const simpleBeam = (extra: Partial<Member>): CaseMember => ({ supports: ["pinned", "roller"], lengthMm: L, extra });
const cantilever = (extra: Partial<Member>): CaseMember => ({ supports: ["fixed", "free"], lengthMm: CANTILEVER_MM, extra });

function createIbcDeadPlusLiveCase(id: string, material: string, k: number, source: string): ClosedFormCase {
  return {
    id: `ibc-dead-live-${id}`,
    title: `IBC 2021 D + L row, ${material}`,
    quantity: "deflection judged at l/240: creep component K x dead + immediate live",
    formula: `5 (w_L + ${k} w_D) L^4 / (384EI)`,
    source: `IBC 2021 Table 1604.3 and footnotes (from memory)${source}`,
    expected: simpleSpanMm(W_LIVE + k * W_DEAD),
    unit: "mm",
    compute: () => runPresetCheck("ibc-2021-floor", {}, simpleBeam({ ibcCreepComponentFactor: k }), "dead+live", "deflectionMm"),
  };
}

export const presetCases: ClosedFormCase[] = [
  createIbcDeadPlusLiveCase("steel", "steel (K = 0)", 0, ": dead taken as zero for steel"),
  createIbcDeadPlusLiveCase("wood-dry", "seasoned wood in dry use (K = 0.5)", 0.5, ": 0.5 D for wood dry at installation and in dry use"),
  createIbcDeadPlusLiveCase("wood-other", "other wood, or condition not given (K = 1.0)", 1, ": D for wood at other moisture conditions"),
  createIbcDeadPlusLiveCase("concrete", "concrete (K = lambda = 2 / (1 + 50 x 0.005) = 1.6)", 2 / (1 + 50 * 0.005), "; IBC 1604.3.2 and ACI 318-19 24.2.4.1 lambda = xi / (1 + 50 rho')"),
  {
    id: "conservative-immediate-total",
    title: "Conservative variant (not a code row): immediate dead + live",
    quantity: "deflection judged at l/240",
    formula: "5 (w_D + w_L) L^4 / (384EI)",
    source: "Sagline conservative variant (common practice), beside the IBC 2021 Table 1604.3 rows",
    expected: simpleSpanMm(W_DEAD + W_LIVE),
    unit: "mm",
    compute: () => runPresetCheck("floor-conservative-immediate-total", {}, simpleBeam({ ibcCreepComponentFactor: 0 }), "dead+live_immediate", "deflectionMm"),
  },
  {
    id: "ibc-cantilever-length",
    title: "IBC 2021: a cantilever judged on twice its length",
    quantity: "allowed live deflection of a 2 m cantilever",
    formula: "2 l / 360",
    source: "IBC 2021 Table 1604.3 footnote: for cantilevers, l is twice the cantilever's length (from memory)",
    expected: (2 * CANTILEVER_MM) / 360,
    unit: "mm",
    compute: () => runPresetCheck("ibc-2021-floor", {}, cantilever({ ibcCreepComponentFactor: 0 }), "live", "allowedMm"),
  },
  {
    id: "aci-cantilever-length",
    title: "ACI 318-19: a cantilever judged on its own length",
    quantity: "allowed immediate live deflection of a 2 m cantilever",
    formula: "l / 360",
    source: "ACI 318-19 Table 24.2.2: l is the member's length, no doubling (from memory)",
    expected: CANTILEVER_MM / 360,
    unit: "mm",
    compute: () => runPresetCheck("aci-318-19-floor", {}, cantilever({ materialCreepFactor: LAMBDA }), "live", "allowedMm"),
  },
  {
    id: "en1995-cantilever-ratio",
    title: "EN 1995-1-1: a cantilever's own w_inst ratio",
    quantity: "allowed w_inst of a 2 m cantilever",
    formula: "l / 150",
    source: "EN 1995-1-1 Table 7.2, cantilevering beams, least strict end of l/150 to l/250 (from memory)",
    expected: CANTILEVER_MM / 150,
    unit: "mm",
    compute: () => runPresetCheck("en1995-timber-floor", {}, cantilever({ materialCreepFactor: 0.6 }), "w_inst", "allowedMm"),
  },
  {
    id: "en1995-w-inst",
    title: "EN 1995-1-1 w_inst, characteristic combination",
    quantity: "w_inst judged at l/300",
    formula: "5 (w_D + w_L) L^4 / (384EI)",
    source: "EN 1995-1-1 2.2.3(2): instantaneous deflection for the characteristic combination (from memory)",
    expected: simpleSpanMm(W_DEAD + W_LIVE),
    unit: "mm",
    compute: () => runPresetCheck("en1995-timber-floor", {}, simpleBeam({ materialCreepFactor: 0.6 }), "w_inst", "deflectionMm"),
  },
  {
    id: "en1995-w-inst-q-na",
    title: "EN 1995-1-1 national-annex variant: w_inst of the variable action",
    quantity: "w_inst,Q judged at l/300",
    formula: "5 w_L L^4 / (384EI)",
    source: "National-annex choice beside EN 1995-1-1 7.2 (check the annex in use)",
    expected: simpleSpanMm(W_LIVE),
    unit: "mm",
    compute: () => runPresetCheck("en1995-timber-floor-na-variable-inst", {}, simpleBeam({ materialCreepFactor: 0.6 }), "w_inst_q", "deflectionMm"),
  },
  {
    id: "en1995-w-fin",
    title: "EN 1995-1-1 w_fin with k_def = 0.6, psi2 = 0.3",
    quantity: "w_fin judged at l/150",
    formula: "5 [w_D (1 + k_def) + w_L (1 + psi2 k_def)] L^4 / (384EI)",
    source: "EN 1995-1-1 2.2.3(5) and Table 3.2 (service class 1); psi2 from EN 1990 Table A1.1, categories A/B (from memory)",
    expected: simpleSpanMm(W_DEAD * 1.6 + W_LIVE * (1 + 0.3 * 0.6)),
    unit: "mm",
    compute: () => runPresetCheck("en1995-timber-floor", {}, simpleBeam({ materialCreepFactor: 0.6 }), "w_fin", "deflectionMm"),
  },
  {
    id: "aci-after-attachment-default",
    title: "ACI 318-19 after attachment, sustained live fraction 1.0 (default)",
    quantity: "deflection after attachment judged at l/240",
    formula: "5 [w_L + lambda (w_D + 1.0 w_L)] L^4 / (384EI), lambda = 2",
    source: "ACI 318-19 Table 24.2.2 and 24.2.4.1 (from memory); all live load sustained, the conservative bound",
    expected: simpleSpanMm(W_LIVE + LAMBDA * (W_DEAD + W_LIVE)),
    unit: "mm",
    compute: () => runPresetCheck("aci-318-19-floor", {}, simpleBeam({ materialCreepFactor: LAMBDA }), "after_attachment_live", "deflectionMm"),
  },
  {
    id: "aci-after-attachment-given",
    title: "ACI 318-19 after attachment, sustained live fraction 0.25 (given)",
    quantity: "deflection after attachment judged at l/480",
    formula: "5 [w_L + lambda (w_D + 0.25 w_L)] L^4 / (384EI), lambda = 2",
    source: "ACI 318-19 Table 24.2.2 and 24.2.4.1 (from memory)",
    expected: simpleSpanMm(W_LIVE + LAMBDA * (W_DEAD + 0.25 * W_LIVE)),
    unit: "mm",
    compute: () => runPresetCheck("aci-318-19-floor-sensitive", { sustainedLiveFraction: 0.25 }, simpleBeam({ materialCreepFactor: LAMBDA }), "after_attachment_live", "deflectionMm"),
  },
];
