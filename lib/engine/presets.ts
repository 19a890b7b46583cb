/**
 * Limit-profile presets. Each says which published source it follows; the project's engineer
 * may take one as is, override its ratios, or write a custom profile. National annexes and local
 * codes differ: a preset is a starting point, not a ruling.
 */
import type { Combination, LimitProfile } from "./model";

/** IBC 2021 Table 1604.3 footnote: a cantilever's l is twice its length (from memory). */
const IBC_CANTILEVER_MULTIPLIER = 2;

function createCombination(id: string, label: string, factors: Record<string, number>, limitRatio: number): Combination {
  return { id, label, factors, limitRatio };
}

function createIbcGravityProfile(id: string, label: string, liveCases: string[], liveRatio: number, totalRatio: number): LimitProfile {
  const combinations: Combination[] = [];
  for (const live of liveCases) combinations.push(createCombination(live, `${live} alone: l/${liveRatio}`, { [live]: 1 }, liveRatio));
  for (const live of liveCases) {
    combinations.push(createCombination(`dead+${live}`, `dead + ${live}: l/${totalRatio}`, { dead: 1, [live]: 1 }, totalRatio));
  }
  return {
    id,
    label,
    source: "IBC 2021 Table 1604.3 (from memory)",
    combinations,
    cantileverSpanMultiplier: IBC_CANTILEVER_MULTIPLIER,
  };
}

function createIbcWallProfile(id: string, label: string, ratio: number): LimitProfile {
  return {
    id,
    label,
    // Footnote f permits 0.42 x the components-and-cladding wind load; the preset keeps the
    // full wind case (conservative), an override may set the factor.
    source: "IBC 2021 Table 1604.3, exterior walls, wind (from memory); wind factor 1.0 (footnote f would permit 0.42 of C&C loads)",
    combinations: [createCombination("wind", `wind: l/${ratio}`, { wind: 1 }, ratio)],
    cantileverSpanMultiplier: IBC_CANTILEVER_MULTIPLIER,
  };
}

/** psi2 for imposed floor loads, categories A and B (EN 1990 Table A1.1, from memory). */
const PSI2_DOMESTIC_OFFICE = 0.3;

/**
 * EN 1995-1-1 7.2 with the least strict end of each Table 7.2 range (w_inst l/300,
 * w_net,fin l/250, w_fin l/150). No precamber is modelled (w_c = 0), so w_net,fin and w_fin
 * are the same deflection judged against different ratios.
 */
function createEn1995Profile(): LimitProfile {
  const sustained = { dead: 1, live: PSI2_DOMESTIC_OFFICE };
  return {
    id: "en1995-timber-floor",
    label: "Timber floor, EN 1995-1-1 7.2 (w_inst l/300, w_net,fin l/250, w_fin l/150; psi2 = 0.3)",
    source:
      "EN 1995-1-1:2004 7.2 and Table 7.2 ranges (from memory); w_fin per 2.2.3(5) with k_def from the material; psi2 = 0.3 for categories A/B (EN 1990 Table A1.1, from memory)",
    combinations: [
      createCombination("w_inst", "w_inst, live: l/300", { live: 1 }, 300),
      { id: "w_net_fin", label: "w_net,fin, dead + live with creep: l/250", factors: { dead: 1, live: 1 }, sustainedFactors: sustained, creep: "material", limitRatio: 250 },
      { id: "w_fin", label: "w_fin, dead + live with creep: l/150", factors: { dead: 1, live: 1 }, sustainedFactors: sustained, creep: "material", limitRatio: 150 },
    ],
    // 2 x length / 300 = length / 150, the cantilever w_inst value of Table 7.2 (from memory).
    cantileverSpanMultiplier: 2,
  };
}

/**
 * ACI 318-19 Table 24.2.2 (from memory): immediate live deflection, and the part after
 * attachment of non-structural elements = immediate live + lambda x immediate sustained (dead).
 */
function createAciProfile(id: string, label: string, liveCases: string[], immediateRatio: number, afterRatio: number): LimitProfile {
  const combinations: Combination[] = liveCases.map((live) =>
    createCombination(live, `${live} immediate: l/${immediateRatio}`, { [live]: 1 }, immediateRatio),
  );
  for (const live of liveCases) {
    combinations.push({
      id: `after_attachment_${live}`,
      label: `after attachment, ${live} + long-term dead: l/${afterRatio}`,
      factors: { [live]: 1 },
      sustainedFactors: { dead: 1 },
      creep: "material",
      limitRatio: afterRatio,
    });
  }
  return {
    id,
    label,
    source: "ACI 318-19 Table 24.2.2, long-term factor lambda per 24.2.4.1 (from memory)",
    combinations,
    cantileverSpanMultiplier: 2,
  };
}

/** Floor vibration: a minimum first frequency of 4 Hz (common practice; SCI P354 and AISC Design Guide 11 give the details). */
const FLOOR_MIN_FREQUENCY_HZ = 4;

function createFloorVibrationProfile(): LimitProfile {
  const floor = createIbcGravityProfile("ibc-2021-floor-vibration", "", ["live"], 360, 240);
  return {
    ...floor,
    label: "Floor, IBC 2021 limits plus first frequency >= 4 Hz",
    source: "IBC 2021 Table 1604.3 (from memory); 4 Hz minimum with mass of dead + 10% live (common practice)",
    frequency: { minHz: FLOOR_MIN_FREQUENCY_HZ, massFactors: { dead: 1, live: 0.1 } },
  };
}

const PRESETS: LimitProfile[] = [
  createIbcGravityProfile("ibc-2021-floor", "Floor members, IBC 2021 (live l/360, dead + live l/240)", ["live"], 360, 240),
  createIbcGravityProfile("ibc-2021-roof-plaster-ceiling", "Roof supporting plaster or stucco ceiling, IBC 2021 (l/360, l/240)", ["roof_live", "snow"], 360, 240),
  createIbcGravityProfile("ibc-2021-roof-ceiling", "Roof supporting non-plaster ceiling, IBC 2021 (l/240, l/180)", ["roof_live", "snow"], 240, 180),
  createIbcGravityProfile("ibc-2021-roof-no-ceiling", "Roof not supporting a ceiling, IBC 2021 (l/180, l/120)", ["roof_live", "snow"], 180, 120),
  createIbcWallProfile("ibc-2021-wall-plaster", "Exterior wall, plaster or stucco finish, IBC 2021 (wind l/360)", 360),
  createIbcWallProfile("ibc-2021-wall-brittle", "Exterior wall, other brittle finish, IBC 2021 (wind l/240)", 240),
  createIbcWallProfile("ibc-2021-wall-flexible", "Exterior wall, flexible finish, IBC 2021 (wind l/120)", 120),
  createFloorVibrationProfile(),
  createEn1995Profile(),
  createAciProfile("aci-318-19-floor", "Concrete floor, ACI 318-19 (live l/360; after attachment l/240, elements not likely to be damaged)", ["live"], 360, 240),
  createAciProfile("aci-318-19-floor-sensitive", "Concrete floor, ACI 318-19 (live l/360; after attachment l/480, elements likely to be damaged)", ["live"], 360, 480),
  createAciProfile("aci-318-19-roof", "Concrete flat roof, ACI 318-19 (roof live and snow l/180; after attachment l/240)", ["roof_live", "snow"], 180, 240),
];

const PRESETS_BY_ID = new Map(PRESETS.map((p) => [p.id, p]));

/** Preset ids in a stable order, for messages and docs. */
export function listPresetIds(): string[] {
  return PRESETS.map((p) => p.id);
}

/** A deep copy of a preset (callers may edit it), or null for an unknown id. */
export function getPreset(id: string): LimitProfile | null {
  const preset = PRESETS_BY_ID.get(id);
  return preset ? structuredCloneProfile(preset) : null;
}

/** All presets, deep-copied. */
export function listPresets(): LimitProfile[] {
  return PRESETS.map(structuredCloneProfile);
}

function structuredCloneProfile(profile: LimitProfile): LimitProfile {
  return {
    ...profile,
    combinations: profile.combinations.map((c) => ({
      ...c,
      factors: { ...c.factors },
      ...(c.sustainedFactors ? { sustainedFactors: { ...c.sustainedFactors } } : {}),
    })),
    ...(profile.frequency ? { frequency: { minHz: profile.frequency.minHz, massFactors: { ...profile.frequency.massFactors } } } : {}),
  };
}

/** The load cases a profile reads (combination factors, sustained factors, frequency mass). */
export function listProfileLoadCases(profile: LimitProfile): Set<string> {
  const cases = new Set<string>();
  for (const c of profile.combinations) {
    for (const name of Object.keys(c.factors)) cases.add(name);
    for (const name of Object.keys(c.sustainedFactors ?? {})) cases.add(name);
  }
  for (const name of Object.keys(profile.frequency?.massFactors ?? {})) cases.add(name);
  return cases;
}
