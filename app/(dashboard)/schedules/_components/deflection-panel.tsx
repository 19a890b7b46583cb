import type { ShapeSample, SupportKind } from "@/lib/engine/model";
import type { MemberCheckRow } from "@/lib/server/schedules/get-member-report";

import { DIAGRAM_PAD, DIAGRAM_WIDTH, formatTick, getAxis, type XScale } from "./diagram-scale";
import { formatQuantity, formatSignificant, prettyUnit, toDisplay, type DisplayUnits } from "./display-units";

const HEIGHT = 210;
const PAD = { top: 26, bottom: 22 };

export type PanelSpan = { startMm: number; lengthMm: number };

export type DeflectionPanelProps = {
  id: string;
  title: string;
  combinationId: string;
  samples: ShapeSample[];
  checks: MemberCheckRow[];
  spans: PanelSpan[];
  supports: { kind: SupportKind; atMm: number }[];
  scale: XScale;
  units: DisplayUnits;
};

type Point = { x: number; y: number };

/**
 * One combination's deflected shape (every load in place), + down drawn downward, with each
 * span's allowed deflection as a dashed line on the side the span deflects to, and each check's
 * largest deflection marked and labelled (from the check, which may come from a partial loading
 * and so lie off the curve). Values in the schedule's deflection unit.
 */
export function DeflectionPanel({ id, title, combinationId, samples, checks, spans, supports, scale, units }: DeflectionPanelProps) {
  const points: Point[] = samples.filter((s) => Number.isFinite(s.deflectionMm[combinationId])).map((s) => ({ x: s.xMm, y: toDisplay(s.deflectionMm[combinationId]!, "deflection", units) }));
  const rows = spans.map((span, index) => {
    const check = checks.find((c) => c.spanIndex === index);
    if (!check) return null;
    const down = check.deflectionMm >= 0;
    return {
      index,
      span,
      check,
      allowed: (down ? 1 : -1) * toDisplay(check.allowedMm, "deflection", units),
      peak: toDisplay(check.deflectionMm, "deflection", units),
    };
  });
  const present = rows.filter((r): r is NonNullable<typeof r> => r !== null);
  const values = [0, ...points.map((p) => p.y), ...present.flatMap((r) => [r.allowed, r.peak])].filter(Number.isFinite);
  const { ticks, lo, hi } = getAxis(Math.min(...values), Math.max(...values), 4);
  const plotH = HEIGHT - PAD.top - PAD.bottom;
  const sy = (value: number) => PAD.top + ((value - lo) / (hi - lo)) * plotH;
  const unit = prettyUnit(units.deflection);
  const description = present
    .map((r) => {
      const direction = r.check.deflectionMm >= 0 ? "down" : "up";
      const verdict = r.check.pass ? "passes" : "fails";
      return `span ${r.index + 1}: largest ${formatQuantity(Math.abs(r.check.deflectionMm), "deflection", units, 3)} ${direction} at ${formatQuantity(r.check.atMm, "length", units, 3)}, allowed ${formatQuantity(r.check.allowedMm, "deflection", units, 3)}, ${verdict}`;
    })
    .join("; ");

  return (
    <svg
      viewBox={`0 0 ${DIAGRAM_WIDTH} ${HEIGHT}`}
      role="img"
      aria-labelledby={`${id}-title ${id}-desc`}
      className="h-auto w-full rounded border border-rule bg-sheet text-ink"
      data-testid="deflection-panel"
      data-combination={combinationId}
    >
      <title id={`${id}-title`}>{`Deflected shape, ${title}`}</title>
      <desc id={`${id}-desc`}>{description || "no checks recorded"}</desc>
      <text x={DIAGRAM_PAD.left} y={15} fontSize="12" fontWeight="600" fill="currentColor">
        {title}
      </text>
      <g fontSize="11" fill="currentColor" className="text-ink-soft">
        {ticks.map((t) => (
          <g key={t}>
            <line x1={DIAGRAM_PAD.left} x2={DIAGRAM_WIDTH - DIAGRAM_PAD.right} y1={sy(t)} y2={sy(t)} stroke="var(--color-rule)" strokeWidth={t === 0 ? 0 : 0.8} />
            <text x={DIAGRAM_PAD.left - 6} y={sy(t) + 4} textAnchor="end">
              {formatTick(t)}
            </text>
          </g>
        ))}
        <text transform={`translate(14 ${PAD.top + plotH / 2}) rotate(-90)`} textAnchor="middle">
          {`${unit}, + down`}
        </text>
      </g>
      {/* the undeflected member, and a tick where each support holds it */}
      <line x1={scale.toPx(scale.minMm)} x2={scale.toPx(scale.maxMm)} y1={sy(0)} y2={sy(0)} stroke="currentColor" strokeWidth="1" opacity="0.5" />
      {supports
        .filter((s) => s.kind !== "free")
        .map((s, i) => (
          <path key={i} d={`M${scale.toPx(s.atMm)} ${sy(0)}l-4 7h8z`} fill="currentColor" opacity="0.6" aria-hidden="true" />
        ))}
      <g stroke="currentColor" fill="none">
        {present.map((r) => {
          const x0 = scale.toPx(r.span.startMm);
          const x1 = scale.toPx(r.span.startMm + r.span.lengthMm);
          const y = sy(r.allowed);
          const labelBelow = r.allowed > 0;
          return (
            <g key={r.index} data-allowed-span={r.index}>
              <line x1={x0} x2={x1} y1={y} y2={y} strokeWidth="1.4" strokeDasharray="6 4" />
              {x1 - x0 > 70 ? (
                <text x={x0 + 3} y={labelBelow ? y + 12 : y - 4} textAnchor="start" fontSize="10" fill="currentColor" stroke="none">
                  allowed {formatSignificant(Math.abs(r.allowed), 3)}
                </text>
              ) : null}
            </g>
          );
        })}
      </g>
      <polyline
        points={points.map((p) => `${scale.toPx(p.x).toFixed(1)},${sy(p.y).toFixed(1)}`).join(" ")}
        fill="none"
        stroke="var(--color-action)"
        strokeWidth="2.2"
        data-testid="deflected-shape"
      />
      {present.map((r) => {
        const x = scale.toPx(r.check.atMm);
        const y = sy(r.peak);
        const wide = scale.toPx(r.span.startMm + r.span.lengthMm) - scale.toPx(r.span.startMm) > 60;
        const labelAbove = r.peak >= 0;
        // near either end of the drawing the label turns inward, so it is never cut off
        const anchor = x > DIAGRAM_WIDTH - DIAGRAM_PAD.right - 40 ? "end" : x < DIAGRAM_PAD.left + 40 ? "start" : "middle";
        const labelX = anchor === "end" ? x - 7 : anchor === "start" ? x + 7 : x;
        return (
          <g key={r.index} data-maximum-span={r.index}>
            {r.check.pass ? (
              <circle cx={x} cy={y} r="4" fill="var(--color-sheet)" stroke="currentColor" strokeWidth="1.6" />
            ) : (
              <path d={`M${x} ${y - 5}l5 9h-10z`} fill="currentColor" />
            )}
            {wide ? (
              <text x={labelX} y={labelAbove ? y - 8 : y + 15} textAnchor={anchor} fontSize="10.5" fontWeight={r.check.pass ? 400 : 700} fill="currentColor">
                {formatSignificant(Math.abs(r.peak), 3)}
                {r.check.pass ? "" : " over"}
              </text>
            ) : null}
          </g>
        );
      })}
    </svg>
  );
}
