/** Shared geometry of the member diagrams: every panel uses the same x scale, so they line up. */

export const DIAGRAM_WIDTH = 760;
export const DIAGRAM_PAD = { left: 72, right: 28 } as const;

export type XScale = { toPx: (xMm: number) => number; minMm: number; maxMm: number };

export function createXScale(minMm: number, maxMm: number): XScale {
  const plotW = DIAGRAM_WIDTH - DIAGRAM_PAD.left - DIAGRAM_PAD.right;
  const span = maxMm - minMm || 1;
  return { toPx: (xMm) => DIAGRAM_PAD.left + ((xMm - minMm) / span) * plotW, minMm, maxMm };
}

/** Round tick steps (1, 2, 5 x 10^n) and an axis range widened to whole steps, so no value falls outside. */
export function getAxis(min: number, max: number, count: number): { ticks: number[]; lo: number; hi: number } {
  const span = max - min || Math.abs(max) || 1;
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 5, 10].find((m) => m * power >= raw) ?? 10) * power;
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.max(Math.ceil(max / step - 1e-9) * step, lo + step);
  const ticks: number[] = [];
  // at most count + 2 ticks by construction; the bound guards against a degenerate step
  for (let i = 0; lo + i * step <= hi + step * 1e-9 && i < 50; i++) {
    const t = lo + i * step;
    ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  }
  return { ticks, lo, hi };
}

export function formatTick(value: number): string {
  return Number(value.toPrecision(6)).toLocaleString("en-GB", { maximumFractionDigits: 3 });
}
