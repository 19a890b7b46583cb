import type { InputIssue, Member, ReinforcedConcreteSection } from "../model";
import { isPositiveFinite } from "../solver/validate-member";
import { describeMissingTopSteel, findHoggingCause, findSpansWithoutTopSteel } from "./hogging-causes";

/** Largest tension steel ratio A_s / (b_w d) accepted; above it the input is almost surely a unit slip (ACI 318 columns stop at 0.08). */
export const MAX_TENSION_STEEL_RATIO = 0.08;

type SectionField = keyof ReinforcedConcreteSection;

const REQUIRED_POSITIVE: SectionField[] = ["webWidthMm", "depthMm", "tensionSteelMm2", "effectiveDepthMm", "steelEMpa", "ruptureMpa"];
const OPTIONAL_POSITIVE: SectionField[] = ["flangeWidthMm", "flangeThicknessMm", "compressionSteelMm2", "compressionDepthMm", "topSteelMm2", "topEffectiveDepthMm"];

/** A problem with one field of a reinforced section (the engine's field name). */
export interface ReinforcementProblem {
  field: SectionField;
  message: string;
}

/**
 * Geometric problems of a reinforced section whose numbers are positive and finite: d < h,
 * d' < d, d_top < h, flange, compression steel and top steel given whole, flange at least as wide as the web and
 * thinner than h, tension steel at most MAX_TENSION_STEEL_RATIO of b_w d.
 */
export function findReinforcementProblems(section: ReinforcedConcreteSection): ReinforcementProblem[] {
  const issues: InputIssue[] = [];
  collectGeometryIssues(section, "", issues);
  return issues.map((issue) => ({ field: issue.path.slice(1) as SectionField, message: issue.message }));
}

function collectGeometryIssues(section: ReinforcedConcreteSection, path: string, issues: InputIssue[]): void {
  if (section.effectiveDepthMm >= section.depthMm) issues.push({ path: `${path}.effectiveDepthMm`, message: `effective depth d (${section.effectiveDepthMm} mm) must be less than the section depth h (${section.depthMm} mm)` });
  if ((section.flangeWidthMm === undefined) !== (section.flangeThicknessMm === undefined)) issues.push({ path: `${path}.flangeWidthMm`, message: "a flange needs both its width and its thickness" });
  if (section.flangeWidthMm !== undefined && section.flangeWidthMm < section.webWidthMm) issues.push({ path: `${path}.flangeWidthMm`, message: "the flange width must not be less than the web width" });
  if (section.flangeThicknessMm !== undefined && section.flangeThicknessMm >= section.depthMm) issues.push({ path: `${path}.flangeThicknessMm`, message: "the flange thickness must be less than the section depth h" });
  if ((section.compressionSteelMm2 === undefined) !== (section.compressionDepthMm === undefined)) issues.push({ path: `${path}.compressionSteelMm2`, message: "compression steel needs both its area and its depth d'" });
  if (section.compressionDepthMm !== undefined && section.compressionDepthMm >= section.effectiveDepthMm) issues.push({ path: `${path}.compressionDepthMm`, message: "the compression steel depth d' must be less than the effective depth d" });
  if ((section.topSteelMm2 === undefined) !== (section.topEffectiveDepthMm === undefined)) issues.push({ path: `${path}.topSteelMm2`, message: "top steel needs both its area and its depth d_top from the bottom face" });
  if (section.topEffectiveDepthMm !== undefined && section.topEffectiveDepthMm >= section.depthMm) issues.push({ path: `${path}.topEffectiveDepthMm`, message: `the top steel depth d_top (${section.topEffectiveDepthMm} mm, from the bottom face) must be less than the section depth h (${section.depthMm} mm)` });
  if (section.topSteelMm2 !== undefined && section.topEffectiveDepthMm !== undefined && section.topSteelMm2 > MAX_TENSION_STEEL_RATIO * section.webWidthMm * section.topEffectiveDepthMm) {
    issues.push({ path: `${path}.topSteelMm2`, message: `top steel is more than ${MAX_TENSION_STEEL_RATIO * 100}% of b_w d_top: check the area and its unit` });
  }
  if (section.tensionSteelMm2 > MAX_TENSION_STEEL_RATIO * section.webWidthMm * section.effectiveDepthMm) {
    issues.push({ path: `${path}.tensionSteelMm2`, message: `tension steel is more than ${MAX_TENSION_STEEL_RATIO * 100}% of b_w d: check the area and its unit` });
  }
}

/**
 * Adds the problems in the reinforced concrete data of a member's spans to `issues` (paths
 * `spans[i].reinforcedConcrete.field`) and returns it: positive finite numbers, d < h, d' < d,
 * flange and compression steel given whole, a plausible steel ratio, and top steel wherever the
 * member can hog (hogging-causes.ts). Adds nothing when no span is reinforced (and allocates
 * nothing: this runs for every member).
 */
export function collectReinforcementIssues(member: Member, issues: InputIssue[] = []): InputIssue[] {
  if (!Array.isArray(member.spans)) return issues;
  let reinforced = false;
  for (let index = 0; index < member.spans.length; index++) {
    const section = member.spans[index]!.reinforcedConcrete;
    if (section === undefined) continue;
    reinforced = true;
    const path = `spans[${index}].reinforcedConcrete`;
    const before = issues.length;
    for (const field of REQUIRED_POSITIVE) if (!isPositiveFinite(section[field])) issues.push({ path: `${path}.${field}`, message: "must be a positive finite number" });
    for (const field of OPTIONAL_POSITIVE) if (section[field] !== undefined && !isPositiveFinite(section[field])) issues.push({ path: `${path}.${field}`, message: "must be a positive finite number" });
    if (issues.length === before) collectGeometryIssues(section, path, issues);
  }
  if (reinforced && issues.length === 0) collectTopSteelIssues(member, issues);
  return issues;
}

function collectTopSteelIssues(member: Member, issues: InputIssue[]): void {
  const missing = findSpansWithoutTopSteel(member);
  if (missing.length === 0) return;
  const cause = findHoggingCause(member);
  if (cause === null) return;
  for (const index of missing) issues.push({ path: `spans[${index}].reinforcedConcrete.topSteelMm2`, message: describeMissingTopSteel(cause) });
}
