import type { Combination, LimitProfile } from "../model";
import { getPreset, listPresetIds, presetTakesSustainedLiveFraction } from "../presets";
import {
  isJsonObject,
  childPath,
  readBoolean,
  readNumber,
  readObject,
  readQuantity,
  readString,
  createFieldSpec,
  type FieldPath,
  type JsonObject,
  type ReadContext,
} from "./read-values";

/** Load-case and combination names: lowercase words with underscores, as in `roof_live`. */
export const CASE_NAME_PATTERN = /^[a-z][a-z0-9_]{0,39}$/;
const ID_PATTERN = /^[a-z0-9][a-z0-9_+.-]{0,63}$/;
const MAX_COMBINATIONS = 50;

function readFactors(ctx: ReadContext, value: unknown, path: FieldPath): Record<string, number> | null {
  if (!isJsonObject(value)) {
    ctx.issues.add(path, 'must be an object of load case factors, e.g. {"dead": 1, "live": 1}');
    return null;
  }
  const entries = Object.entries(value);
  if (entries.length === 0) {
    ctx.issues.add(path, "must name at least one load case");
    return null;
  }
  const factors: Record<string, number> = {};
  let ok = true;
  for (const [name, factor] of entries) {
    const factorPath = childPath(path, name);
    if (!CASE_NAME_PATTERN.test(name)) {
      ctx.issues.add(factorPath, "load case names are lowercase letters, digits and _ (starting with a letter), up to 40 characters");
      ok = false;
      continue;
    }
    const read = readNumber(ctx, factor, factorPath, "any");
    if (read === null) ok = false;
    else factors[name] = read;
  }
  return ok ? factors : null;
}

function readCreep(ctx: ReadContext, value: unknown, path: FieldPath): Combination["creep"] | null {
  if (value === "material" || value === "ibc_creep_component") return value;
  if (typeof value === "number") return readNumber(ctx, value, path, "nonNegative");
  ctx.issues.add(path, 'must be "material" (the member material\'s creep factor), "ibc_creep_component" (IBC 2021 Table 1604.3 creep component) or a non-negative number');
  return null;
}

const COMBINATION_FIELDS = ["id", "label", "factors", "sustainedFactors", "creep", "limitRatio", "cantileverLimitRatio", "cap"] as const;
const COMBINATION_SPEC = createFieldSpec(COMBINATION_FIELDS, ["id", "label", "factors", "limitRatio"]);
const OVERRIDE_COMBINATION_SPEC = createFieldSpec(COMBINATION_FIELDS.filter((f) => f !== "id"));
const FREQUENCY_FIELDS = ["min", "massFactors"];
const FREQUENCY_SPEC = createFieldSpec(FREQUENCY_FIELDS);
const FREQUENCY_REQUIRED_SPEC = createFieldSpec(FREQUENCY_FIELDS, FREQUENCY_FIELDS);
const CUSTOM_PROFILE_SPEC = createFieldSpec(
  ["id", "label", "source", "combinations", "cantileverSpanMultiplier", "frequency", "patternLoads", "variableCases"],
  ["id", "label", "source", "combinations", "cantileverSpanMultiplier"],
);
const OVERRIDES_SPEC = createFieldSpec(["combinations", "cantileverSpanMultiplier", "frequency", "patternLoads", "variableCases"]);
const MAX_VARIABLE_CASES = 20;
const LIMITS_SPEC = createFieldSpec(["preset", "overrides", "custom", "sustainedLiveFraction", "id"]);

/** Reads the editable parts of a combination onto `target` (used by custom profiles and overrides). */
function readCombinationFields(ctx: ReadContext, source: JsonObject, path: FieldPath, target: Partial<Combination>): boolean {
  let ok = true;
  if (source.label !== undefined) {
    const label = readString(ctx, source.label, childPath(path, "label"));
    if (label === null) ok = false;
    else target.label = label;
  }
  if (source.factors !== undefined) {
    const factors = readFactors(ctx, source.factors, childPath(path, "factors"));
    if (factors === null) ok = false;
    else target.factors = factors;
  }
  if (source.sustainedFactors !== undefined) {
    const sustained = readFactors(ctx, source.sustainedFactors, childPath(path, "sustainedFactors"));
    if (sustained === null) ok = false;
    else target.sustainedFactors = sustained;
  }
  if (source.creep !== undefined) {
    const creep = readCreep(ctx, source.creep, childPath(path, "creep"));
    if (creep === null) ok = false;
    else target.creep = creep;
  }
  if (source.limitRatio !== undefined) {
    const ratio = readNumber(ctx, source.limitRatio, childPath(path, "limitRatio"), "positive");
    if (ratio === null) ok = false;
    else target.limitRatio = ratio;
  }
  if (source.cantileverLimitRatio !== undefined) {
    const ratio = readNumber(ctx, source.cantileverLimitRatio, childPath(path, "cantileverLimitRatio"), "positive");
    if (ratio === null) ok = false;
    else target.cantileverLimitRatio = ratio;
  }
  if (source.cap !== undefined) {
    const capMm = readQuantity(ctx, source.cap, childPath(path, "cap"), "deflection", "positive");
    if (capMm === null) ok = false;
    else target.capMm = capMm;
  }
  return ok;
}

/**
 * Reads the pattern-loading switches onto `target`: patternLoads (boolean; false loads every
 * span at once) and variableCases (user case names patterned besides live, roof_live, snow).
 */
function readPatternFields(ctx: ReadContext, block: JsonObject, path: FieldPath, target: Pick<LimitProfile, "patternLoads" | "variableCases">): boolean {
  let ok = true;
  if (block.patternLoads !== undefined) {
    const on = readBoolean(ctx, block.patternLoads, childPath(path, "patternLoads"));
    if (on === null) ok = false;
    else target.patternLoads = on;
  }
  if (block.variableCases !== undefined) {
    const casesPath = childPath(path, "variableCases");
    if (!Array.isArray(block.variableCases) || block.variableCases.length > MAX_VARIABLE_CASES) {
      ctx.issues.add(casesPath, `must be an array of up to ${MAX_VARIABLE_CASES} load case names`);
      return false;
    }
    const names: string[] = [];
    block.variableCases.forEach((entry, index) => {
      const name = readString(ctx, entry, childPath(casesPath, index), 40);
      if (name === null) ok = false;
      else if (!CASE_NAME_PATTERN.test(name)) {
        ctx.issues.add(childPath(casesPath, index), "load case names are lowercase letters, digits and _ (starting with a letter), up to 40 characters");
        ok = false;
      } else names.push(name);
    });
    if (ok) target.variableCases = names;
  }
  return ok;
}

function readFrequency(ctx: ReadContext, value: unknown, path: FieldPath, base: LimitProfile["frequency"]): LimitProfile["frequency"] | null {
  const block = readObject(ctx, value, path, base ? FREQUENCY_SPEC : FREQUENCY_REQUIRED_SPEC);
  if (!block) return null;
  const minHz = block.min === undefined ? base?.minHz : readQuantity(ctx, block.min, childPath(path, "min"), "frequency", "positive");
  const massFactors =
    block.massFactors === undefined ? base?.massFactors : readFactors(ctx, block.massFactors, childPath(path, "massFactors"));
  if (minHz === null || minHz === undefined || massFactors === null || massFactors === undefined) return null;
  return { minHz, massFactors };
}

/** Reads a custom profile (the `limits.custom` format); also validates an organization profile definition (parse-limit-profile.ts). */
export function readCustomProfile(ctx: ReadContext, value: unknown, path: FieldPath): LimitProfile | null {
  const block = readObject(ctx, value, path, CUSTOM_PROFILE_SPEC);
  if (!block) return null;
  const id = readString(ctx, block.id, childPath(path, "id"), 64);
  if (id !== null && !ID_PATTERN.test(id)) ctx.issues.add(childPath(path, "id"), "must be lowercase letters, digits and _ + . -");
  const label = readString(ctx, block.label, childPath(path, "label"));
  const source = readString(ctx, block.source, childPath(path, "source"), 500);
  const multiplier = readNumber(ctx, block.cantileverSpanMultiplier, childPath(path, "cantileverSpanMultiplier"), "positive");
  const combinations: Combination[] = [];
  const combosPath = childPath(path, "combinations");
  let ok = true;
  if (!Array.isArray(block.combinations) || block.combinations.length === 0 || block.combinations.length > MAX_COMBINATIONS) {
    ctx.issues.add(combosPath, `must be an array of 1 to ${MAX_COMBINATIONS} combinations`);
    ok = false;
  } else {
    const seen = new Set<string>();
    block.combinations.forEach((entry, index) => {
      const comboPath = childPath(combosPath, index);
      const combo = readObject(ctx, entry, comboPath, COMBINATION_SPEC);
      if (!combo) return void (ok = false);
      const comboId = readString(ctx, combo.id, childPath(comboPath, "id"), 64);
      if (comboId !== null && !ID_PATTERN.test(comboId)) {
        ctx.issues.add(childPath(comboPath, "id"), "must be lowercase letters, digits and _ + . -");
        ok = false;
      } else if (comboId !== null && seen.has(comboId)) {
        ctx.issues.add(childPath(comboPath, "id"), `duplicate combination id "${comboId}"`);
        ok = false;
      }
      const target: Partial<Combination> = {};
      if (!readCombinationFields(ctx, combo, comboPath, target) || comboId === null) return void (ok = false);
      seen.add(comboId);
      if (target.label === undefined || target.factors === undefined || target.limitRatio === undefined) return void (ok = false);
      combinations.push({ ...target, id: comboId, label: target.label, factors: target.factors, limitRatio: target.limitRatio });
    });
  }
  const frequency = block.frequency === undefined ? undefined : readFrequency(ctx, block.frequency, childPath(path, "frequency"), undefined);
  const pattern: Pick<LimitProfile, "patternLoads" | "variableCases"> = {};
  if (!readPatternFields(ctx, block, path, pattern)) ok = false;
  if (!ok || id === null || label === null || source === null || multiplier === null || frequency === null) return null;
  return { id, label, source, combinations, cantileverSpanMultiplier: multiplier, ...(frequency ? { frequency } : {}), ...pattern };
}

function applyOverrides(ctx: ReadContext, preset: LimitProfile, value: unknown, path: FieldPath): LimitProfile | null {
  const block = readObject(ctx, value, path, OVERRIDES_SPEC);
  if (!block) return null;
  let ok = true;
  const profile: LimitProfile = { ...preset, label: `${preset.label} (edited)`, source: `${preset.source}; edited by the schedule` };
  if (block.combinations !== undefined) {
    const combosPath = childPath(path, "combinations");
    if (!isJsonObject(block.combinations)) {
      ctx.issues.add(combosPath, 'must be an object keyed by combination id, e.g. {"live": {"limitRatio": 480}}');
      ok = false;
    } else {
      for (const [comboId, override] of Object.entries(block.combinations)) {
        const comboPath = childPath(combosPath, comboId);
        const target = profile.combinations.find((c) => c.id === comboId);
        if (!target) {
          ctx.issues.add(comboPath, `no combination "${comboId}" in preset ${preset.id}; its combinations: ${preset.combinations.map((c) => c.id).join(", ")}`);
          ok = false;
          continue;
        }
        const fields = readObject(ctx, override, comboPath, OVERRIDE_COMBINATION_SPEC);
        if (!fields || !readCombinationFields(ctx, fields, comboPath, target)) ok = false;
        // an edited combination no longer checks what its preset label cites
        else if (fields.label === undefined) target.label = `${target.label} (edited)`;
      }
    }
  }
  if (block.cantileverSpanMultiplier !== undefined) {
    const multiplier = readNumber(ctx, block.cantileverSpanMultiplier, childPath(path, "cantileverSpanMultiplier"), "positive");
    if (multiplier === null) ok = false;
    else profile.cantileverSpanMultiplier = multiplier;
  }
  if (block.frequency !== undefined) {
    const frequency = readFrequency(ctx, block.frequency, childPath(path, "frequency"), preset.frequency);
    if (frequency === null) ok = false;
    else profile.frequency = frequency;
  }
  if (!readPatternFields(ctx, block, path, profile)) ok = false;
  return ok ? profile : null;
}

/** `profile.sustainedLiveFraction`: a number from 0 to 1, only for presets that read it (ACI). */
function readSustainedLiveFraction(ctx: ReadContext, value: unknown, path: FieldPath, presetId: string): number | undefined | null {
  if (value === undefined) return undefined;
  const fractionPath = childPath(path, "sustainedLiveFraction");
  if (!presetTakesSustainedLiveFraction(presetId)) {
    ctx.issues.add(fractionPath, `applies only to the ACI 318-19 presets, not ${presetId}`);
    return null;
  }
  const fraction = readNumber(ctx, value, fractionPath, "nonNegative");
  if (fraction !== null && fraction > 1) {
    ctx.issues.add(fractionPath, "is the sustained part of the live load, from 0 to 1 (e.g. 0.25), not a percentage");
    return null;
  }
  return fraction;
}

/** `profile: { "id": id }`: one of the organization's own profiles, as resolved by the caller. */
function readOrganizationProfile(ctx: ReadContext, block: JsonObject, path: FieldPath): LimitProfile | null {
  const profilePath = childPath(path, "id");
  if (Object.keys(block).length > 1) {
    ctx.issues.add(path, "give id alone: an organization profile cannot be combined with preset, overrides, custom or sustainedLiveFraction");
    return null;
  }
  const id = readString(ctx, block.id, profilePath, 64);
  if (id === null) return null;
  const found = ctx.organizationProfiles?.get(id);
  if (found === undefined) {
    ctx.issues.add(profilePath, `unknown limit profile "${id}": not one of this organization's profiles (Settings, Limit profiles)`);
    return null;
  }
  return found;
}

/**
 * Reads `profile`: `{ "preset": id }`, `{ "preset": id, "overrides": {...} }` or
 * `{ "custom": profile }`; an ACI preset may add `sustainedLiveFraction`; `{ "id": "lp_..." }` names
 * an organization profile (ParseScheduleOptions.organizationProfiles). Unknown preset ids
 * list the known ones.
 */
export function readLimits(ctx: ReadContext, value: unknown, path: FieldPath): LimitProfile | null {
  const block = readObject(ctx, value, path, LIMITS_SPEC);
  if (!block) return null;
  if (block.id !== undefined) return readOrganizationProfile(ctx, block, path);
  if (block.custom !== undefined) {
    if (block.preset !== undefined || block.overrides !== undefined || block.sustainedLiveFraction !== undefined) {
      ctx.issues.add(path, "give either custom, or preset with optional overrides (and sustainedLiveFraction), not both");
      return null;
    }
    return readCustomProfile(ctx, block.custom, childPath(path, "custom"));
  }
  if (block.preset === undefined) {
    ctx.issues.add(childPath(path, "preset"), `is required (or give custom); presets: ${listPresetIds().join(", ")}`);
    return null;
  }
  const presetId = readString(ctx, block.preset, childPath(path, "preset"), 64);
  if (presetId === null) return null;
  if (!listPresetIds().includes(presetId)) {
    ctx.issues.add(childPath(path, "preset"), `unknown preset "${presetId}"; presets: ${listPresetIds().join(", ")}`);
    return null;
  }
  const sustainedLiveFraction = readSustainedLiveFraction(ctx, block.sustainedLiveFraction, path, presetId);
  if (sustainedLiveFraction === null) return null;
  const preset = getPreset(presetId, sustainedLiveFraction === undefined ? {} : { sustainedLiveFraction });
  if (!preset) return null;
  return block.overrides === undefined ? preset : applyOverrides(ctx, preset, block.overrides, childPath(path, "overrides"));
}
