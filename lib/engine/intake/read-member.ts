import type { Load, Member, MemberCategory, ReinforcedConcreteSection, SpanSegment, Support } from "../model";
import type { Material } from "../materials";
import { isStableSupportSet } from "../solver/validate-member";
import { MAX_LOADS_PER_MEMBER, readLoad } from "./read-loads";
import { CONCRETE_DEAD_ONLY_NOTE, readMaterial, resolveMemberCreep, type MemberCreep } from "./read-material";
import { readSection, type ResolvedSection } from "./read-section";
import { createReinforcedSection, readReinforcement, resolveReinforcedCreepFactor, type ReinforcementInput } from "./read-reinforcement";
import { describeMissingTopSteel, findHoggingCause, findSpansWithoutTopSteel } from "../concrete/hogging-causes";
import {
  childPath,
  createFieldSpec,
  isJsonObject,
  isQuantityObject,
  readBoolean,
  readEnum,
  readInteger,
  readObject,
  readQuantity,
  readString,
  formatPath,
  type FieldPath,
  type FindCatalogue,
  type ReadContext,
} from "./read-values";

export const MEMBER_CATEGORIES: readonly MemberCategory[] = ["floor_beam", "roof_beam", "lintel", "purlin_girt", "wall_stud", "cantilever", "other"];
export const MAX_SPANS_PER_MEMBER = 50;
const SUPPORT_KINDS = ["pinned", "roller", "fixed", "free", "spring"] as const;
const MEMBER_SPEC = createFieldSpec(
  ["mark", "category", "quantity", "material", "creep", "moistureCondition", "section", "spans", "overhangs", "supports", "loads", "selfWeight", "shearDeformation", "notes", "reinforcement"],
  ["mark", "category", "quantity", "material", "section", "spans", "supports", "loads"],
);
const SEGMENT_SPEC = createFieldSpec(["length", "section", "material", "reinforcement"], ["length"]);
const OVERHANGS_SPEC = createFieldSpec(["left", "right"]);
const SUPPORT_SPEC = createFieldSpec(["kind", "stiffness"], ["kind"]);

// Every valid member keeps the public path of each span and support (its origins). Each is the
// member's path plus a suffix that many members share, so building one is a single `+`.
const LEFT_OVERHANG_SUFFIX = ".overhangs.left";
const RIGHT_OVERHANG_SUFFIX = ".overhangs.right";
const SUFFIX_CACHE_LIMIT = 64;
const spanSuffixes: string[] = [];
const supportSuffixes: string[] = [];

/** `.spans[2]` for ("spans", 2): the text joinPath gives below a member, cached per index. */
function getIndexSuffix(cache: string[], field: string, index: number): string {
  let suffix = cache[index];
  if (suffix === undefined) {
    suffix = `.${field}[${index}]`;
    if (index < SUFFIX_CACHE_LIMIT) cache[index] = suffix;
  }
  return suffix;
}

/** Where each engine span and support came from in the public format, for engine messages. */
export interface MemberOrigins {
  spans: string[];
  supports: string[];
  /** Where each span's reinforcement block was given (the member's or the span's own); only on reinforced members. */
  reinforcements?: (string | null)[];
}

/** What the member reader needs from the schedule-level profile. */
export interface ProfileFacts {
  id: string;
  /** null when the profile itself is invalid: members are still checked, cases are not. */
  cases: Set<string> | null;
  usesCreep: boolean;
  /** The profile has an IBC 2021 Table 1604.3 D + L row (creep "ibc_creep_component"). */
  usesIbcCreep?: boolean;
}

interface SegmentDraft {
  /** The public path of this span, e.g. `members[4].spans[1]` (the member's origins). */
  origin: string;
  lengthMm: number;
  section: ResolvedSection;
  material: Material;
  /** The span's reinforcement as read (its own or the member's), null for none. */
  reinforcement: ReinforcementInput | null;
}

/** An overhang that is not given (or is zero long) adds no span. */
type SegmentRead = SegmentDraft | null | "none";

/** Reinforcement read so far: none given (null), given and read, or given with issues. */
type ReinforcementRead = ReinforcementInput | null | "invalid";

/** A span entry: a length (number or {value, unit}) or `{ length, section?, material? }`. */
function readSegment(
  ctx: ReadContext,
  value: unknown,
  path: FieldPath,
  origin: string,
  baseSection: ResolvedSection | null,
  baseMaterial: Material | null,
  baseReinforcement: ReinforcementRead,
  findCatalogue: FindCatalogue,
  allowZero: boolean,
): SegmentRead {
  let lengthValue: unknown = value;
  let lengthPath = path;
  let section = baseSection;
  let material = baseMaterial;
  let reinforcement = baseReinforcement;
  if (isJsonObject(value) && !isQuantityObject(value)) {
    const block = readObject(ctx, value, path, SEGMENT_SPEC);
    if (!block) return null;
    lengthValue = block.length;
    lengthPath = childPath(path, "length");
    if (block.section !== undefined) section = readSection(ctx, block.section, childPath(path, "section"), findCatalogue);
    if (block.material !== undefined) material = readMaterial(ctx, block.material, childPath(path, "material"));
    if (block.reinforcement !== undefined) reinforcement = readReinforcement(ctx, block.reinforcement, childPath(path, "reinforcement"));
  }
  const lengthMm = readQuantity(ctx, lengthValue, lengthPath, "length", allowZero ? "nonNegative" : "positive");
  if (lengthMm === 0 && allowZero) return "none";
  if (lengthMm === null || section === null || material === null || reinforcement === "invalid") return null;
  return { origin, lengthMm, section, material, reinforcement };
}

function readSupport(ctx: ReadContext, value: unknown, path: FieldPath): Support | null {
  if (typeof value === "string") {
    const kind = readEnum(ctx, value, path, SUPPORT_KINDS);
    if (kind === "spring") {
      ctx.issues.add(path, 'a spring needs its stiffness: {"kind": "spring", "stiffness": ...}');
      return null;
    }
    return kind === null ? null : { kind };
  }
  const block = readObject(ctx, value, path, SUPPORT_SPEC);
  if (!block) return null;
  const kind = readEnum(ctx, block.kind, childPath(path, "kind"), SUPPORT_KINDS);
  if (kind === null) return null;
  if (kind !== "spring") {
    if (block.stiffness !== undefined) ctx.issues.add(childPath(path, "stiffness"), "only a spring support has a stiffness");
    return block.stiffness === undefined ? { kind } : null;
  }
  if (block.stiffness === undefined) {
    ctx.issues.add(childPath(path, "stiffness"), "is required for a spring support");
    return null;
  }
  const springNPerMm = readQuantity(ctx, block.stiffness, childPath(path, "stiffness"), "springStiffness", "positive");
  return springNPerMm === null ? null : { kind, springNPerMm };
}


// Output objects are built by assignment, not conditional spreads (each spread allocates and
// copies); the key order is the same as before so serialised results do not change. The usual
// combination of keys gets one literal: V8 sizes an object for its literal's keys, and each key
// added later goes to a separate, growable property store.
function toSpanSegment(draft: SegmentDraft, withShear: boolean): SpanSegment {
  const { section, material } = draft;
  if (!withShear && section.areaMm2 !== null && material.densityKgPerM3 !== null) {
    return { lengthMm: draft.lengthMm, eMpa: material.eMpa, iMm4: section.iMm4, areaMm2: section.areaMm2, densityKgPerM3: material.densityKgPerM3 };
  }
  const segment: SpanSegment = { lengthMm: draft.lengthMm, eMpa: material.eMpa, iMm4: section.iMm4 };
  if (section.areaMm2 !== null) segment.areaMm2 = section.areaMm2;
  if (material.densityKgPerM3 !== null) segment.densityKgPerM3 = material.densityKgPerM3;
  if (withShear && section.shearAreaMm2 !== null) segment.shearAreaMm2 = section.shearAreaMm2;
  if (withShear && material.gMpa !== null) segment.gMpa = material.gMpa;
  return segment;
}

function readSpans(
  ctx: ReadContext,
  value: unknown,
  memberPath: string,
  section: ResolvedSection | null,
  material: Material | null,
  reinforcement: ReinforcementRead,
  findCatalogue: FindCatalogue,
): (SegmentDraft | null)[] {
  const spansPath = childPath(memberPath, "spans");
  if (!Array.isArray(value) || value.length === 0 || value.length > MAX_SPANS_PER_MEMBER) {
    if (value !== undefined) ctx.issues.add(spansPath, `must be an array of 1 to ${MAX_SPANS_PER_MEMBER} span lengths`);
    return [];
  }
  return value.map((entry, index) => {
    const origin = memberPath + getIndexSuffix(spanSuffixes, "spans", index);
    const draft = readSegment(ctx, entry, childPath(spansPath, index), origin, section, material, reinforcement, findCatalogue, false);
    return draft === "none" ? null : draft;
  });
}

function readSupports(ctx: ReadContext, value: unknown, supportsPath: FieldPath, spanCount: number): (Support | null)[] {
  if (!Array.isArray(value)) {
    if (value !== undefined) ctx.issues.add(supportsPath, "must be an array with one support per span end (spans + 1)");
    return [];
  }
  if (spanCount > 0 && value.length !== spanCount + 1) {
    ctx.issues.add(
      supportsPath,
      `has ${value.length} supports but ${spanCount} span${spanCount === 1 ? "" : "s"} need ${spanCount + 1} (one per span end, left to right; overhang tips are free and not listed)`,
    );
    return [];
  }
  return value.map((entry, index) => readSupport(ctx, entry, childPath(supportsPath, index)));
}

// Output arrays come from Array.map or literals, which are allocated at their exact length; an
// array grown by push reserves 17 slots, and a schedule keeps five arrays per member.

/** The items without nulls: the same array when there are none (the usual case). */
function dropNulls<T>(items: (T | null)[]): T[] {
  return items.includes(null) ? items.filter((item): item is T => item !== null) : (items as T[]);
}

/** The member's segments left to right (overhangs included), or null if any is invalid. */
function collectSegments(left: SegmentRead, drafts: readonly (SegmentDraft | null)[], right: SegmentRead): SegmentDraft[] | null {
  const segments: SegmentDraft[] = [];
  if (left !== "none") {
    if (left === null) return null;
    segments.push(left);
  }
  for (const draft of drafts) {
    if (draft === null) return null;
    segments.push(draft);
  }
  if (right !== "none") {
    if (right === null) return null;
    segments.push(right);
  }
  return segments;
}

/**
 * Reads one public-format member into the engine's Member (internal units). Overhangs become
 * extra end spans with a free outer node. Returns null after recording every issue found.
 * `path` is a string because every valid member's origins are built from it.
 */
export function readMember(
  ctx: ReadContext,
  value: unknown,
  path: string,
  profile: ProfileFacts,
  findCatalogue: FindCatalogue,
): { member: Member; origins: MemberOrigins } | null {
  const block = readObject(ctx, value, path, MEMBER_SPEC);
  if (!block) return null;
  const before = ctx.issues.count;
  const mark = block.mark === undefined ? null : readString(ctx, block.mark, childPath(path, "mark"), 64);
  const category = block.category === undefined ? null : readEnum(ctx, block.category, childPath(path, "category"), MEMBER_CATEGORIES);
  const quantity = block.quantity === undefined ? null : readInteger(ctx, block.quantity, childPath(path, "quantity"), 1, 1_000_000);
  if (block.notes !== undefined) readString(ctx, block.notes, childPath(path, "notes"), 2000);
  const material = block.material === undefined ? null : readMaterial(ctx, block.material, childPath(path, "material"));
  const section = block.section === undefined ? null : readSection(ctx, block.section, childPath(path, "section"), findCatalogue);
  const selfWeight = block.selfWeight === undefined ? false : readBoolean(ctx, block.selfWeight, childPath(path, "selfWeight"));
  const withShear = block.shearDeformation === undefined ? false : readBoolean(ctx, block.shearDeformation, childPath(path, "shearDeformation"));
  const memberReinforcement: ReinforcementRead = block.reinforcement === undefined ? null : (readReinforcement(ctx, block.reinforcement, childPath(path, "reinforcement")) ?? "invalid");
  const hasReinforcement = block.reinforcement !== undefined || hasSpanReinforcement(block.spans);
  // a reinforced member's creep factor needs rho' of its spans: resolved once they are read
  const creep = hasReinforcement
    ? undefined
    : material
      ? resolveMemberCreep(ctx, material, block.creep, block.moistureCondition, path, { material: profile.usesCreep, ibc: profile.usesIbcCreep === true })
      : null;
  if (hasReinforcement && block.moistureCondition !== undefined) ctx.issues.add(childPath(path, "moistureCondition"), "applies to wood only, not reinforced concrete");

  const drafts = readSpans(ctx, block.spans, path, section, material, memberReinforcement, findCatalogue);
  let left: SegmentRead = "none";
  let right: SegmentRead = "none";
  if (block.overhangs !== undefined) {
    const overhangPath = childPath(path, "overhangs");
    const sides = readObject(ctx, block.overhangs, overhangPath, OVERHANGS_SPEC);
    if (sides?.left !== undefined) {
      left = readSegment(ctx, sides.left, childPath(overhangPath, "left"), path + LEFT_OVERHANG_SUFFIX, section, material, memberReinforcement, findCatalogue, true);
    }
    if (sides?.right !== undefined) {
      right = readSegment(ctx, sides.right, childPath(overhangPath, "right"), path + RIGHT_OVERHANG_SUFFIX, section, material, memberReinforcement, findCatalogue, true);
    }
  }

  const supportsPath = childPath(path, "supports");
  const spanCount = Array.isArray(block.spans) ? block.spans.length : 0;
  const supports = readSupports(ctx, block.supports, supportsPath, spanCount);

  const segments = collectSegments(left, drafts, right);
  let totalMm: number | null = null;
  if (segments) {
    totalMm = 0;
    for (const s of segments) totalMm += s.lengthMm;
  }

  let loads: Load[] = [];
  const loadsPath = childPath(path, "loads");
  if (!Array.isArray(block.loads) || block.loads.length > MAX_LOADS_PER_MEMBER) {
    if (block.loads !== undefined) ctx.issues.add(loadsPath, `must be an array of at most ${MAX_LOADS_PER_MEMBER} loads`);
  } else if (totalMm !== null) {
    const memberMm = totalMm;
    loads = dropNulls(block.loads.map((entry, index) => readLoad(ctx, entry, childPath(loadsPath, index), memberMm, profile.cases, profile.id)));
    if (block.loads.length === 0 && selfWeight !== true) ctx.issues.add(loadsPath, "the member has no loads and no self-weight");
  }

  if (segments && selfWeight === true) {
    const selfWeightPath = childPath(path, "selfWeight");
    if (profile.cases && !profile.cases.has("dead")) ctx.issues.add(selfWeightPath, `self-weight goes to the dead case, which limit profile ${profile.id} does not use`);
    for (const s of segments) {
      if (s.section.areaMm2 === null) ctx.issues.add(selfWeightPath, `needs the section area A (${s.origin})`);
      if (s.material.densityKgPerM3 === null) ctx.issues.add(selfWeightPath, `needs the material density (${s.origin})`);
    }
  }
  if (segments && withShear === true) {
    const shearPath = childPath(path, "shearDeformation");
    for (const s of segments) {
      if (s.section.shearAreaMm2 === null) ctx.issues.add(shearPath, `needs the section's shear area (${s.origin})`);
      if (s.material.gMpa === null) ctx.issues.add(shearPath, `needs the material's G (${s.origin})`);
    }
  }

  const reinforced = segments && hasReinforcement ? segments.map((s) => (s.reinforcement === null ? null : createReinforcedSection(ctx, s.reinforcement, s.section, s.material, s.origin))) : null;
  const memberCreep = hasReinforcement ? createReinforcedCreep(ctx, block.creep, path, reinforced, profile.usesIbcCreep === true) : creep;

  const allSupportsValid = !supports.includes(null);
  const listedSupports = dropNulls(supports);
  const fullSupports: Support[] =
    left === "none" && right === "none"
      ? listedSupports
      : [...(left === "none" ? [] : [{ kind: "free" as const }]), ...listedSupports, ...(right === "none" ? [] : [{ kind: "free" as const }])];
  if (supports.length > 0 && allSupportsValid && !isStableSupportSet(fullSupports)) {
    ctx.issues.add(supportsPath, "the member is unstable: it needs a fixed support, or at least two pinned, roller or spring supports");
  }

  if (ctx.issues.count > before || !segments || mark === null || category === null || quantity === null || material === null || section === null) return null;
  if (selfWeight === null || withShear === null || memberCreep === null || memberCreep === undefined) return null;
  const member = createMember(mark, category, quantity, fullSupports, segments, loads, selfWeight, withShear, memberCreep, section, material);
  addConcreteFacts(member, segments, reinforced);
  if (!requireTopSteel(ctx, member, segments)) return null;
  return {
    member,
    origins: createOrigins(path, segments, supports, left !== "none", right !== "none"),
  };
}

/**
 * A reinforced member's creep: lambda_Delta = xi / (1 + 50 rho') from its reinforcement (ACI 318-19
 * 24.2.4.1.1, from memory), which is also the IBC D + L row's creep component for concrete (IBC 2021
 * Table 1604.3 footnote, from memory: concrete follows ACI 318).
 */
function createReinforcedCreep(
  ctx: ReadContext,
  creepValue: unknown,
  path: string,
  reinforced: (ReinforcedConcreteSection | null)[] | null,
  needsIbc: boolean,
): MemberCreep | null {
  if (reinforced === null) return null;
  const factor = resolveReinforcedCreepFactor(ctx, creepValue, path, reinforced);
  if (factor === null) return null;
  return { materialCreepFactor: factor, ibcCreepComponentFactor: needsIbc ? factor : undefined, notes: needsIbc ? [CONCRETE_DEAD_ONLY_NOTE] : [] };
}

function createMember(
  mark: string,
  category: MemberCategory,
  quantity: number,
  supports: Support[],
  segments: readonly SegmentDraft[],
  loads: Load[],
  selfWeight: boolean,
  withShear: boolean,
  creep: MemberCreep,
  section: ResolvedSection,
  material: Material,
): Member {
  const spans = segments.map((s) => toSpanSegment(s, withShear));
  const materialName = material.id === "custom" ? material.label : material.id;
  const creepFactor = creep.materialCreepFactor;
  if (!selfWeight && !withShear && creepFactor !== undefined && creep.notes.length === 0) {
    // one object shape for the common case; ibcCreepComponentFactor is undefined unless the profile has an IBC D + L row
    return { mark, category, quantity, supports, spans, loads, materialCreepFactor: creepFactor, ibcCreepComponentFactor: creep.ibcCreepComponentFactor, sectionName: section.name, materialName };
  }
  const member: Member = { mark, category, quantity, supports, spans, loads };
  if (selfWeight) member.selfWeightCase = "dead";
  if (creepFactor !== undefined) member.materialCreepFactor = creepFactor;
  if (creep.ibcCreepComponentFactor !== undefined) member.ibcCreepComponentFactor = creep.ibcCreepComponentFactor;
  if (creep.notes.length > 0) member.intakeNotes = creep.notes;
  if (withShear) member.includeShearDeformation = true;
  member.sectionName = section.name;
  member.materialName = materialName;
  return member;
}

/** True when any entry of a member's `spans` gives its own reinforcement. */
function hasSpanReinforcement(spans: unknown): boolean {
  if (!Array.isArray(spans)) return false;
  // a plain loop: this runs for every member, and most spans are bare numbers
  for (const entry of spans) if (typeof entry === "object" && isJsonObject(entry) && entry.reinforcement !== undefined) return true;
  return false;
}

/**
 * Reinforced spans deflect cracked (their I is the outline's I_g); a library-concrete span with
 * neither reinforcement nor an explicit I is checked with I_g and flagged on the member.
 */
function addConcreteFacts(member: Member, segments: readonly SegmentDraft[], reinforced: readonly (ReinforcedConcreteSection | null)[] | null): void {
  for (let index = 0; index < segments.length; index++) {
    const segment = segments[index]!;
    const section = reinforced === null ? null : (reinforced[index] ?? null);
    if (section !== null) member.spans[index]!.reinforcedConcrete = section;
    else if (segment.material.family === "concrete" && segment.section.explicit !== true) member.concreteGrossSection = true;
  }
}

/**
 * Records `reinforcement.topSteel` as missing, once per reinforcement block, when the member can
 * hog in a span between supports (hogging-causes.ts); true when nothing is missing.
 */
function requireTopSteel(ctx: ReadContext, member: Member, segments: readonly SegmentDraft[]): boolean {
  const missing = findSpansWithoutTopSteel(member);
  if (missing.length === 0) return true;
  const cause = findHoggingCause(member);
  if (cause === null) return true;
  const paths = new Set<FieldPath>();
  for (const index of missing) {
    const reinforcement = segments[index]?.reinforcement;
    if (reinforcement) paths.add(reinforcement.path);
  }
  for (const path of paths) ctx.issues.add(childPath(path, "topSteel"), describeMissingTopSteel(cause));
  return false;
}

function createOrigins(path: string, segments: readonly SegmentDraft[], listed: readonly unknown[], hasLeft: boolean, hasRight: boolean): MemberOrigins {
  const listedPaths = listed.map((_, index) => path + getIndexSuffix(supportSuffixes, "supports", index));
  const origins: MemberOrigins = {
    spans: segments.map((s) => s.origin),
    supports:
      hasLeft || hasRight
        ? [...(hasLeft ? [path + LEFT_OVERHANG_SUFFIX] : []), ...listedPaths, ...(hasRight ? [path + RIGHT_OVERHANG_SUFFIX] : [])]
        : listedPaths,
  };
  // only reinforced members pay for this: the solver's refusals name their reinforcement's fields
  if (segments.some((s) => s.reinforcement !== null)) origins.reinforcements = segments.map((s) => (s.reinforcement ? formatPath(s.reinforcement.path) : null));
  return origins;
}
