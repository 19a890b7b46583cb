/** Showing engine quantities (internal units, lib/engine/model.ts) in a schedule's own units. */
import { convertFromInternal, SYSTEM_DEFAULT_UNITS, type QuantityKind, type UnitSystem } from "@/lib/engine/units";

export type DisplayUnits = Record<QuantityKind, string>;

/**
 * The unit to show each kind in: the schedule's own default for it (what its bare numbers took),
 * else its system's, else SI. A US schedule reads in ft, in, kip, klf, ksi and in^4.
 */
export function resolveDisplayUnits(unitSystem: UnitSystem | null, unitDefaults: Record<string, string> | null | undefined): DisplayUnits {
  const base = SYSTEM_DEFAULT_UNITS[unitSystem ?? "SI"];
  const units = { ...base };
  for (const kind of Object.keys(base) as QuantityKind[]) {
    const given = unitDefaults?.[kind];
    if (typeof given === "string" && convertFromInternal(1, kind, given).ok) units[kind] = given;
  }
  return units;
}

const SUPERSCRIPTS: Record<string, string> = { "2": "²", "3": "³", "4": "⁴" };

/** "kN*m" -> "kN·m", "mm^4" -> "mm⁴": unit symbols as a drawing would print them. */
export function prettyUnit(symbol: string): string {
  return symbol.replace(/\*/g, "·").replace(/\^([234])/g, (_, digit: string) => SUPERSCRIPTS[digit] ?? digit);
}

const SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";

function toSuperscript(exponent: number): string {
  return `${exponent < 0 ? "⁻" : ""}${String(Math.abs(exponent))
    .split("")
    .map((d) => SUPERSCRIPT_DIGITS[Number(d)] ?? d)
    .join("")}`;
}

/** Four significant figures; 10^6 and above (second moments in mm^4) as mantissa × 10ⁿ. Never NaN. */
export function formatSignificant(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  if (value === 0) return "0";
  const exponent = Math.floor(Math.log10(Math.abs(value)));
  if (exponent >= 6) return `${(value / 10 ** exponent).toFixed(digits - 1)} × 10${toSuperscript(exponent)}`;
  return Number(value.toPrecision(digits)).toLocaleString("en-GB", { maximumFractionDigits: 10 });
}

/** An internal value in the display unit of its kind, with the unit: "16.67 mm", "0.5512 in", "29,000 ksi". */
export function formatQuantity(valueInternal: number | null | undefined, kind: QuantityKind, units: DisplayUnits, digits = 4): string {
  if (valueInternal === null || valueInternal === undefined || !Number.isFinite(valueInternal)) return "—";
  return `${formatSignificant(toDisplay(valueInternal, kind, units), digits)} ${prettyUnit(units[kind])}`;
}

/** An internal value converted to the display unit of its kind (the number only). */
export function toDisplay(valueInternal: number, kind: QuantityKind, units: DisplayUnits): number {
  const converted = convertFromInternal(valueInternal, kind, units[kind]);
  return converted.ok ? converted.value : valueInternal;
}
