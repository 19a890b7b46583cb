import type { CatalogueSection, InputIssue, LimitProfile, Member } from "./model";
import { evaluateValidatedMember, getStiffnessDemandRatio, type MemberEvaluation } from "./checks/evaluate-member";
import { EngineInputError } from "./solver/engine-input-error";
import { isPositiveFinite } from "./solver/validate-member";

export interface SectionSuggestion {
  /** Second moment (mm^4), the same in every span, at which the governing demand is exactly 1. */
  minIMm4: number;
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

function getDemandAtI(member: Member, profile: LimitProfile, iMm4: number): number {
  return getStiffnessDemandRatio(evaluateValidatedMember(createUniformIMember(member, iMm4), profile));
}

/** How far above the current I the shear-deformation search looks before giving up. */
const MAX_I_GROWTH = 4 ** 10;

/**
 * Minimum uniform I. Deflection scales with 1/I and f^2 with I when only I changes (the area,
 * hence self-weight and mass, stays), so without shear deformation I x demand is exact. Shear
 * deflection does not scale with I: then bisect on log I. Null when even MAX_I_GROWTH times the
 * current I fails (the shear deflection alone governs).
 */
function findMinimumI(member: Member, profile: LimitProfile, current?: MemberEvaluation): number | null {
  const referenceI = Math.max(...member.spans.map((span) => span.iMm4));
  const demand = current !== undefined && isUniformI(member) ? getStiffnessDemandRatio(current) : getDemandAtI(member, profile, referenceI);
  if (member.includeShearDeformation !== true) return referenceI * demand;
  let lo = referenceI;
  let hi = referenceI * Math.max(demand, 1);
  while (getDemandAtI(member, profile, hi) > 1) {
    lo = hi;
    hi *= 4;
    if (hi > referenceI * MAX_I_GROWTH) return null;
  }
  for (let iteration = 0; iteration < 80 && hi / lo > 1 + 1e-13; iteration++) {
    const mid = Math.sqrt(lo * hi);
    if (getDemandAtI(member, profile, mid) > 1) lo = mid;
    else hi = mid;
  }
  return hi;
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
 * Resizing advice for a failing, validated member: the minimum uniform I and the lightest passing
 * catalogue section (when a catalogue is given). When no I can pass (shear deflection alone
 * exceeds a limit) the suggestion is null and a note says why.
 */
export function suggestResize(member: Member, profile: LimitProfile, current: MemberEvaluation, catalogue?: CatalogueSection[]): SuggestionOutcome {
  const minIMm4 = findMinimumI(member, profile, current);
  if (minIMm4 === null || !Number.isFinite(minIMm4)) {
    return { suggestion: null, notes: [`No practical second moment of area makes this member pass (even ${MAX_I_GROWTH} times the current one fails): the shear deflection governs; increase the shear area or shorten the span.`] };
  }
  const sectionName = catalogue === undefined || catalogue.length === 0 ? null : findLightestPassingSection(member, profile, catalogue);
  const notes = catalogue !== undefined && catalogue.length > 0 && sectionName === null ? ["No catalogue section passes."] : [];
  return { suggestion: { minIMm4, sectionName }, notes };
}
