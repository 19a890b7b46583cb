/**
 * First-frequency and minimum-I cases the engine is checked against, for the unit test and the
 * in-app verification page. Uniform EI per member, internal units (mm, N, MPa, kg). The expected
 * values are published coefficients and closed forms written out; the sources are named beside
 * each case and were recalled from memory of those publications. Frequencies by the converged
 * finite-element eigenvalue promise 0.1 % and err low (the safe side for a minimum frequency).
 */
import { checkMember } from "@/lib/engine/check-member";
import { FIRST_MODE_BETA_L, FREQUENCY_CONVERGENCE, computeFrequency } from "@/lib/engine/frequency";
import { STANDARD_GRAVITY_M_PER_S2, type LimitProfile, type Load, type Member, type Support } from "@/lib/engine/model";
import type { ClosedFormCase } from "./closed-form-cases";

/** Frequencies in Hz, minimum second moments in mm^4. */
export type FrequencyCaseUnit = "Hz" | "mm^4";

const E = 200_000; // MPa
const I = 8.0e7; // mm^4
const EI = E * I;
const L = 6000; // mm
const W = 3; // N/mm, counted in full as mass
const MASS_KG_PER_MM = W / STANDARD_GRAVITY_M_PER_S2;
const BLEVINS_TABLE = "Blevins, Formulas for Natural Frequency and Mode Shape, Table 8-1 (from memory)";
const BLEVINS_MULTISPAN = "Blevins, Formulas for Natural Frequency and Mode Shape, multispan beams, chapter 8 (from memory)";

const vibration: LimitProfile = { id: "verification", label: "Verification", source: "verification", cantileverSpanMultiplier: 2, combinations: [], frequency: { minHz: 1, massFactors: { dead: 1 } } };

/** lambda^2 / (2 pi L^2) sqrt(EI / m), with EI/m in N mm^2/(kg/mm) = 1000 mm^4/s^2. */
function getBeamHz(lambda: number, lengthMm: number, ei = EI, massKgPerMm = MASS_KG_PER_MM): number {
  return ((lambda * lambda) / (2 * Math.PI * lengthMm * lengthMm)) * Math.sqrt((1000 * ei) / massKgPerMm);
}

function createMember(lengthsMm: number[], supports: Support[], loads: Load[], extra: Partial<Member> = {}): Member {
  return { mark: "V", category: "other", quantity: 1, spans: lengthsMm.map((lengthMm) => ({ lengthMm, eMpa: E, iMm4: I })), supports, loads, ...extra };
}

const at = (...kinds: Support["kind"][]): Support[] => kinds.map((kind) => ({ kind }));
const deadLoad: Load[] = [{ kind: "uniform", loadCase: "dead", wNPerMm: W }];
const frequencyOf = (member: Member): number => computeFrequency(member, vibration)!.hz;

function createEigenCase(id: string, title: string, lengthsMm: number[], supports: Support[], lambda: number, formula: string, source: string): ClosedFormCase<FrequencyCaseUnit> {
  return {
    id,
    title,
    quantity: "first natural frequency",
    formula,
    source,
    expected: getBeamHz(lambda, L),
    unit: "Hz",
    compute: () => frequencyOf(createMember(lengthsMm, supports, deadLoad)),
    tolerance: FREQUENCY_CONVERGENCE,
  };
}

// Timoshenko beam, simply supported, shear deformation without rotary inertia: omega^2 =
// EI a^4 / (m (1 + EI a^2 / kGA)), a = pi / L
const SHEAR_G_MPA = 77_000;
const SHEAR_AREA_MM2 = 400;
const SHORT_L = 3000;
const timoshenkoHz = (() => {
  const a = Math.PI / SHORT_L;
  const omegaSquared = (1000 * EI * a ** 4) / (MASS_KG_PER_MM * (1 + (EI * a * a) / (SHEAR_G_MPA * SHEAR_AREA_MM2)));
  return Math.sqrt(omegaSquared) / (2 * Math.PI);
})();

// minimum I on springs: 5 w L^4 / (384 E (L/360 - w L / (2k)))
const SPRING_N_PER_MM = 4000;
const LIVE = 10;
const liveProfile: LimitProfile = { id: "verification-live", label: "Live l/360", source: "IBC 2021 Table 1604.3 (from memory)", cantileverSpanMultiplier: 2, combinations: [{ id: "L", label: "Live", factors: { live: 1 }, limitRatio: 360 }] };
const springs: Support[] = [{ kind: "spring", springNPerMm: SPRING_N_PER_MM }, { kind: "spring", springNPerMm: SPRING_N_PER_MM }];

// minimum I for a frequency: f = pi / (2 L^2) sqrt(EI / m) solved for I
const MIN_HZ = 12; // above the 9.97 Hz of the 6 m span at I = 8e7 mm^4
const frequencyProfile: LimitProfile = { ...vibration, id: "verification-frequency", frequency: { minHz: MIN_HZ, massFactors: { dead: 1 } } };

export const frequencyCases: ClosedFormCase<FrequencyCaseUnit>[] = [
  {
    id: "freq-ss",
    title: "Simply supported, uniform mass",
    quantity: "first natural frequency (closed form)",
    formula: "pi / (2 L^2) sqrt(EI / m)",
    source: BLEVINS_TABLE,
    expected: getBeamHz(Math.PI, L),
    unit: "Hz",
    compute: () => frequencyOf(createMember([L], at("pinned", "roller"), deadLoad)),
  },
  createEigenCase("freq-two-spans", "Two equal continuous spans, pinned supports", [L, L], at("pinned", "roller", "roller"), Math.PI, "lambda = pi: pi^2 / (2 pi L^2) sqrt(EI / m)", BLEVINS_MULTISPAN),
  createEigenCase("freq-three-spans", "Three equal continuous spans, pinned supports", [L, L, L], at("pinned", "roller", "roller", "roller"), Math.PI, "lambda = pi: pi^2 / (2 pi L^2) sqrt(EI / m)", BLEVINS_MULTISPAN),
  createEigenCase("freq-two-spans-fixed", "Two equal continuous spans, fixed outer ends", [L, L], at("fixed", "roller", "fixed"), FIRST_MODE_BETA_L.fixedPinned, "lambda = 3.9266", BLEVINS_MULTISPAN),
  createEigenCase("freq-propped", "Propped cantilever (fixed-pinned), as two segments", [L / 2, L / 2], at("fixed", "free", "pinned"), FIRST_MODE_BETA_L.fixedPinned, "lambda = 3.9266", BLEVINS_TABLE),
  createEigenCase("freq-fixed-fixed", "Fixed at both ends, as two unequal segments", [L / 3, (2 * L) / 3], at("fixed", "free", "fixed"), FIRST_MODE_BETA_L.fixedFixed, "lambda = 4.7300", BLEVINS_TABLE),
  createEigenCase("freq-cantilever", "Cantilever, as two segments", [L / 2, L / 2], at("fixed", "free", "free"), FIRST_MODE_BETA_L.fixedFree, "lambda = 1.8751", BLEVINS_TABLE),
  {
    id: "freq-point-mass",
    title: "Massless simple span, point mass M at midspan",
    quantity: "first natural frequency",
    formula: "sqrt(48 EI / (M L^3)) / (2 pi)",
    source: "AISC Steel Construction Manual, Table 3-23, case 7, stiffness 48EI/L^3 (from memory)",
    expected: Math.sqrt((1000 * 48 * EI) / L ** 3 / (20_000 / STANDARD_GRAVITY_M_PER_S2)) / (2 * Math.PI),
    unit: "Hz",
    compute: () => frequencyOf(createMember([L], at("pinned", "roller"), [{ kind: "point", loadCase: "dead", atMm: L / 2, pN: 20_000 }])),
  },
  {
    id: "freq-timoshenko",
    title: "Simply supported, 3 m, with shear deformation (kGA = 30.8 MN)",
    quantity: "first natural frequency",
    formula: "omega^2 = EI a^4 / (m (1 + EI a^2 / kGA)), a = pi / L",
    source: "Timoshenko, Vibration Problems in Engineering, beams with shear deformation (from memory)",
    expected: timoshenkoHz,
    unit: "Hz",
    compute: () => frequencyOf({ ...createMember([SHORT_L], at("pinned", "roller"), deadLoad, { includeShearDeformation: true }), spans: [{ lengthMm: SHORT_L, eMpa: E, iMm4: I, gMpa: SHEAR_G_MPA, shearAreaMm2: SHEAR_AREA_MM2 }] }),
    tolerance: FREQUENCY_CONVERGENCE,
  },
  {
    id: "min-i-springs",
    title: "Minimum I: 6 m span on two 4 kN/mm springs, live 10 kN/m, l/360",
    quantity: "minimum second moment of area",
    formula: "5 w L^4 / (384 E (L/360 - w L / (2k)))",
    source: "AISC Steel Construction Manual, Table 3-23, case 1 (from memory), plus spring settlement R/k",
    expected: (5 * LIVE * L ** 4) / (384 * E * (L / 360 - (LIVE * L) / 2 / SPRING_N_PER_MM)),
    unit: "mm^4",
    compute: () => checkMember({ ...createMember([L], springs, [{ kind: "uniform", loadCase: "live", wNPerMm: LIVE }]), spans: [{ lengthMm: L, eMpa: E, iMm4: 5e7 }] }, liveProfile).suggestion?.minIMm4 ?? Number.NaN,
    tolerance: 1e-8,
  },
  {
    id: "min-i-frequency",
    title: "Minimum I for f >= 12 Hz: 6 m simple span, mass 3 kN/m / g",
    quantity: "minimum second moment of area",
    formula: "m (2 f L^2 / pi)^2 / E",
    source: BLEVINS_TABLE,
    expected: (((2 * MIN_HZ * L * L) / Math.PI) ** 2 * MASS_KG_PER_MM) / (1000 * E),
    unit: "mm^4",
    compute: () => checkMember(createMember([L], at("pinned", "roller"), deadLoad), frequencyProfile).suggestion?.minIMm4 ?? Number.NaN,
    tolerance: 1e-8,
  },
];
