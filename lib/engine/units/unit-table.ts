/**
 * The accepted units, per quantity kind, with their factor to the engine's internal unit
 * (see model.ts: mm, N, N/mm, N*mm, MPa, mm^4, mm^2, kg/m^3, Hz).
 *
 * US customary factors follow NIST SP 811 (2008) Appendix B: the foot (0.3048 m), the inch
 * (25.4 mm), the pound-force (4.448 221 615 260 5 N) and the avoirdupois pound (0.453 592 37 kg)
 * are exact by definition, so every derived factor below is computed from them rather than
 * rounded, which keeps conversions exact to double precision.
 */

export type QuantityKind =
  | "length"
  | "sectionDimension"
  | "deflection"
  | "force"
  | "distributedLoad"
  | "moment"
  | "modulus"
  | "pressure"
  | "secondMoment"
  | "area"
  | "density"
  | "springStiffness"
  | "frequency";

export const QUANTITY_KINDS: readonly QuantityKind[] = [
  "length",
  "sectionDimension",
  "deflection",
  "force",
  "distributedLoad",
  "moment",
  "modulus",
  "pressure",
  "secondMoment",
  "area",
  "density",
  "springStiffness",
  "frequency",
];

/** Human words for messages. */
export const QUANTITY_KIND_LABELS: Record<QuantityKind, string> = {
  length: "length",
  sectionDimension: "section dimension",
  deflection: "deflection",
  force: "force",
  distributedLoad: "distributed load",
  moment: "moment",
  modulus: "modulus",
  pressure: "area load (pressure)",
  secondMoment: "second moment of area",
  area: "area",
  density: "density",
  springStiffness: "spring stiffness",
  frequency: "frequency",
};

/** The engine's internal unit for each kind (model.ts). */
export const INTERNAL_UNITS: Record<QuantityKind, string> = {
  length: "mm",
  sectionDimension: "mm",
  deflection: "mm",
  force: "N",
  distributedLoad: "N/mm",
  moment: "N*mm",
  modulus: "MPa",
  pressure: "MPa",
  secondMoment: "mm^4",
  area: "mm^2",
  density: "kg/m^3",
  springStiffness: "N/mm",
  frequency: "Hz",
};

// Exact defining values (NIST SP 811 Appendix B).
const MM_PER_FT = 304.8;
const MM_PER_IN = 25.4;
const N_PER_LBF = 4.4482216152605;
const N_PER_KIP = 1000 * N_PER_LBF;
const KG_PER_LB = 0.45359237;

export interface UnitDefinition {
  /** The spelling used in messages and output. */
  symbol: string;
  /** Other accepted spellings, before normalisation (see normaliseUnitText). */
  aliases: readonly string[];
  /** internal value = value in this unit * toInternal. */
  toInternal: number;
}

const LENGTH_UNITS: UnitDefinition[] = [
  { symbol: "mm", aliases: ["millimetre", "millimeter"], toInternal: 1 },
  { symbol: "cm", aliases: [], toInternal: 10 },
  { symbol: "m", aliases: ["metre", "meter"], toInternal: 1000 },
  { symbol: "in", aliases: ["inch", "inches"], toInternal: MM_PER_IN },
  { symbol: "ft", aliases: ["foot", "feet"], toInternal: MM_PER_FT },
];

const PER_LENGTH_UNITS: UnitDefinition[] = [
  { symbol: "N/mm", aliases: [], toInternal: 1 },
  { symbol: "kN/m", aliases: [], toInternal: 1 },
  { symbol: "N/m", aliases: [], toInternal: 1e-3 },
  { symbol: "kN/mm", aliases: [], toInternal: 1000 },
  { symbol: "plf", aliases: ["lb/ft", "lbf/ft", "lbs/ft"], toInternal: N_PER_LBF / MM_PER_FT },
  { symbol: "klf", aliases: ["kip/ft", "kips/ft"], toInternal: N_PER_KIP / MM_PER_FT },
  { symbol: "lb/in", aliases: ["lbf/in", "lbs/in", "pli"], toInternal: N_PER_LBF / MM_PER_IN },
  { symbol: "kip/in", aliases: ["kips/in", "kli"], toInternal: N_PER_KIP / MM_PER_IN },
];

const STRESS_SI_UNITS: UnitDefinition[] = [
  { symbol: "MPa", aliases: ["N/mm2"], toInternal: 1 },
  { symbol: "GPa", aliases: ["kN/mm2"], toInternal: 1000 },
  { symbol: "kPa", aliases: ["kN/m2"], toInternal: 1e-3 },
  { symbol: "Pa", aliases: ["N/m2"], toInternal: 1e-6 },
];

/** One psi (lbf/in^2) in MPa (N/mm^2), exact from the pound-force and the inch. */
export const PSI = N_PER_LBF / (MM_PER_IN * MM_PER_IN);

export const UNIT_TABLE: Record<QuantityKind, readonly UnitDefinition[]> = {
  length: LENGTH_UNITS,
  sectionDimension: LENGTH_UNITS,
  deflection: LENGTH_UNITS,
  force: [
    { symbol: "N", aliases: ["newton", "newtons"], toInternal: 1 },
    { symbol: "kN", aliases: [], toInternal: 1000 },
    { symbol: "lbf", aliases: ["lb", "lbs"], toInternal: N_PER_LBF },
    { symbol: "kip", aliases: ["kips", "klbf"], toInternal: N_PER_KIP },
  ],
  distributedLoad: PER_LENGTH_UNITS,
  springStiffness: PER_LENGTH_UNITS,
  moment: [
    { symbol: "N*mm", aliases: ["Nmm", "mm*N"], toInternal: 1 },
    { symbol: "N*m", aliases: ["Nm", "m*N"], toInternal: 1000 },
    { symbol: "kN*m", aliases: ["kNm", "m*kN"], toInternal: 1e6 },
    { symbol: "kN*mm", aliases: ["kNmm", "mm*kN"], toInternal: 1000 },
    { symbol: "lb*ft", aliases: ["lbf*ft", "ft*lb", "ft*lbf", "lbs*ft"], toInternal: N_PER_LBF * MM_PER_FT },
    { symbol: "lb*in", aliases: ["lbf*in", "in*lb", "in*lbf", "lbs*in"], toInternal: N_PER_LBF * MM_PER_IN },
    { symbol: "kip*ft", aliases: ["kips*ft", "ft*kip", "ft*kips", "k*ft"], toInternal: N_PER_KIP * MM_PER_FT },
    { symbol: "kip*in", aliases: ["kips*in", "in*kip", "in*kips"], toInternal: N_PER_KIP * MM_PER_IN },
  ],
  modulus: [
    ...STRESS_SI_UNITS,
    { symbol: "psi", aliases: ["lb/in2", "lbf/in2"], toInternal: PSI },
    { symbol: "ksi", aliases: ["kip/in2", "kips/in2"], toInternal: 1000 * PSI },
  ],
  pressure: [
    ...STRESS_SI_UNITS,
    { symbol: "psf", aliases: ["lb/ft2", "lbf/ft2"], toInternal: N_PER_LBF / (MM_PER_FT * MM_PER_FT) },
    { symbol: "ksf", aliases: ["kip/ft2", "kips/ft2"], toInternal: N_PER_KIP / (MM_PER_FT * MM_PER_FT) },
    { symbol: "psi", aliases: ["lb/in2", "lbf/in2"], toInternal: PSI },
  ],
  secondMoment: [
    { symbol: "mm^4", aliases: ["mm4"], toInternal: 1 },
    { symbol: "cm^4", aliases: ["cm4"], toInternal: 1e4 },
    { symbol: "m^4", aliases: ["m4"], toInternal: 1e12 },
    { symbol: "in^4", aliases: ["in4"], toInternal: MM_PER_IN ** 4 },
  ],
  area: [
    { symbol: "mm^2", aliases: ["mm2"], toInternal: 1 },
    { symbol: "cm^2", aliases: ["cm2"], toInternal: 100 },
    { symbol: "m^2", aliases: ["m2"], toInternal: 1e6 },
    { symbol: "in^2", aliases: ["in2"], toInternal: MM_PER_IN ** 2 },
  ],
  density: [
    { symbol: "kg/m^3", aliases: ["kg/m3"], toInternal: 1 },
    { symbol: "t/m^3", aliases: ["t/m3"], toInternal: 1000 },
    // Pound-mass per cubic foot: 0.453 592 37 kg / (0.3048 m)^3.
    { symbol: "pcf", aliases: ["lb/ft3", "lbm/ft3", "lbs/ft3"], toInternal: KG_PER_LB / (MM_PER_FT / 1000) ** 3 },
  ],
  frequency: [{ symbol: "Hz", aliases: ["hertz"], toInternal: 1 }],
};
