import type { CatalogueSection } from "../model";
import { findSectionProblems, getSectionProperties, type SectionShape } from "../sections";
import { isPositiveFinite } from "../solver/validate-member";
import type { QuantityKind } from "../units";
import {
  childPath,
  createFieldSpec,
  isJsonObject,
  readObject,
  readQuantity,
  readString,
  type FieldPath,
  type FieldSpec,
  type FindCatalogue,
  type ReadContext,
} from "./read-values";

export interface ResolvedSection {
  name: string;
  iMm4: number;
  areaMm2: number | null;
  shearAreaMm2: number | null;
  /** Concrete outline of a rectangle or tee, mm, for reinforcement (read-reinforcement.ts). */
  outline?: ConcreteOutline;
  /** An explicit section: its I is the schedule's own (for concrete, an explicit effective I). */
  explicit?: true;
}

/** Web width b_w (a rectangle's b) and depth h; flange width and thickness for a tee. */
export interface ConcreteOutline {
  webWidthMm: number;
  depthMm: number;
  flangeWidthMm?: number;
  flangeThicknessMm?: number;
}

/** Dimensions in mm (or mm^2, mm^4), aligned with ShapeSpec.fields; undefined = not given. */
type Dimensions = (number | null | undefined)[];

interface ShapeSpec {
  fields: readonly string[];
  required: readonly string[];
  object: FieldSpec;
  /**
   * The last shape of this kind that resolved. Schedules list runs of members with the same
   * section, and comparing a few numbers is much cheaper than building a key for the cache.
   */
  last: { dims: Dimensions; resolved: ResolvedSection } | null;
}

function createShapeSpec(fields: string[], required: string[]): ShapeSpec {
  return { fields, required, object: createFieldSpec(["shape", ...fields], required), last: null };
}

function isSameDimensions(a: Dimensions, b: Dimensions): boolean {
  for (let index = 0; index < a.length; index++) if (a[index] !== b[index]) return false;
  return a.length === b.length;
}

// A Map, not an object literal, so that a shape such as "constructor" is unknown, not inherited.
const SHAPE_SPECS = new Map<string, ShapeSpec>([
  ["rectangle", createShapeSpec(["b", "h"], ["b", "h"])],
  // b and h are the OUTER size (common practice for hollow sections), as in the CSV; t the wall.
  ["hollow_rectangle", createShapeSpec(["b", "h", "t"], ["b", "h", "t"])],
  ["round", createShapeSpec(["d"], ["d"])],
  ["tube", createShapeSpec(["D", "t"], ["D", "t"])],
  ["i_plate", createShapeSpec(["bf", "tf", "d", "tw"], ["bf", "tf", "d", "tw"])],
  ["explicit", createShapeSpec(["A", "I", "shearArea"], ["I"])],
  ["tee", createShapeSpec(["bf", "hf", "bw", "h"], ["bf", "hf", "bw", "h"])],
]);
const SHAPE_LIST = [...SHAPE_SPECS.keys()].join(", ");
const CATALOGUE_OBJECT_SPEC = createFieldSpec(["catalogue"]);

function formatMm(valueMm: number): string {
  return String(Math.round(valueMm * 100) / 100);
}

function fromCatalogue(section: CatalogueSection): ResolvedSection {
  return { name: section.name, iMm4: section.iMm4, areaMm2: section.areaMm2, shearAreaMm2: section.shearAreaMm2 ?? null };
}

/** The catalogue properties that are not positive finite numbers (shear area may be absent). */
function listInvalidCatalogueFields(section: CatalogueSection): string[] {
  const bad: string[] = [];
  if (!isPositiveFinite(section.iMm4)) bad.push("iMm4");
  if (!isPositiveFinite(section.areaMm2)) bad.push("areaMm2");
  if (section.shearAreaMm2 !== undefined && !isPositiveFinite(section.shearAreaMm2)) bad.push("shearAreaMm2");
  return bad;
}

function readCatalogueSection(ctx: ReadContext, value: unknown, path: FieldPath, findCatalogue: FindCatalogue): ResolvedSection | null {
  const block = typeof value === "string" ? { catalogue: value } : readObject(ctx, value, path, CATALOGUE_OBJECT_SPEC);
  const namePath = typeof value === "string" ? path : childPath(path, "catalogue");
  const name = block ? readString(ctx, block.catalogue, namePath, 100) : null;
  if (name === null) return null;
  const found = findCatalogue(name);
  if (!found.ok) {
    ctx.issues.add(namePath, found.message);
    return null;
  }
  const bad = listInvalidCatalogueFields(found.section);
  if (bad.length > 0) {
    ctx.issues.add(namePath, `catalogue entry "${found.section.name}" has no valid ${bad.join(", ")} (must be a positive finite number)`);
    return null;
  }
  return fromCatalogue(found.section);
}

function getDimensionKind(field: string): QuantityKind {
  return field === "A" || field === "shearArea" ? "area" : field === "I" ? "secondMoment" : "sectionDimension";
}

// Schedules repeat a few sections many times: resolved shapes are immutable, keyed by their mm
// dimensions, so each distinct shape is checked, computed and named once.
const resolvedShapes = new Map<string, ResolvedSection>();
const RESOLVED_SHAPES_LIMIT = 1000;

/**
 * Reads a section: a catalogue name (string or `{ "catalogue": name }`) or a shape with its
 * dimensions (section-dimension units; explicit A/I/shearArea in area and second-moment units).
 */
export function readSection(ctx: ReadContext, value: unknown, path: FieldPath, findCatalogue: FindCatalogue): ResolvedSection | null {
  if (typeof value === "string" || (isJsonObject(value) && "catalogue" in value)) return readCatalogueSection(ctx, value, path, findCatalogue);
  const spec = isJsonObject(value) && typeof value.shape === "string" ? SHAPE_SPECS.get(value.shape) : undefined;
  if (!isJsonObject(value) || spec === undefined) {
    ctx.issues.add(isJsonObject(value) ? childPath(path, "shape") : path, `must be a catalogue name or an object with shape one of: ${SHAPE_LIST}`);
    return null;
  }
  const shape = value.shape as string;
  const block = readObject(ctx, value, path, spec.object);
  if (!block) return null;
  const dims: Dimensions = spec.fields.map((field) =>
    block[field] === undefined ? undefined : readQuantity(ctx, block[field], childPath(path, field), getDimensionKind(field), "positive"),
  );
  for (const field of spec.required) {
    const value = dims[spec.fields.indexOf(field)];
    if (value === null || value === undefined) return null;
  }
  // Dimensions that resolved before cannot have a problem now (createShape is a pure function of them).
  if (spec.last && isSameDimensions(spec.last.dims, dims)) return spec.last.resolved;
  const resolved = resolveShape(ctx, shape, toDimensionRecord(spec, dims), path);
  if (resolved) spec.last = { dims, resolved };
  return resolved;
}

/** The given dimensions by field name (a field that was not given has no key). */
function toDimensionRecord(spec: ShapeSpec, dims: Dimensions): Record<string, number | null> {
  const record: Record<string, number | null> = {};
  spec.fields.forEach((field, index) => {
    const value = dims[index];
    if (value !== undefined) record[field] = value;
  });
  return record;
}

function resolveShape(ctx: ReadContext, shape: string, dims: Record<string, number | null>, path: FieldPath): ResolvedSection | null {
  const section = createShape(ctx, shape, dims, path);
  if (!section) return null;
  const key = getShapeKey(section);
  const cached = resolvedShapes.get(key);
  if (cached) return cached;
  const problems = findSectionProblems(section);
  for (const problem of problems) ctx.issues.add(childPath(path, problem.field), problem.message);
  if (problems.length > 0) return null;
  const props = getSectionProperties(section);
  const resolved: ResolvedSection = { name: describeShape(section), iMm4: props.iMm4, areaMm2: props.areaMm2, shearAreaMm2: props.shearAreaMm2 };
  if (section.shape === "rectangle") resolved.outline = { webWidthMm: section.bMm, depthMm: section.hMm };
  if (section.shape === "tee") resolved.outline = { webWidthMm: section.bwMm, depthMm: section.hMm, flangeWidthMm: section.bfMm, flangeThicknessMm: section.hfMm };
  if (section.shape === "explicit") resolved.explicit = true;
  if (resolvedShapes.size < RESOLVED_SHAPES_LIMIT) resolvedShapes.set(key, resolved);
  return resolved;
}

/** A dimension that readSection has read (NaN only if a required one were missing, which it checks first). */
function getDim(dims: Record<string, number | null>, field: string): number {
  return dims[field] ?? Number.NaN;
}

function createShape(ctx: ReadContext, shape: string, dims: Record<string, number | null>, path: FieldPath): SectionShape | null {
  switch (shape) {
    case "rectangle":
      return { shape, bMm: getDim(dims, "b"), hMm: getDim(dims, "h") };
    case "round":
      return { shape, dMm: getDim(dims, "d") };
    case "tube":
      return { shape, outerDMm: getDim(dims, "D"), wallMm: getDim(dims, "t") };
    case "i_plate":
      return { shape, bfMm: getDim(dims, "bf"), tfMm: getDim(dims, "tf"), dMm: getDim(dims, "d"), twMm: getDim(dims, "tw") };
    case "tee":
      return { shape, bfMm: getDim(dims, "bf"), hfMm: getDim(dims, "hf"), bwMm: getDim(dims, "bw"), hMm: getDim(dims, "h") };
    case "explicit": {
      if (dims.A === null || dims.shearArea === null) return null;
      return { shape, iMm4: getDim(dims, "I"), areaMm2: dims.A ?? null, shearAreaMm2: dims.shearArea ?? null };
    }
    case "hollow_rectangle": {
      const wall = getDim(dims, "t");
      const outerBMm = getDim(dims, "b");
      const outerHMm = getDim(dims, "h");
      if (2 * wall >= outerBMm || 2 * wall >= outerHMm) {
        ctx.issues.add(childPath(path, "t"), "wall thickness must be less than half of the outer width b and of the outer depth h");
        return null;
      }
      return { shape, outerBMm, outerHMm, innerBMm: outerBMm - 2 * wall, innerHMm: outerHMm - 2 * wall };
    }
    default:
      return null;
  }
}

/** Exact (shortest round-trip) mm values, so two shapes share a key only if they are identical. */
function getShapeKey(section: SectionShape): string {
  switch (section.shape) {
    case "rectangle":
      return `rectangle|${section.bMm}|${section.hMm}`;
    case "hollow_rectangle":
      return `hollow_rectangle|${section.outerBMm}|${section.outerHMm}|${section.innerBMm}|${section.innerHMm}`;
    case "round":
      return `round|${section.dMm}`;
    case "tube":
      return `tube|${section.outerDMm}|${section.wallMm}`;
    case "i_plate":
      return `i_plate|${section.bfMm}|${section.tfMm}|${section.dMm}|${section.twMm}`;
    case "explicit":
      return `explicit|${section.iMm4}|${section.areaMm2}|${section.shearAreaMm2}`;
    case "tee":
      return `tee|${section.bfMm}|${section.hfMm}|${section.bwMm}|${section.hMm}`;
  }
}

function describeShape(section: SectionShape): string {
  switch (section.shape) {
    case "rectangle":
      return `rectangle ${formatMm(section.bMm)} x ${formatMm(section.hMm)} mm`;
    case "hollow_rectangle":
      return `hollow rectangle ${formatMm(section.outerBMm)} x ${formatMm(section.outerHMm)} mm (void ${formatMm(section.innerBMm)} x ${formatMm(section.innerHMm)})`;
    case "round":
      return `round ${formatMm(section.dMm)} mm`;
    case "tube":
      return `tube ${formatMm(section.outerDMm)} x ${formatMm(section.wallMm)} mm`;
    case "i_plate":
      return `I ${formatMm(section.dMm)} x ${formatMm(section.bfMm)} mm (tf ${formatMm(section.tfMm)}, tw ${formatMm(section.twMm)})`;
    case "explicit":
      return `explicit I = ${Math.round(section.iMm4)} mm^4`;
    case "tee":
      return `tee ${formatMm(section.hMm)} deep, flange ${formatMm(section.bfMm)} x ${formatMm(section.hfMm)}, web ${formatMm(section.bwMm)} mm`;
  }
}
