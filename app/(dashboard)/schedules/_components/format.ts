/** Display formatting for the schedules screens: never prints NaN or Infinity. */
import { getDeflectionDirection } from "@/lib/engine/deflection-direction";
import { formatGoverningCheck } from "@/lib/vocabulary";

export function formatNumber(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return value.toLocaleString("en-GB", { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

/** A ratio (utilization, factor of safety): two decimals, or two significant figures below 0.1. */
export function formatRatio(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  if (value !== 0 && Math.abs(value) < 0.1) return Number(value.toPrecision(2)).toLocaleString("en-GB", { maximumSignificantDigits: 2 });
  return formatNumber(value, 2);
}

/** Millimetres with a precision that suits deflections from hundredths to metres. */
export function formatMm(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const digits = Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 2;
  return formatNumber(value, digits);
}

/**
 * A signed deflection (engine sign, + downward) as its magnitude and direction: "12.3 down",
 * "4.50 up". A check limits the magnitude, so the sign alone would read an uplift as a sag.
 */
export function formatSignedMm(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const direction = getDeflectionDirection(value);
  const magnitude = formatMm(Math.abs(value));
  return direction === "none" ? magnitude : `${magnitude} ${direction}`;
}

/** Second moment of area in mm^4 as mantissa and power of ten (1.234 × 10^7), or null when unusable. */
export function splitPowerOfTen(value: number | null | undefined): { mantissa: string; exponent: number } | null {
  if (value === null || value === undefined || !Number.isFinite(value) || value <= 0) return null;
  const exponent = Math.floor(Math.log10(value));
  return { mantissa: (value / 10 ** exponent).toFixed(3), exponent };
}

/** "l/523" for an engineer's span ratio (span / deflection, or a limit's N); "—" when there is none. */
export function formatSpanRatio(ratio: number | null | undefined): string {
  return ratio === null || ratio === undefined || !Number.isFinite(ratio) ? "—" : `l/${Math.round(ratio)}`;
}

/** Stored check keys are already the public check names ("live, span 1", "frequency"; lib/vocabulary.ts). */
export function formatCheckKey(key: string | null): string {
  return formatGoverningCheck(key);
}

export function formatPercent(fraction: number): string {
  if (!Number.isFinite(fraction)) return "0%";
  return `${Math.floor(Math.min(1, Math.max(0, fraction)) * 100)}%`;
}

/** Completed or failed: the workers are done with the schedule either way. */
export function isScheduleFinished(status: string): boolean {
  return status === "completed" || status === "failed";
}

export const scheduleStatusLabels: Record<string, string> = {
  received: "Received",
  queued: "Queued",
  checking: "Checking",
  completed: "Completed",
  failed: "Failed",
};

export const categoryLabels: Record<string, string> = {
  floor_beam: "Floor beam",
  roof_beam: "Roof beam",
  lintel: "Lintel",
  purlin_girt: "Purlin or girt",
  wall_stud: "Wall stud",
  cantilever: "Cantilever",
  other: "Other",
};

const MM_PER_INCH = 25.4;

/** A deflection magnitude in the schedule's own length unit (mm for SI, in for US), without the unit: the column header names it. */
export function formatDeflection(valueMm: number | null | undefined, system: string): string {
  if (valueMm === null || valueMm === undefined || !Number.isFinite(valueMm)) return "—";
  return system === "US" ? formatNumber(Math.abs(valueMm) / MM_PER_INCH, 3) : formatMm(Math.abs(valueMm));
}

/** Span lengths in the schedule's unit: m for SI, ft for US. */
export function formatSpans(spansMm: number[], system: string): string {
  if (spansMm.length === 0) return "—";
  const inUnit = spansMm.map((mm) => (system === "US" ? formatNumber(mm / (MM_PER_INCH * 12), 2) : formatNumber(mm / 1000, 2)));
  return `${inUnit.join(" + ")} ${system === "US" ? "ft" : "m"}`;
}
