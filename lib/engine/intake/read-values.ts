/**
 * Small readers shared by intake: each reads one field of the public schedule, records an issue
 * naming the field's path when it is wrong, and returns null instead of guessing.
 */
import { describeOutOfBounds } from "../input-bounds";
import type { Material } from "../materials";
import type { CatalogueSection, InputIssue, LimitProfile } from "../model";
import { findUnit, QUANTITY_KIND_LABELS, type QuantityKind, type UnitSystem } from "../units";

export type JsonObject = Record<string, unknown>;

/**
 * A field's path in the public format. Most fields never have an issue, so readers pass a
 * PathNode (parent + key) down and the text is only built when an issue is recorded.
 */
export type FieldPath = string | PathNode;

export class PathNode {
  constructor(
    readonly parent: FieldPath,
    readonly key: string | number,
  ) {}
}

/** The path of `key` inside `parent`, built lazily (see FieldPath). */
export function childPath(parent: FieldPath, key: string | number): PathNode {
  return new PathNode(parent, key);
}

/** The text of a path, e.g. `members[12].spans[1].length` (see joinPath). */
export function formatPath(path: FieldPath): string {
  return typeof path === "string" ? path : joinPath(formatPath(path.parent), path.key);
}

/** Collects issues; stops recording past `limit` but keeps counting (hostile or huge inputs). */
export class IssueCollector {
  readonly issues: InputIssue[] = [];
  dropped = 0;
  constructor(private readonly limit: number) {}

  add(path: FieldPath, message: string): void {
    if (this.issues.length < this.limit) this.issues.push({ path: formatPath(path), message });
    else this.dropped += 1;
  }

  get count(): number {
    return this.issues.length + this.dropped;
  }
}

export interface UnitDefaults {
  system: UnitSystem | null;
  /** Unit text per kind for bare numbers; a kind without one makes bare numbers an issue. */
  byKind: Partial<Record<QuantityKind, string>>;
}

/** A lookup by id of something the schedule's organization defines (a Map will do). */
export interface OrganizationLookup<T> {
  get(id: string): T | undefined;
}

export interface ReadContext {
  issues: IssueCollector;
  units: UnitDefaults;
  /** The organization's own materials by id, found before the library ones (ParseScheduleOptions). */
  organizationMaterials?: OrganizationLookup<Material>;
  /** The organization's limit profiles by id, for `limits.profile` (ParseScheduleOptions). */
  organizationProfiles?: OrganizationLookup<LimitProfile>;
}

/** A plain object (not null, not an array). */
export function isJsonObject(value: unknown): value is JsonObject {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

/** `members` + 3 -> `members[3]`; `members[3]` + "spans" -> `members[3].spans`. */
export function joinPath(parent: string, key: string | number): string {
  if (typeof key === "number") return `${parent}[${key}]`;
  return parent === "" ? key : `${parent}.${key}`;
}

/** "a string", "an array", "null": for "must be X, got Y" messages. */
export function describeType(value: unknown): string {
  if (value === null) return "null";
  if (Array.isArray(value)) return "an array";
  if (typeof value === "number" && !Number.isFinite(value)) return "a non-finite number";
  return `a ${typeof value}`;
}

/** The keys an object may have, prepared once per object kind (readers run per member). */
export interface FieldSpec {
  allowed: ReadonlySet<string>;
  /** The allowed keys in their listed order, for the "unknown field" message. */
  allowedText: string;
  required: readonly string[];
}

export function createFieldSpec(allowed: readonly string[], required: readonly string[] = []): FieldSpec {
  return { allowed: new Set(allowed), allowedText: allowed.join(", "), required };
}

/**
 * Reads an object and reports unknown keys (a typo must not be silently ignored) and missing
 * required keys. Returns null when `value` is not an object.
 */
export function readObject(ctx: ReadContext, value: unknown, path: FieldPath, spec: FieldSpec): JsonObject | null {
  if (!isJsonObject(value)) {
    ctx.issues.add(path, `must be an object, got ${describeType(value)}`);
    return null;
  }
  for (const key of Object.keys(value)) {
    if (!spec.allowed.has(key)) ctx.issues.add(childPath(path, key), `unknown field; allowed here: ${spec.allowedText}`);
  }
  for (const key of spec.required) {
    if (value[key] === undefined) ctx.issues.add(childPath(path, key), "is required");
  }
  return value;
}

/** A non-empty string (trimmed), at most maxLength characters. */
export function readString(ctx: ReadContext, value: unknown, path: FieldPath, maxLength = 200): string | null {
  if (typeof value !== "string") {
    ctx.issues.add(path, `must be a string, got ${describeType(value)}`);
    return null;
  }
  const trimmed = value.trim();
  if (trimmed === "") {
    ctx.issues.add(path, "must not be empty");
    return null;
  }
  if (trimmed.length > maxLength) {
    ctx.issues.add(path, `must be at most ${maxLength} characters`);
    return null;
  }
  return trimmed;
}

/** One of the listed strings, exactly. */
export function readEnum<T extends string>(ctx: ReadContext, value: unknown, path: FieldPath, options: readonly T[]): T | null {
  if (typeof value === "string" && (options as readonly string[]).includes(value)) return value as T;
  ctx.issues.add(path, `must be one of: ${options.join(", ")}`);
  return null;
}

/** true or false; no "yes", no 1. */
export function readBoolean(ctx: ReadContext, value: unknown, path: FieldPath): boolean | null {
  if (typeof value === "boolean") return value;
  ctx.issues.add(path, `must be true or false, got ${describeType(value)}`);
  return null;
}

export type NumberRule = "positive" | "nonNegative" | "any";

function checkRule(ctx: ReadContext, value: number, path: FieldPath, rule: NumberRule): boolean {
  if (rule === "positive" && !(value > 0)) {
    ctx.issues.add(path, "must be greater than 0");
    return false;
  }
  if (rule === "nonNegative" && value < 0) {
    ctx.issues.add(path, "must not be negative");
    return false;
  }
  return true;
}

/** A plain dimensionless number (factor, ratio). */
export function readNumber(ctx: ReadContext, value: unknown, path: FieldPath, rule: NumberRule): number | null {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    ctx.issues.add(path, `must be a finite number, got ${describeType(value)}`);
    return null;
  }
  return checkRule(ctx, value, path, rule) ? value : null;
}

/** A whole number from min to max. */
export function readInteger(ctx: ReadContext, value: unknown, path: FieldPath, min: number, max: number): number | null {
  if (typeof value !== "number" || !Number.isInteger(value) || value < min || value > max) {
    ctx.issues.add(path, `must be a whole number from ${min} to ${max}`);
    return null;
  }
  return value;
}

/** True for the `{ "value": ..., "unit": ... }` per-field unit form. */
export function isQuantityObject(value: unknown): value is JsonObject {
  return isJsonObject(value) && "value" in value;
}

/**
 * Reads a quantity of the given kind and returns it in internal units. A bare number takes the
 * schedule's default unit for the kind; `{ "value", "unit" }` names its own. No unit, no value.
 * A value outside its kind's physical range (input-bounds.ts) is refused on this field.
 */
export function readQuantity(ctx: ReadContext, value: unknown, path: FieldPath, kind: QuantityKind, rule: NumberRule): number | null {
  const isObject = isQuantityObject(value);
  let amount: unknown = value;
  let unitText: string | undefined;
  if (isObject) {
    for (const key of Object.keys(value)) {
      if (key !== "value" && key !== "unit") ctx.issues.add(childPath(path, key), "unknown field; allowed here: value, unit");
    }
    amount = value.value;
    if (typeof value.unit !== "string" || value.unit.trim() === "") {
      ctx.issues.add(childPath(path, "unit"), `is required: a ${QUANTITY_KIND_LABELS[kind]} unit`);
      return null;
    }
    unitText = value.unit;
  }
  if (typeof amount !== "number" || !Number.isFinite(amount)) {
    ctx.issues.add(isObject ? childPath(path, "value") : path, `must be a finite number or {"value": number, "unit": string}, got ${describeType(amount)}`);
    return null;
  }
  if (unitText === undefined) {
    unitText = ctx.units.byKind[kind];
    if (unitText === undefined) {
      ctx.issues.add(
        path,
        `no unit: write {"value": ${amount}, "unit": "..."} or declare units.${kind} (or units.system) for ${QUANTITY_KIND_LABELS[kind]} values`,
      );
      return null;
    }
  }
  // findUnit is cached per (kind, text) and, unlike convertToInternal, allocates no result.
  const found = findUnit(kind, unitText);
  if (!found.ok) {
    ctx.issues.add(isObject ? childPath(path, "unit") : path, found.message);
    return null;
  }
  const internal = amount * found.unit.toInternal;
  if (!Number.isFinite(internal)) {
    ctx.issues.add(path, "is too large");
    return null;
  }
  if (!checkRule(ctx, internal, path, rule)) return null;
  const outOfBounds = describeOutOfBounds(kind, internal, found.unit.symbol, rule === "any", found.unit.toInternal);
  if (outOfBounds !== null) {
    ctx.issues.add(path, outOfBounds);
    return null;
  }
  return internal;
}

/** Resolves a catalogue name (see sections.ts createCatalogueIndex). */
export type FindCatalogue = (name: string) => { ok: true; section: CatalogueSection } | { ok: false; message: string };
