import type { CatalogueSection, InputIssue, LimitProfile, Member } from "./model";
import { evaluateValidatedMember, getStiffnessDemandRatio, type MemberEvaluation } from "./checks/evaluate-member";
import { EngineInputError } from "./solver/engine-input-error";
import { isPositiveFinite } from "./solver/validate-member";

export interface SectionSuggestion {
  /**
   * Second moment (mm^4), the same in every span, at which the member passes and 1 - 1e-9 times
   * which it fails; E, area (self-weight, mass), shear area and supports held (findMinimumI).
   * Null when no I passes with those held (springs, shear deflection or a frequency on soft
   * supports govern); a note then says why, and the catalogue is still searched, because a
   * section brings its own area and shear area.
   */
  minIMm4: number | null;
  /** Lightest catalogue section (by massKgPerM) that passes in every span, null when none. */
  sectionName: string | null;
}

export interface SuggestionOutcome {
  suggestion: SectionSuggestion | null;
  notes: string[];
}

function createUniformIMember(member: Member, iMm4: number): Member {
  return { ...member, spans: member.spans.map((span) => ({ ...span, iMm4 })) };
}

function isUniformI(member: Member): boolean {
  const first = member.spans[0]!.iMm4;
  return member.spans.every((span) => span.iMm4 === first);
}

interface Trial {
  pass: boolean;
  /** ln of the demand ratio (getStiffnessDemandRatio): about -ln(I) + const near a scaling case. */
  logDemand: number;
}

function evaluateAtI(member: Member, profile: LimitProfile, iMm4: number): Trial {
  const evaluation = evaluateValidatedMember(createUniformIMember(member, iMm4), profile);
  return { pass: evaluation.pass, logDemand: Math.log(getStiffnessDemandRatio(evaluation)) };
}

/** How far above the current I the search looks before giving up. */
const MAX_I_GROWTH = 4 ** 10;
/** The bracket's final relative width: the suggested I is at most this far above the minimum. */
export const MINIMUM_I_TOLERANCE = 1e-9;
/** A bound on evaluations per search (expansion plus bracketing: about 60 at the worst). */
const MAX_SEARCH_STEPS = 200;

/**
 * The bracket [lo, hi] (lo fails, hi passes) narrowed to MINIMUM_I_TOLERANCE by false position
 * on ln(demand) against ln(I), Illinois variant (Dowell and Jarratt, BIT 11, 1971, from memory),
 * with a bisection step whenever a step does not halve the bracket. Returns hi.
 */
function narrowBracket(member: Member, profile: LimitProfile, lo: number, loTrial: Trial, hi: number, hiTrial: Trial, steps: number): number {
  let logLo = Math.log(lo);
  let logHi = Math.log(hi);
  // the demand decides the interpolation only; pass/fail decides the bracket
  let gLo = Math.max(loTrial.logDemand, 1e-15);
  let gHi = Math.min(hiTrial.logDemand, -1e-15);
  let retained = 0; // +1: hi kept last step, -1: lo kept
  const tolerance = Math.log1p(MINIMUM_I_TOLERANCE);
  let previousWidth = Number.POSITIVE_INFINITY;
  for (let step = steps; step < MAX_SEARCH_STEPS && logHi - logLo > tolerance; step++) {
    const width = logHi - logLo;
    let t = width > previousWidth / 2 ? (logLo + logHi) / 2 : (logLo * gHi - logHi * gLo) / (gHi - gLo);
    if (!(t > logLo && t < logHi)) t = (logLo + logHi) / 2;
    previousWidth = width;
    const trial = evaluateAtI(member, profile, Math.exp(t));
    if (trial.pass) {
      logHi = t;
      gHi = Math.min(trial.logDemand, -1e-15);
      if (retained === -1) gLo /= 2;
      retained = -1;
    } else {
      logLo = t;
      gLo = Math.max(trial.logDemand, 1e-15);
      if (retained === 1) gHi /= 2;
      retained = 1;
    }
  }
  return Math.exp(logHi);
}

/**
 * Minimum uniform I (mm^4): the I, the same in every span, at which the member passes every check
 * while (1 - MINIMUM_I_TOLERANCE) times it fails. Only I changes: E, the area (so the self-weight
 * and the vibrating mass), the shear area, the supports and the springs stay the member's own.
 * When deflection scales with 1/I and f^2 with I (no springs, no shear deformation) that I is
 * I x demand, and a recheck confirms it passes with a demand within the tolerance of 1. Otherwise (springs settle by a fixed amount, shear
 * deflection and spring-supported frequencies do not scale, the section's rotary inertia grows
 * with I) a bracketed search: expand by doubling (or halving) from that estimate until the
 * member passes (fails), then narrow the bracket. Null when even MAX_I_GROWTH times the current
 * I fails: the springs or the shear deflection alone exceed a limit.
 */
function findMinimumI(member: Member, profile: LimitProfile, current?: MemberEvaluation): number | null {
  const referenceI = Math.max(...member.spans.map((span) => span.iMm4));
  const referenceDemand = current !== undefined && isUniformI(member) ? getStiffnessDemandRatio(current) : Math.exp(evaluateAtI(member, profile, referenceI).logDemand);
  const scaled = referenceI * referenceDemand;
  const estimate = Number.isFinite(scaled) && scaled > 0 ? scaled * (1 + 1e-12) : referenceI;
  const atEstimate = evaluateAtI(member, profile, estimate);
  let steps = 1;
  if (atEstimate.pass) {
    // demand within the tolerance below 1: any smaller I raises it past 1 (it falls with I)
    if (atEstimate.logDemand >= Math.log1p(-MINIMUM_I_TOLERANCE)) return estimate;
    let hi = estimate;
    let hiTrial = atEstimate;
    let lo = hi / 2;
    let loTrial = evaluateAtI(member, profile, lo);
    while (loTrial.pass && steps < MAX_SEARCH_STEPS) {
      hi = lo;
      hiTrial = loTrial;
      lo /= 2;
      loTrial = evaluateAtI(member, profile, lo);
      steps += 1;
    }
    return loTrial.pass ? lo : narrowBracket(member, profile, lo, loTrial, hi, hiTrial, steps);
  }
  let lo = estimate;
  let loTrial = atEstimate;
  let hi = estimate * 2;
  let hiTrial = evaluateAtI(member, profile, hi);
  while (!hiTrial.pass) {
    if (hi > referenceI * MAX_I_GROWTH) return null;
    lo = hi;
    loTrial = hiTrial;
    hi *= 2;
    hiTrial = evaluateAtI(member, profile, hi);
    steps += 1;
  }
  return narrowBracket(member, profile, lo, loTrial, hi, hiTrial, steps);
}

function collectCatalogueIssues(catalogue: CatalogueSection[]): InputIssue[] {
  const issues: InputIssue[] = [];
  catalogue.forEach((section, index) => {
    const path = `catalogue[${index}]`;
    if (typeof section.name !== "string" || section.name === "") issues.push({ path: `${path}.name`, message: "a catalogue section needs a name" });
    if (!isPositiveFinite(section.iMm4)) issues.push({ path: `${path}.iMm4`, message: "second moment must be a positive finite number (mm^4)" });
    if (!isPositiveFinite(section.areaMm2)) issues.push({ path: `${path}.areaMm2`, message: "area must be a positive finite number (mm^2)" });
    if (!isPositiveFinite(section.massKgPerM)) issues.push({ path: `${path}.massKgPerM`, message: "mass per metre must be a positive finite number (kg/m)" });
    if (section.shearAreaMm2 !== undefined && !isPositiveFinite(section.shearAreaMm2)) issues.push({ path: `${path}.shearAreaMm2`, message: "shear area must be a positive finite number (mm^2)" });
  });
  return issues;
}

interface PreparedCatalogue {
  issues: InputIssue[];
  /** Ascending massKgPerM, catalogue order on ties. */
  ordered: CatalogueSection[];
}

// one schedule shares one catalogue array across its failing members: validate and sort it once
const preparedCatalogues = new WeakMap<CatalogueSection[], PreparedCatalogue>();

function getPreparedCatalogue(catalogue: CatalogueSection[]): PreparedCatalogue {
  let prepared = preparedCatalogues.get(catalogue);
  if (prepared === undefined) {
    const issues = collectCatalogueIssues(catalogue);
    const ordered = issues.length > 0
      ? []
      : catalogue.map((section, index) => ({ section, index })).sort((a, b) => a.section.massKgPerM - b.section.massKgPerM || a.index - b.index).map((entry) => entry.section);
    prepared = { issues, ordered };
    preparedCatalogues.set(catalogue, prepared);
  }
  return prepared;
}

function createSectionMember(member: Member, section: CatalogueSection): Member {
  return {
    ...member,
    sectionName: section.name,
    spans: member.spans.map((span) => ({
      ...span,
      iMm4: section.iMm4,
      areaMm2: section.areaMm2,
      shearAreaMm2: member.includeShearDeformation === true ? section.shearAreaMm2 : span.shearAreaMm2,
    })),
  };
}

/**
 * The lightest catalogue section (ascending massKgPerM, catalogue order on ties) that passes
 * every check when substituted in every span, with self-weight and mass re-evaluated from its
 * area (density and E stay the member's). Sections without a shear area are skipped when the
 * member includes shear deformation. Throws EngineInputError for an invalid catalogue entry.
 */
function findLightestPassingSection(member: Member, profile: LimitProfile, catalogue: CatalogueSection[]): string | null {
  const { issues, ordered } = getPreparedCatalogue(catalogue);
  // fresh issue objects per error: callers may keep or rewrite them
  if (issues.length > 0) throw new EngineInputError(issues.map((issue) => ({ ...issue })));
  for (const section of ordered) {
    if (member.includeShearDeformation === true && section.shearAreaMm2 === undefined) continue;
    if (evaluateValidatedMember(createSectionMember(member, section), profile).pass) return section.name;
  }
  return null;
}

/**
 * Why no uniform I can make the member pass (findMinimumI returned null): the parts of the
 * deflection or frequency that do not fall as I grows, those present on this member named.
 */
export function describeNoMinimumI(member: Member, profile: LimitProfile): string {
  const causes: string[] = [];
  if (member.supports.some((support) => support.kind === "spring")) causes.push("the settlement of the support springs");
  if (member.includeShearDeformation === true) causes.push("the shear deflection");
  if (profile.frequency !== undefined) causes.push("the frequency, bounded by the supports and the mass");
  const because = causes.length === 0 ? "the part of the deflection that does not fall as I grows" : causes.join(" and ");
  return `No minimum I exists: even ${MAX_I_GROWTH} times the current second moment of area fails, because ${because} alone exceeds the limit with the area, shear area and supports held; stiffen the supports, increase the shear area or shorten the span.`;
}

/**
 * Resizing advice for a failing, validated member: the minimum uniform I (findMinimumI: only I
 * changes, area and self-weight held) and the lightest passing catalogue section (when a
 * catalogue is given; each section's own area, shear area and self-weight). What the minimum I
 * holds fixed (E, area, shear area, supports) is stated once, in the result schema and on the
 * member page, not repeated per member. When no I can pass, minIMm4 is null and a note says why
 * (describeNoMinimumI); the catalogue is searched all the same, and the suggestion is null only
 * when neither a minimum I nor a passing section exists.
 */
export function suggestResize(member: Member, profile: LimitProfile, current: MemberEvaluation, catalogue?: CatalogueSection[]): SuggestionOutcome {
  const found = findMinimumI(member, profile, current);
  const minIMm4 = found !== null && Number.isFinite(found) ? found : null;
  const hasCatalogue = catalogue !== undefined && catalogue.length > 0;
  const sectionName = hasCatalogue ? findLightestPassingSection(member, profile, catalogue) : null;
  const notes: string[] = [];
  if (minIMm4 === null) notes.push(describeNoMinimumI(member, profile));
  if (hasCatalogue && sectionName === null) notes.push("No catalogue section passes.");
  if (minIMm4 === null && sectionName === null) return { suggestion: null, notes };
  return { suggestion: { minIMm4, sectionName }, notes };
}
