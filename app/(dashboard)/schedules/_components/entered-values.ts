/**
 * A member's public-format input as text, every number with the unit it was read in: its own
 * `{ value, unit }`, or the schedule's unit for that kind of quantity (lib/engine/intake).
 */
import type { QuantityKind } from "@/lib/engine/units";

import { prettyUnit, type DisplayUnits } from "./display-units";

type Json = Record<string, unknown>;

function isObject(value: unknown): value is Json {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

function isQuantity(value: unknown): value is { value: number; unit: string } {
  return isObject(value) && typeof value.value === "number" && typeof value.unit === "string";
}

/** Plain text of any JSON value (bounded by the input's own size). */
export function formatPlain(value: unknown): string {
  if (value === null || value === undefined) return "—";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "—";
  if (typeof value === "string") return value;
  if (isQuantity(value)) return `${value.value} ${prettyUnit(value.unit)}`;
  if (Array.isArray(value)) return value.map(formatPlain).join(", ");
  if (isObject(value)) {
    return Object.entries(value)
      .map(([k, v]) => `${k} ${formatPlain(v)}`)
      .join(", ");
  }
  return String(value);
}

/** A number as entered with its unit: its own, or the schedule's unit for `kind`. */
export function formatEntered(value: unknown, kind: QuantityKind, units: DisplayUnits): string {
  if (typeof value === "number") return Number.isFinite(value) ? `${value} ${prettyUnit(units[kind])}` : "—";
  return formatPlain(value);
}

const SECTION_FIELD_KINDS: Record<string, QuantityKind> = { A: "area", I: "secondMoment", shearArea: "area" };
const MATERIAL_FIELD_KINDS: Record<string, QuantityKind> = { E: "modulus", G: "modulus", density: "density" };
const REINFORCEMENT_FIELD_KINDS: Record<string, QuantityKind> = {
  tensionSteel: "area",
  effectiveDepth: "sectionDimension",
  compressionSteel: "area",
  compressionDepth: "sectionDimension",
  steelE: "modulus",
};

/** `key value unit, ...` for an object whose numeric fields have the kinds given (others: as written). */
function formatFields(block: Json, kinds: Record<string, QuantityKind>, units: DisplayUnits, fallbackKind: QuantityKind | null, skip: string[] = []): string {
  return Object.entries(block)
    .filter(([key]) => !skip.includes(key))
    .map(([key, value]) => {
      const kind = kinds[key] ?? fallbackKind;
      return `${key} ${kind === null ? formatPlain(value) : formatEntered(value, kind, units)}`;
    })
    .join(", ");
}

/** "i_plate: bf 150 mm, tf 10.7 mm, ..." or the catalogue name. */
export function formatSection(value: unknown, units: DisplayUnits): string {
  if (typeof value === "string") return `${value} (catalogue)`;
  if (!isObject(value)) return formatPlain(value);
  if (typeof value.catalogue === "string") return `${value.catalogue} (catalogue)`;
  const shape = typeof value.shape === "string" ? value.shape : "section";
  return `${shape}: ${formatFields(value, SECTION_FIELD_KINDS, units, "sectionDimension", ["shape"])}`;
}

/** A library id, or a custom material's name and values with units. */
export function formatMaterial(value: unknown, units: DisplayUnits): string {
  if (typeof value === "string") return value;
  if (!isObject(value)) return formatPlain(value);
  const name = typeof value.name === "string" ? value.name : "custom material";
  const rest = formatFields(value, MATERIAL_FIELD_KINDS, units, null, ["name"]);
  return rest === "" ? name : `${name}: ${rest}`;
}

export function formatReinforcement(value: unknown, units: DisplayUnits): string {
  return isObject(value) ? formatFields(value, REINFORCEMENT_FIELD_KINDS, units, null) : formatPlain(value);
}

/** A support entry: "pinned", or "spring, stiffness 5 kN/mm". */
export function formatSupport(value: unknown, units: DisplayUnits): string {
  if (typeof value === "string") return value;
  if (!isObject(value)) return formatPlain(value);
  const kind = formatPlain(value.kind);
  return value.stiffness === undefined ? kind : `${kind}, stiffness ${formatEntered(value.stiffness, "springStiffness", units)}`;
}

/** A span entry: a length, or `{ length, section?, material?, reinforcement? }`. */
export function formatSpan(value: unknown, units: DisplayUnits): string {
  if (!isObject(value) || isQuantity(value)) return formatEntered(value, "length", units);
  const parts = [formatEntered(value.length, "length", units)];
  if (value.section !== undefined) parts.push(`section ${formatSection(value.section, units)}`);
  if (value.material !== undefined) parts.push(`material ${formatMaterial(value.material, units)}`);
  if (value.reinforcement !== undefined) parts.push(`reinforcement ${formatReinforcement(value.reinforcement, units)}`);
  return parts.join("; ");
}
