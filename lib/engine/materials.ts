/**
 * Materials library: stiffness, density and creep behaviour, each value with its published
 * source. Values are in internal units (MPa, kg/m^3). Every library value was recalled from the
 * named publication, which is said in the `source` field; check against the publication before
 * relying on it.
 */
import { PSI } from "./units/unit-table";

export type MaterialFamily = "steel" | "aluminium" | "concrete" | "timber" | "custom";

export interface Material {
  id: string;
  label: string;
  family: MaterialFamily;
  eMpa: number;
  gMpa: number | null;
  densityKgPerM3: number | null;
  /** A fixed creep factor (custom materials); library materials derive theirs from a creep spec. */
  creepFactor?: number;
  /** Where each value comes from. */
  source: string;
  /** Concrete only: specified compressive strength f'c, MPa (for f_r and cracked sections). */
  fcMpa?: number;
}

const KSI_TO_MPA = 1000 * PSI; // 1000 lbf / in^2 (NIST SP 811 Appendix B; exact from lbf and in)

const AISC_STEEL_SOURCE =
  "AISC 360-16 / Steel Construction Manual: E = 29,000 ksi, G = 11,200 ksi (from memory); density 7,850 kg/m3 (490 lb/ft3, from memory)";
// EN 1993-1-1 3.2.6 gives E and G only; the density is EN 1991-1-1 Table A.4's. That table gives
// steel a range, 77.0 to 78.5 kN/m3 (from memory): 7,850 kg/m3 is 77.0 kN/m3 at g = 9.81 m/s2, the
// lower end and the nominal density of steel (common practice).
const EN_STEEL_SOURCE =
  "EN 1993-1-1:2005 3.2.6: E = 210,000 MPa, G = 81,000 MPa (from memory); density 7,850 kg/m3, EN 1991-1-1:2002 Table A.4 (77.0 to 78.5 kN/m3; 7,850 kg/m3 is its lower end, from memory)";

function createSteel(id: string, label: string, standard: "AISC" | "EN"): Material {
  return standard === "AISC"
    ? { id, label, family: "steel", eMpa: 29000 * KSI_TO_MPA, gMpa: 11200 * KSI_TO_MPA, densityKgPerM3: 7850, source: AISC_STEEL_SOURCE }
    : { id, label, family: "steel", eMpa: 210000, gMpa: 81000, densityKgPerM3: 7850, source: EN_STEEL_SOURCE };
}

interface TimberGrade {
  id: string;
  label: string;
  e0MeanMpa: number;
  gMeanMpa: number;
  densityMeanKgPerM3: number;
  source: string;
}

// EN 338:2016 Table 1 and EN 14080:2013 Table 5 (from memory). Mean values: deflection uses
// E0,mean and Gmean (EN 1995-1-1 2.2.3(2)), and self-weight the mean density rho_mean.
// EN 338:2016 changed some densities from EN 338:2009: C27 is 430 kg/m3 (rho_k 360), where the
// 2009 edition gave 450 (rho_k 370) (both from memory).
const TIMBER_GRADES: TimberGrade[] = [
  { id: "timber-c16", label: "Softwood C16", e0MeanMpa: 8000, gMeanMpa: 500, densityMeanKgPerM3: 370, source: "EN 338:2016 Table 1 (from memory)" },
  { id: "timber-c18", label: "Softwood C18", e0MeanMpa: 9000, gMeanMpa: 560, densityMeanKgPerM3: 380, source: "EN 338:2016 Table 1 (from memory)" },
  { id: "timber-c22", label: "Softwood C22", e0MeanMpa: 10000, gMeanMpa: 630, densityMeanKgPerM3: 410, source: "EN 338:2016 Table 1 (from memory)" },
  { id: "timber-c24", label: "Softwood C24", e0MeanMpa: 11000, gMeanMpa: 690, densityMeanKgPerM3: 420, source: "EN 338:2016 Table 1 (from memory)" },
  { id: "timber-c27", label: "Softwood C27", e0MeanMpa: 11500, gMeanMpa: 720, densityMeanKgPerM3: 430, source: "EN 338:2016 Table 1 (from memory)" },
  { id: "timber-c30", label: "Softwood C30", e0MeanMpa: 12000, gMeanMpa: 750, densityMeanKgPerM3: 460, source: "EN 338:2016 Table 1 (from memory)" },
  { id: "glulam-gl24h", label: "Glulam GL24h", e0MeanMpa: 11500, gMeanMpa: 650, densityMeanKgPerM3: 420, source: "EN 14080:2013 Table 5 (from memory)" },
  { id: "glulam-gl28h", label: "Glulam GL28h", e0MeanMpa: 12600, gMeanMpa: 650, densityMeanKgPerM3: 460, source: "EN 14080:2013 Table 5 (from memory)" },
  { id: "glulam-gl32h", label: "Glulam GL32h", e0MeanMpa: 14200, gMeanMpa: 650, densityMeanKgPerM3: 490, source: "EN 14080:2013 Table 5 (from memory)" },
];

const FIXED_MATERIALS: Material[] = [
  createSteel("steel-aisc", "Structural steel (AISC)", "AISC"),
  createSteel("steel-a992", "Structural steel ASTM A992 (AISC values)", "AISC"),
  createSteel("steel-a36", "Structural steel ASTM A36 (AISC values)", "AISC"),
  createSteel("steel-s235", "Structural steel S235 (EN 1993-1-1)", "EN"),
  createSteel("steel-s275", "Structural steel S275 (EN 1993-1-1)", "EN"),
  createSteel("steel-s355", "Structural steel S355 (EN 1993-1-1)", "EN"),
  {
    id: "aluminium-adm",
    label: "Aluminium alloy (Aluminum Design Manual)",
    family: "aluminium",
    eMpa: 10100 * KSI_TO_MPA,
    gMpa: 3800 * KSI_TO_MPA,
    densityKgPerM3: 2700,
    source: "Aluminum Design Manual 2020 Table A.3.1: E = 10,100 ksi; G = 3,800 ksi and density 2,700 kg/m3 (from memory)",
  },
  {
    id: "aluminium-en1999",
    label: "Aluminium alloy (EN 1999-1-1)",
    family: "aluminium",
    eMpa: 70000,
    gMpa: 27000,
    densityKgPerM3: 2700,
    source: "EN 1999-1-1:2007 3.2.5: E = 70,000 MPa, G = 27,000 MPa, density 2,700 kg/m3 (from memory)",
  },
  ...TIMBER_GRADES.map(
    (grade): Material => ({
      id: grade.id,
      label: grade.label,
      family: "timber",
      eMpa: grade.e0MeanMpa,
      gMpa: grade.gMeanMpa,
      densityKgPerM3: grade.densityMeanKgPerM3,
      source: `${grade.source}: E0,mean, Gmean, mean density`,
    }),
  ),
];

const MATERIALS_BY_ID = new Map(FIXED_MATERIALS.map((m) => [m.id, m]));
// Schedules name a library id exactly as listed on nearly every member: answer those without
// normalising the text or allocating a result.
const FOUND_BY_EXACT_ID = new Map<string, FindMaterialResult>(FIXED_MATERIALS.map((m) => [m.id, { ok: true, material: m }]));

/** Normal-weight concrete density, kg/m^3 (common practice; ACI 318 uses 2,320 kg/m3 plain, 2,400 with steel). */
const CONCRETE_DENSITY_KG_PER_M3 = 2400;
/** Poisson's ratio of concrete for G = E / (2 (1 + nu)) (common practice: 0.2). */
const CONCRETE_POISSON = 0.2;

/**
 * Normal-weight concrete of specified strength f'c (MPa): Ec = 4,700 sqrt(f'c) MPa
 * (ACI 318-19 19.2.2.1(b)), G = Ec / (2 (1 + 0.2)), density 2,400 kg/m^3.
 */
export function createConcrete(fcMpa: number): Material {
  const eMpa = 4700 * Math.sqrt(fcMpa);
  return {
    id: `concrete-fc${fcMpa}`,
    label: `Normal-weight concrete f'c = ${fcMpa} MPa`,
    family: "concrete",
    eMpa,
    gMpa: eMpa / (2 * (1 + CONCRETE_POISSON)),
    densityKgPerM3: CONCRETE_DENSITY_KG_PER_M3,
    fcMpa,
    source:
      "ACI 318-19 19.2.2.1(b): Ec = 4,700 sqrt(f'c) MPa (from memory); Poisson's ratio 0.2 and density 2,400 kg/m3 (common practice)",
  };
}

/** Lowest and highest f'c accepted by id, MPa (ACI 318-19 Table 19.2.1.1 minimum 17 MPa; upper bound a sanity limit). */
export const CONCRETE_FC_RANGE_MPA = { min: 17, max: 120 } as const;

/** Library ids, for messages and docs. Concrete takes any `concrete-fcNN` (NN in MPa). */
export function listMaterialIds(): string[] {
  return [...MATERIALS_BY_ID.keys(), "concrete-fc<f'c in MPa>"];
}

export type FindMaterialResult = { ok: true; material: Material } | { ok: false; message: string };

/** Looks a library material up by id (case-insensitive); `concrete-fc30` builds f'c = 30 MPa. */
export function findMaterial(id: string): FindMaterialResult {
  const exact = FOUND_BY_EXACT_ID.get(id);
  if (exact) return exact;
  const key = id.trim().toLowerCase().replace(/aluminum/, "aluminium");
  const fixed = MATERIALS_BY_ID.get(key);
  if (fixed) return { ok: true, material: fixed };
  const concrete = /^concrete-fc(\d+(?:\.\d+)?)$/.exec(key);
  if (concrete?.[1] !== undefined) {
    const fcMpa = Number(concrete[1]);
    if (fcMpa < CONCRETE_FC_RANGE_MPA.min || fcMpa > CONCRETE_FC_RANGE_MPA.max) {
      return {
        ok: false,
        message: `concrete f'c must be between ${CONCRETE_FC_RANGE_MPA.min} and ${CONCRETE_FC_RANGE_MPA.max} MPa`,
      };
    }
    return { ok: true, material: createConcrete(fcMpa) };
  }
  return { ok: false, message: `unknown material "${id}"; library ids: ${listMaterialIds().join(", ")}` };
}

// Creep (long-term deflection). The engine's combination adds creepFactor x (sustained
// deflection), so each method below is expressed as that factor.

/** EN 1995-1-1:2004 Table 3.2, solid timber and glulam: k_def by service class (from memory). */
export const EN1995_KDEF: Record<1 | 2 | 3, number> = { 1: 0.6, 2: 0.8, 3: 2.0 };

export type NdsCondition = "seasoned_dry" | "unseasoned_or_wet";

/**
 * NDS 2018 3.5.2 (from memory): K_cr 1.5 for seasoned lumber and glulam in dry service,
 * 2.0 for unseasoned lumber or wet service.
 */
export const NDS_KCR: Record<NdsCondition, number> = { seasoned_dry: 1.5, unseasoned_or_wet: 2.0 };

/** ACI 318-19 Table 24.2.4.1.3: time-dependent factor xi by sustained-load duration in months (from memory). */
export const ACI_TIME_FACTORS: Record<3 | 6 | 12 | 60, number> = { 3: 1.0, 6: 1.2, 12: 1.4, 60: 2.0 };

export type CreepSpec =
  | { method: "en1995"; serviceClass: 1 | 2 | 3 }
  | { method: "nds"; condition: NdsCondition }
  | { method: "aci"; durationMonths: 3 | 6 | 12 | 60; compressionRatio: number }
  | { method: "factor"; factor: number };

/**
 * The engine's creep factor for a creep spec:
 * - EN 1995-1-1 2.3.2.2: w_fin = w_inst (1 + k_def) on the quasi-permanent part: factor k_def.
 * - NDS 3.5.2: total = K_cr x long-term + short-term = immediate + (K_cr - 1) x long-term: factor K_cr - 1.
 * - ACI 318-19 24.2.4.1.1: additional = lambda x immediate sustained, lambda = xi / (1 + 50 rho'):
 *   factor lambda (60 months stands for "5 years or more").
 */
export function getCreepFactor(spec: CreepSpec): number {
  switch (spec.method) {
    case "en1995":
      return EN1995_KDEF[spec.serviceClass];
    case "nds":
      return NDS_KCR[spec.condition] - 1;
    case "aci":
      return ACI_TIME_FACTORS[spec.durationMonths] / (1 + 50 * spec.compressionRatio);
    case "factor":
      return spec.factor;
  }
}

/** Which creep methods suit a family; metals do not creep at ambient temperature (common practice). */
export function getCreepMethodsForFamily(family: MaterialFamily): CreepSpec["method"][] {
  switch (family) {
    case "timber":
      return ["en1995", "nds", "factor"];
    case "concrete":
      return ["aci", "factor"];
    case "custom":
      return ["en1995", "nds", "aci", "factor"];
    default:
      return ["factor"];
  }
}
