import type { InputIssue, Load, Member, Support, SupportKind } from "../model";
import { describeOutOfBounds, QUANTITY_BOUNDS } from "../input-bounds";
import { INTERNAL_UNITS, type QuantityKind } from "../units/unit-table";
import { EngineInputError } from "./engine-input-error";

const SUPPORT_KINDS: ReadonlySet<string> = new Set<SupportKind>(["pinned", "roller", "fixed", "free", "spring"]);

/** Positions closer than this fraction of the member length to a node count as on the node. */
export const POSITION_TOLERANCE_RATIO = 1e-9;

/** True for a number that is finite and > 0 (not NaN, not +-Infinity). */
export function isPositiveFinite(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value) && value > 0;
}

/** True for a number that is finite (not NaN, not +-Infinity). */
export function isFiniteNumber(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value);
}

/**
 * The member is continuous (no internal hinges): it is stable exactly when the supports stop
 * both rigid-body movements, vertical translation and rotation, i.e. with a fixed support or at
 * least two vertical restraints (pinned, roller or spring). Assumes known kinds and, for springs,
 * a valid stiffness.
 */
export function isStableSupportSet(supports: readonly Support[]): boolean {
  let vertical = 0;
  for (const support of supports) {
    if (support.kind === "fixed") return true;
    if (support.kind !== "free") vertical += 1;
  }
  return vertical >= 2;
}

function getTotalLengthMm(member: Member): number {
  let total = 0;
  for (const span of member.spans) total += isPositiveFinite(span.lengthMm) ? span.lengthMm : 0;
  return total;
}

/**
 * The path `collection[index].field` of an issue. Built only when an issue is found: validation
 * runs for every member, and building every field's path up front cost a measurable share of a
 * single-span check (bench:engine).
 */
function getFieldPath(collection: string, index: number, field: string): string {
  return `${collection}[${index}].${field}`;
}

/** A size (span, E, I, ...): positive, finite and inside its physical range (input-bounds.ts). */
function collectSizeIssue(collection: string, index: number, field: string, value: unknown, kind: QuantityKind, what: string, issues: InputIssue[]): void {
  // the common case first, in one range test: > 0 and inside the bounds (NaN fails every comparison)
  const bound = QUANTITY_BOUNDS[kind];
  if (typeof value === "number" && value > 0 && value >= bound.minAbs && value <= bound.maxAbs) return;
  if (isPositiveFinite(value)) {
    const outOfBounds = describeOutOfBounds(kind, value, INTERNAL_UNITS[kind]);
    if (outOfBounds !== null) issues.push({ path: getFieldPath(collection, index, field), message: `${what} ${outOfBounds}` });
    return;
  }
  issues.push({ path: getFieldPath(collection, index, field), message: `${what} must be a positive finite number (${INTERNAL_UNITS[kind]})` });
}

/** A signed value (load intensity, force, moment): finite and not beyond its physical range. */
function collectSignedIssue(index: number, field: string, value: unknown, kind: QuantityKind, what: string, issues: InputIssue[]): void {
  const maxAbs = QUANTITY_BOUNDS[kind].maxAbs;
  if (typeof value === "number" && value >= -maxAbs && value <= maxAbs) return;
  if (isFiniteNumber(value)) {
    const outOfBounds = describeOutOfBounds(kind, value, INTERNAL_UNITS[kind], true);
    if (outOfBounds !== null) issues.push({ path: getFieldPath("loads", index, field), message: `${what} ${outOfBounds}` });
    return;
  }
  issues.push({ path: getFieldPath("loads", index, field), message: `${what} must be a finite number (${INTERNAL_UNITS[kind]})` });
}

function collectSpanIssues(member: Member, issues: InputIssue[]): void {
  for (let index = 0; index < member.spans.length; index++) {
    const span = member.spans[index]!;
    collectSizeIssue("spans", index, "lengthMm", span.lengthMm, "length", "span length", issues);
    collectSizeIssue("spans", index, "eMpa", span.eMpa, "modulus", "modulus of elasticity", issues);
    collectSizeIssue("spans", index, "iMm4", span.iMm4, "secondMoment", "second moment of area", issues);
    if (span.areaMm2 !== undefined) collectSizeIssue("spans", index, "areaMm2", span.areaMm2, "area", "area", issues);
    if (span.densityKgPerM3 !== undefined) collectSizeIssue("spans", index, "densityKgPerM3", span.densityKgPerM3, "density", "density", issues);
    if (member.selfWeightCase !== undefined) {
      if (span.areaMm2 === undefined) issues.push({ path: getFieldPath("spans", index, "areaMm2"), message: `self-weight (case "${member.selfWeightCase}") needs the section area` });
      if (span.densityKgPerM3 === undefined) issues.push({ path: getFieldPath("spans", index, "densityKgPerM3"), message: `self-weight (case "${member.selfWeightCase}") needs the material density` });
    }
    if (member.includeShearDeformation === true) {
      collectSizeIssue("spans", index, "shearAreaMm2", span.shearAreaMm2, "area", "shear deformation is requested: the shear area k*A", issues);
      collectSizeIssue("spans", index, "gMpa", span.gMpa, "modulus", "shear deformation is requested: the shear modulus", issues);
    }
  }
}

function collectSupportIssues(member: Member, issues: InputIssue[]): void {
  if (member.supports.length !== member.spans.length + 1) {
    issues.push({ path: "supports", message: `a member with ${member.spans.length} span(s) needs ${member.spans.length + 1} supports (one per node), got ${member.supports.length}` });
    return;
  }
  for (let index = 0; index < member.supports.length; index++) {
    const support = member.supports[index]!;
    if (!SUPPORT_KINDS.has(support.kind)) {
      issues.push({ path: `supports[${index}].kind`, message: `unknown support kind "${String(support.kind)}" (pinned, roller, fixed, free or spring)` });
      continue;
    }
    if (support.kind === "spring") {
      collectSizeIssue("supports", index, "springNPerMm", support.springNPerMm, "springStiffness", "a spring support's vertical stiffness", issues);
    }
  }
  // with no issue so far every kind is known and every spring valid, as isStableSupportSet assumes
  if (issues.length === 0 && !isStableSupportSet(member.supports)) {
    issues.push({
      path: "supports",
      message: member.supports.every((support) => support.kind === "free")
        ? "the member is unsupported (every support is free): it is a mechanism and cannot be analysed"
        : "the member is a mechanism: a single pinned, roller or spring support cannot stop it rotating; add a fixed support or a second support",
    });
  }
}

function collectPositionIssue(index: number, field: string, xMm: unknown, totalMm: number, tolMm: number, issues: InputIssue[]): void {
  if (!isFiniteNumber(xMm)) issues.push({ path: getFieldPath("loads", index, field), message: "position must be a finite number (mm from the member's left end)" });
  else if (xMm < -tolMm || xMm > totalMm + tolMm) issues.push({ path: getFieldPath("loads", index, field), message: `position ${xMm} mm is outside the member (0 to ${totalMm} mm)` });
}

function collectLoadIssues(load: Load, index: number, totalMm: number, issues: InputIssue[]): void {
  const tolMm = totalMm * POSITION_TOLERANCE_RATIO;
  if (typeof load.loadCase !== "string" || load.loadCase === "") issues.push({ path: getFieldPath("loads", index, "loadCase"), message: "a load needs a load case name" });
  switch (load.kind) {
    case "uniform": {
      collectSignedIssue(index, "wNPerMm", load.wNPerMm, "distributedLoad", "load intensity", issues);
      if (load.startMm !== undefined) collectPositionIssue(index, "startMm", load.startMm, totalMm, tolMm, issues);
      if (load.endMm !== undefined) collectPositionIssue(index, "endMm", load.endMm, totalMm, tolMm, issues);
      const start = load.startMm ?? 0;
      const end = load.endMm ?? totalMm;
      if (isFiniteNumber(start) && isFiniteNumber(end) && !(end > start)) issues.push({ path: getFieldPath("loads", index, "endMm"), message: "a partial load must end after it starts" });
      return;
    }
    case "linear": {
      collectSignedIssue(index, "wStartNPerMm", load.wStartNPerMm, "distributedLoad", "load intensity", issues);
      collectSignedIssue(index, "wEndNPerMm", load.wEndNPerMm, "distributedLoad", "load intensity", issues);
      collectPositionIssue(index, "startMm", load.startMm, totalMm, tolMm, issues);
      collectPositionIssue(index, "endMm", load.endMm, totalMm, tolMm, issues);
      if (isFiniteNumber(load.startMm) && isFiniteNumber(load.endMm) && !(load.endMm > load.startMm)) issues.push({ path: getFieldPath("loads", index, "endMm"), message: "a linearly varying load must end after it starts" });
      return;
    }
    case "point":
      collectSignedIssue(index, "pN", load.pN, "force", "point load", issues);
      collectPositionIssue(index, "atMm", load.atMm, totalMm, tolMm, issues);
      return;
    case "moment":
      collectSignedIssue(index, "mNmm", load.mNmm, "moment", "applied moment", issues);
      collectPositionIssue(index, "atMm", load.atMm, totalMm, tolMm, issues);
      return;
    default:
      issues.push({ path: getFieldPath("loads", index, "kind"), message: `unknown load kind "${String((load as { kind: unknown }).kind)}" (uniform, linear, point or moment)` });
  }
}

/**
 * Lists every problem that stops the member from being analysed, with paths relative to the
 * member (`spans[1].iMm4`, `loads[3].atMm`, `supports`). An empty list means solvable.
 */
export function collectMemberIssues(member: Member): InputIssue[] {
  const issues: InputIssue[] = [];
  if (!Array.isArray(member.spans) || member.spans.length === 0) {
    issues.push({ path: "spans", message: "a member needs at least one span" });
    return issues;
  }
  if (!Array.isArray(member.supports)) {
    issues.push({ path: "supports", message: "a member needs one support per node" });
    return issues;
  }
  collectSpanIssues(member, issues);
  collectSupportIssues(member, issues);
  if (member.materialCreepFactor !== undefined && !(isFiniteNumber(member.materialCreepFactor) && member.materialCreepFactor >= 0)) {
    issues.push({ path: "materialCreepFactor", message: "creep factor must be a finite number >= 0" });
  }
  const totalMm = getTotalLengthMm(member);
  if (!Array.isArray(member.loads)) {
    issues.push({ path: "loads", message: "a member needs a list of loads (it may be empty)" });
    return issues;
  }
  for (let index = 0; index < member.loads.length; index++) collectLoadIssues(member.loads[index]!, index, totalMm, issues);
  return issues;
}

/** Throws EngineInputError listing every issue when the member cannot be analysed. */
export function assertMemberValid(member: Member): void {
  const issues = collectMemberIssues(member);
  if (issues.length > 0) throw new EngineInputError(issues);
}
