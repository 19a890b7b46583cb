/**
 * Limit-profile presets. Each says which published source it follows; the project's engineer
 * may take one as is, override its ratios, or write a custom profile. National annexes and local
 * codes differ: a preset is a starting point, not a ruling.
 */
import type { Combination, LimitProfile } from "./model";

/** IBC 2021 Table 1604.3 footnote (from memory): a cantilever's l is twice its length. */
const IBC_CANTILEVER_MULTIPLIER = 2;
/** ACI 318-19 Table 24.2.2 and EN 1995-1-1 Table 7.2 judge a cantilever on its own length. */
const OWN_LENGTH = 1;

function createCombination(id: string, label: string, factors: Record<string, number>, limitRatio: number): Combination {
  return { id, label, factors, limitRatio };
}

/**
 * The D + L row of IBC 2021 Table 1604.3 as its footnote words it (from memory): the creep
 * component of long-term deflection plus the immediate live-load deflection. The creep component
 * is K x (immediate dead deflection) with K from the member (Member.ibcCreepComponentFactor: 0
 * steel and aluminium, 0.5 seasoned dry wood, 1.0 other wood, lambda for concrete).
 */
function createIbcDeadPlusLive(live: string, ratio: number): Combination {
  return {
    id: `dead+${live}`,
    label: `dead + ${live} (IBC: creep component K x dead + immediate ${live}): l/${ratio}`,
    factors: { [live]: 1 },
    sustainedFactors: { dead: 1 },
    creep: "ibc_creep_component",
    limitRatio: ratio,
  };
}

const IBC_GRAVITY_SOURCE =
  "IBC 2021 Table 1604.3 (from memory): L row on immediate live; D + L row on the creep component of long-term deflection plus immediate live " +
  "(footnotes, from memory: creep component 0.5 D for wood dry at installation and in dry use, D for other wood, zero for steel; aluminium taken as zero like steel; " +
  "concrete per ACI 318-19 24.2.4.1 lambda x D, 1604.3.2); cantilever l = twice its length";

function createIbcGravityProfile(id: string, label: string, liveCases: string[], liveRatio: number, totalRatio: number): LimitProfile {
  const combinations: Combination[] = [];
  for (const live of liveCases) combinations.push(createCombination(live, `${live} alone: l/${liveRatio}`, { [live]: 1 }, liveRatio));
  for (const live of liveCases) combinations.push(createIbcDeadPlusLive(live, totalRatio));
  return { id, label, source: IBC_GRAVITY_SOURCE, combinations, cantileverSpanMultiplier: IBC_CANTILEVER_MULTIPLIER };
}

/**
 * A conservative variant, not a code row: the IBC 2021 floor rows plus immediate dead + live at
 * l/240. For steel, aluminium and wood (K <= 1) the extra row is at least as strict as the code's
 * D + L row; keeping the code's row as well keeps the profile conservative for concrete (lambda up
 * to 2).
 */
function createConservativeFloorProfile(): LimitProfile {
  const floor = createIbcGravityProfile("floor-conservative-immediate-total", "", ["live"], 360, 240);
  floor.combinations.push(createCombination("dead+live_immediate", "immediate dead + live: l/240 (conservative variant, not the IBC D + L row)", { dead: 1, live: 1 }, 240));
  return {
    ...floor,
    label: "Floor members, conservative variant: IBC 2021 rows plus immediate dead + live l/240",
    source: `Sagline conservative variant (common practice): immediate dead + live at l/240 added to the IBC rows. ${IBC_GRAVITY_SOURCE}`,
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
 * EN 1995-1-1 Table 7.2 (from memory), least strict end of each range: beams on two supports
 * w_inst l/300, w_net,fin l/250, w_fin l/150; cantilevers, on their own length, l/150, l/125, l/75.
 */
const EN1995_RATIOS = {
  inst: { span: 300, cantilever: 150 },
  netFin: { span: 250, cantilever: 125 },
  fin: { span: 150, cantilever: 75 },
} as const;

/**
 * EN 1995-1-1 7.2 with the least strict end of each Table 7.2 range. w_inst is the
 * instantaneous deflection of the characteristic combination, dead + live (2.2.3(2)); the
 * national-annex variant limits the variable action alone. No precamber is modelled (w_c = 0), so
 * w_net,fin and w_fin are the same deflection judged against different ratios. Cantilevers take
 * Table 7.2's own cantilever ratios on their own length.
 */
function createEn1995Profile(variant: "characteristic" | "variable_only"): LimitProfile {
  const sustained = { dead: 1, live: PSI2_DOMESTIC_OFFICE };
  const { inst, netFin, fin } = EN1995_RATIOS;
  const instCombination: Combination =
    variant === "characteristic"
      ? { id: "w_inst", label: `w_inst, dead + live (characteristic): l/${inst.span}; cantilever l/${inst.cantilever}`, factors: { dead: 1, live: 1 }, limitRatio: inst.span, cantileverLimitRatio: inst.cantilever }
      : { id: "w_inst_q", label: `w_inst,Q, live alone (national-annex variant): l/${inst.span}; cantilever l/${inst.cantilever}`, factors: { live: 1 }, limitRatio: inst.span, cantileverLimitRatio: inst.cantilever };
  const longTerm = (id: string, name: string, ratios: { span: number; cantilever: number }): Combination => ({
    id,
    label: `${name}, dead + live with creep: l/${ratios.span}; cantilever l/${ratios.cantilever}`,
    factors: { dead: 1, live: 1 },
    sustainedFactors: { ...sustained },
    creep: "material",
    limitRatio: ratios.span,
    cantileverLimitRatio: ratios.cantilever,
  });
  const common =
    "EN 1995-1-1:2004 7.2 and Table 7.2 ranges, least strict end, cantilevers on their own length (from memory); w_fin per 2.2.3(5) with k_def from the material; psi2 = 0.3 for categories A/B (EN 1990 Table A1.1, from memory)";
  return {
    id: variant === "characteristic" ? "en1995-timber-floor" : "en1995-timber-floor-na-variable-inst",
    label:
      variant === "characteristic"
        ? "Timber floor, EN 1995-1-1 7.2 (w_inst of dead + live l/300, w_net,fin l/250, w_fin l/150; psi2 = 0.3)"
        : "Timber floor, EN 1995-1-1 7.2 with a national-annex w_inst of the variable action alone (l/300; w_net,fin l/250, w_fin l/150; psi2 = 0.3)",
    source:
      variant === "characteristic"
        ? `${common}; w_inst for the characteristic combination per 2.2.3(2)`
        : `${common}; national-annex variant: w_inst limits the variable action alone, as some national annexes choose (check yours); the 2.2.3(2) characteristic combination is en1995-timber-floor`,
    combinations: [instCombination, longTerm("w_net_fin", "w_net,fin", netFin), longTerm("w_fin", "w_fin", fin)],
    cantileverSpanMultiplier: OWN_LENGTH,
  };
}

/** Options that change how a preset is built (intake reads them from `profile`). */
export interface PresetOptions {
  /**
   * ACI presets: the part of each combination's live (or roof) load that is sustained, 0 to 1.
   * ACI 318-19 24.2.4 leaves it to the engineer; the default is DEFAULT_SUSTAINED_LIVE_FRACTION.
   */
  sustainedLiveFraction?: number;
}

/** All live load treated as sustained: the conservative bound, since ACI 318-19 fixes no fraction. */
export const DEFAULT_SUSTAINED_LIVE_FRACTION = 1;

/**
 * ACI 318-19 Table 24.2.2 (from memory): immediate live deflection; and the part after attachment
 * of non-structural elements = time-dependent deflection of all sustained load, lambda x (dead +
 * f x live), plus the immediate deflection of the live load applied after attachment, taken as the
 * whole live load (its sustained part too arrives after the elements are attached: the
 * conservative reading). lambda per 24.2.4.1 from the member's material. Cantilevers on their own
 * length (no doubling in ACI 318).
 */
function createAciProfile(id: string, label: string, liveCases: string[], immediateRatio: number, afterRatio: number, options: PresetOptions): LimitProfile {
  const fraction = options.sustainedLiveFraction ?? DEFAULT_SUSTAINED_LIVE_FRACTION;
  const fractionText = options.sustainedLiveFraction === undefined ? `${fraction} (default: all live load sustained, the conservative bound)` : `${fraction} (given)`;
  const combinations: Combination[] = liveCases.map((live) =>
    createCombination(live, `${live} immediate: l/${immediateRatio}`, { [live]: 1 }, immediateRatio),
  );
  for (const live of liveCases) {
    combinations.push({
      id: `after_attachment_${live}`,
      label: `after attachment, immediate ${live} + lambda x (dead + ${fraction} ${live}): l/${afterRatio}`,
      factors: { [live]: 1 },
      sustainedFactors: { dead: 1, [live]: fraction },
      creep: "material",
      limitRatio: afterRatio,
    });
  }
  return {
    id,
    label: `${label}; sustained live fraction ${fraction}`,
    source: `ACI 318-19 Table 24.2.2, long-term factor lambda per 24.2.4.1 (from memory); cantilevers on their own length; sustained live fraction ${fractionText}`,
    combinations,
    cantileverSpanMultiplier: OWN_LENGTH,
  };
}

/** Floor vibration: a minimum first frequency of 4 Hz (common practice; SCI P354 and AISC Design Guide 11 give the details). */
const FLOOR_MIN_FREQUENCY_HZ = 4;

function createFloorVibrationProfile(): LimitProfile {
  const floor = createIbcGravityProfile("ibc-2021-floor-vibration", "", ["live"], 360, 240);
  return {
    ...floor,
    label: "Floor, IBC 2021 limits plus first frequency >= 4 Hz",
    source: `${IBC_GRAVITY_SOURCE}; 4 Hz minimum with mass of dead + 10% live (common practice)`,
    frequency: { minHz: FLOOR_MIN_FREQUENCY_HZ, massFactors: { dead: 1, live: 0.1 } },
  };
}

type PresetBuilder = { id: string; takesSustainedLiveFraction: boolean; build: (options: PresetOptions) => LimitProfile };

function createFixed(build: () => LimitProfile): PresetBuilder {
  const profile = build();
  return { id: profile.id, takesSustainedLiveFraction: false, build: () => profile };
}

function createAciBuilder(id: string, label: string, liveCases: string[], immediateRatio: number, afterRatio: number): PresetBuilder {
  return { id, takesSustainedLiveFraction: true, build: (options) => createAciProfile(id, label, liveCases, immediateRatio, afterRatio, options) };
}

const PRESETS: PresetBuilder[] = [
  createFixed(() => createIbcGravityProfile("ibc-2021-floor", "Floor members, IBC 2021 (live l/360, dead + live l/240)", ["live"], 360, 240)),
  createFixed(() => createIbcGravityProfile("ibc-2021-roof-plaster-ceiling", "Roof supporting plaster or stucco ceiling, IBC 2021 (l/360, l/240)", ["roof_live", "snow"], 360, 240)),
  createFixed(() => createIbcGravityProfile("ibc-2021-roof-ceiling", "Roof supporting non-plaster ceiling, IBC 2021 (l/240, l/180)", ["roof_live", "snow"], 240, 180)),
  createFixed(() => createIbcGravityProfile("ibc-2021-roof-no-ceiling", "Roof not supporting a ceiling, IBC 2021 (l/180, l/120)", ["roof_live", "snow"], 180, 120)),
  createFixed(() => createIbcWallProfile("ibc-2021-wall-plaster", "Exterior wall, plaster or stucco finish, IBC 2021 (wind l/360)", 360)),
  createFixed(() => createIbcWallProfile("ibc-2021-wall-brittle", "Exterior wall, other brittle finish, IBC 2021 (wind l/240)", 240)),
  createFixed(() => createIbcWallProfile("ibc-2021-wall-flexible", "Exterior wall, flexible finish, IBC 2021 (wind l/120)", 120)),
  createFixed(createFloorVibrationProfile),
  createFixed(createConservativeFloorProfile),
  createFixed(() => createEn1995Profile("characteristic")),
  createFixed(() => createEn1995Profile("variable_only")),
  createAciBuilder("aci-318-19-floor", "Concrete floor, ACI 318-19 (live l/360; after attachment l/240, elements not likely to be damaged)", ["live"], 360, 240),
  createAciBuilder("aci-318-19-floor-sensitive", "Concrete floor, ACI 318-19 (live l/360; after attachment l/480, elements likely to be damaged)", ["live"], 360, 480),
  createAciBuilder("aci-318-19-roof", "Concrete flat roof, ACI 318-19 (roof live and snow l/180; after attachment l/240)", ["roof_live", "snow"], 180, 240),
];

const PRESETS_BY_ID = new Map(PRESETS.map((p) => [p.id, p]));

/** Preset ids in a stable order, for messages and docs. */
export function listPresetIds(): string[] {
  return PRESETS.map((p) => p.id);
}

/** Whether a preset reads PresetOptions.sustainedLiveFraction (the ACI presets). */
export function presetTakesSustainedLiveFraction(id: string): boolean {
  return PRESETS_BY_ID.get(id)?.takesSustainedLiveFraction ?? false;
}

/** A deep copy of a preset (callers may edit it) built with the options, or null for an unknown id. */
export function getPreset(id: string, options: PresetOptions = {}): LimitProfile | null {
  const preset = PRESETS_BY_ID.get(id);
  return preset ? structuredCloneProfile(preset.build(options)) : null;
}

/** All presets with their default options, deep-copied. */
export function listPresets(): LimitProfile[] {
  return PRESETS.map((p) => structuredCloneProfile(p.build({})));
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
