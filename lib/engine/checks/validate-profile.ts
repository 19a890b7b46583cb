import type { Combination, InputIssue, LimitProfile, Member } from "../model";
import { isFiniteNumber, isPositiveFinite } from "../solver/validate-member";

/**
 * The path of a combination's field. Built only for an issue: profile validation runs for every
 * member, and building each path up front cost a measurable share of a single-span check.
 */
function getCombinationPath(index: number, field: string): string {
  return `combinations[${index}].${field}`;
}

/** `parent`: the combination's index, or the path of the object holding the factors. */
function collectFactorIssues(factors: Record<string, number> | undefined, parent: number | string, field: string, issues: InputIssue[]): void {
  if (factors === undefined) return;
  if (typeof factors !== "object" || factors === null) {
    issues.push({ path: typeof parent === "number" ? getCombinationPath(parent, field) : `${parent}.${field}`, message: "factors must be an object of load case name to number" });
    return;
  }
  for (const name in factors) {
    const value = factors[name];
    // the path is built only for a bad value: this runs for every member
    if (!isFiniteNumber(value)) issues.push({ path: `${typeof parent === "number" ? getCombinationPath(parent, field) : `${parent}.${field}`}.${name}`, message: "factor must be a finite number" });
  }
}

function hasEarlierId(combinations: Combination[], index: number): boolean {
  const id = combinations[index]!.id;
  for (let k = 0; k < index; k++) if (combinations[k]!.id === id) return true;
  return false;
}

/**
 * The creep factor a combination applies to its sustained part: the member material's for
 * "material", the member's IBC 2021 Table 1604.3 creep-component factor for
 * "ibc_creep_component", the given number otherwise, 0 when absent (Combination doc in model.ts).
 */
export function getCreepFactor(combination: Combination, member: Member): number {
  if (combination.creep === "material") return member.materialCreepFactor ?? 0;
  if (combination.creep === "ibc_creep_component") return member.ibcCreepComponentFactor ?? 0;
  return combination.creep ?? 0;
}

/**
 * Lists problems in a limit profile (paths relative to the profile) and in its use by the member
 * (a "material" creep combination on a member with no creep factor).
 */
export function collectProfileIssues(profile: LimitProfile, member: Member): InputIssue[] {
  const issues: InputIssue[] = [];
  if (!isPositiveFinite(profile.cantileverSpanMultiplier)) issues.push({ path: "cantileverSpanMultiplier", message: "the cantilever span multiplier must be a positive finite number" });
  if (!Array.isArray(profile.combinations)) {
    issues.push({ path: "combinations", message: "a limit profile needs a list of combinations" });
    return issues;
  }
  const combinations = profile.combinations;
  for (let index = 0; index < combinations.length; index++) {
    const combination = combinations[index]!;
    if (typeof combination.id !== "string" || combination.id === "") issues.push({ path: getCombinationPath(index, "id"), message: "a combination needs an id" });
    else if (hasEarlierId(combinations, index)) issues.push({ path: getCombinationPath(index, "id"), message: `duplicate combination id "${combination.id}"` });
    if (!isPositiveFinite(combination.limitRatio)) issues.push({ path: getCombinationPath(index, "limitRatio"), message: "the limit ratio (span / N) must be a positive finite number" });
    if (combination.capMm !== undefined && !isPositiveFinite(combination.capMm)) issues.push({ path: getCombinationPath(index, "capMm"), message: "the deflection cap must be a positive finite number (mm)" });
    collectFactorIssues(combination.factors, index, "factors", issues);
    collectFactorIssues(combination.sustainedFactors, index, "sustainedFactors", issues);
    if (combination.cantileverLimitRatio !== undefined && !isPositiveFinite(combination.cantileverLimitRatio)) {
      issues.push({ path: getCombinationPath(index, "cantileverLimitRatio"), message: "the cantilever limit ratio (length / N) must be a positive finite number" });
    }
    if (combination.creep === "material") {
      if (member.materialCreepFactor === undefined) issues.push({ path: getCombinationPath(index, "creep"), message: `combination "${combination.id}" uses the material's creep factor but the member has no materialCreepFactor` });
    } else if (combination.creep === "ibc_creep_component") {
      if (!(isFiniteNumber(member.ibcCreepComponentFactor) && member.ibcCreepComponentFactor >= 0)) {
        issues.push({ path: getCombinationPath(index, "creep"), message: `combination "${combination.id}" uses the IBC 2021 Table 1604.3 creep component but the member has no ibcCreepComponentFactor (a finite number >= 0)` });
      }
    } else if (combination.creep !== undefined && !(isFiniteNumber(combination.creep) && combination.creep >= 0)) {
      issues.push({ path: getCombinationPath(index, "creep"), message: "creep factor must be \"material\", \"ibc_creep_component\" or a finite number >= 0" });
    }
  }
  if (profile.patternLoads !== undefined && typeof profile.patternLoads !== "boolean") issues.push({ path: "patternLoads", message: "patternLoads must be true or false" });
  if (profile.variableCases !== undefined && !(Array.isArray(profile.variableCases) && profile.variableCases.every((name) => typeof name === "string"))) {
    issues.push({ path: "variableCases", message: "variableCases must be a list of load case names" });
  }
  if (profile.frequency !== undefined) {
    if (!isPositiveFinite(profile.frequency.minHz)) issues.push({ path: "frequency.minHz", message: "the minimum frequency must be a positive finite number (Hz)" });
    collectFactorIssues(profile.frequency.massFactors, "frequency", "massFactors", issues);
  }
  return issues;
}
