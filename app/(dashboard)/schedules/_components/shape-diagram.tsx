import type { ShapeSample } from "@/lib/engine/model";

export type ShapeDiagramProps = {
  shape: ShapeSample[];
  /** Support or node positions along the member, mm from the left end, drawn as small triangles. */
  nodesMm?: number[];
};

const WIDTH = 720;
const HEIGHT = 280;
const PAD = { left: 68, right: 20, top: 22, bottom: 48 };
// Combinations differ by dash pattern and marker shape, so the legend works without colour.
const STROKES = [
  { dash: "", marker: "circle" },
  { dash: "7 4", marker: "square" },
  { dash: "2 3", marker: "triangle" },
  { dash: "10 3 2 3", marker: "diamond" },
] as const;

/** Round tick steps (1, 2, 5 x 10^n) and an axis range widened to whole steps, so no sample falls outside. */
function getAxis(min: number, max: number, count: number): { ticks: number[]; lo: number; hi: number } {
  const span = max - min || Math.abs(max) || 1;
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 5, 10].find((m) => m * power >= raw) ?? 10) * power;
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.max(Math.ceil(max / step - 1e-9) * step, lo + step);
  const ticks: number[] = [];
  for (let i = 0; lo + i * step <= hi + step * 1e-9; i++) {
    const t = lo + i * step;
    ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  }
  return { ticks, lo, hi };
}

function formatTick(value: number): string {
  return Number(value.toPrecision(6)).toLocaleString("en-GB", { maximumFractionDigits: 3 });
}

function Marker({ kind, x, y }: { kind: (typeof STROKES)[number]["marker"]; x: number; y: number }) {
  if (kind === "circle") return <circle cx={x} cy={y} r={3.5} />;
  if (kind === "square") return <rect x={x - 3.2} y={y - 3.2} width={6.4} height={6.4} />;
  if (kind === "triangle") return <path d={`M${x} ${y - 4.2}L${x + 4} ${y + 3}H${x - 4}Z`} />;
  return <path d={`M${x} ${y - 4.5}L${x + 4.5} ${y}L${x} ${y + 4.5}L${x - 4.5} ${y}Z`} />;
}

/**
 * The deflected shape per combination from the engine's samples: x along the member (m), deflection
 * in mm drawn downward as positive, as the member sags. Only finite samples are drawn.
 */
export function ShapeDiagram({ shape, nodesMm = [] }: ShapeDiagramProps) {
  const samples = shape.filter((s) => Number.isFinite(s.xMm));
  const combinations = [...new Set(samples.flatMap((s) => Object.keys(s.deflectionMm)))];
  if (samples.length < 2 || combinations.length === 0) {
    return <p className="text-ink-soft">No deflected shape was sampled for this member.</p>;
  }
  const xs = samples.map((s) => s.xMm);
  const values = samples.flatMap((s) => Object.values(s.deflectionMm).filter(Number.isFinite));
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);
  const { ticks: yTicks, lo: yMin, hi: yMax } = getAxis(Math.min(0, ...values), Math.max(0, ...values), 5);
  const plotW = WIDTH - PAD.left - PAD.right;
  const plotH = HEIGHT - PAD.top - PAD.bottom;
  const sx = (xMm: number) => PAD.left + ((xMm - xMin) / (xMax - xMin || 1)) * plotW;
  // Positive (downward) deflection goes down the page.
  const sy = (mm: number) => PAD.top + ((mm - yMin) / (yMax - yMin)) * plotH;
  // x ticks stay inside the member: the axis spans exactly its length.
  const xTicks = getAxis(xMin / 1000, xMax / 1000, 8).ticks.filter((t) => t * 1000 >= xMin - 1e-6 && t * 1000 <= xMax + 1e-6);

  const lines = combinations.map((id, index) => {
    const points = samples.filter((s) => Number.isFinite(s.deflectionMm[id])).map((s) => ({ x: s.xMm, y: s.deflectionMm[id]! }));
    const peak = points.reduce((best, p) => (Math.abs(p.y) > Math.abs(best.y) ? p : best), points[0] ?? { x: 0, y: 0 });
    return { id, style: STROKES[index % STROKES.length]!, points, peak };
  });
  const description = lines.map((l) => `${l.id}: largest ${formatTick(l.peak.y)} mm at x = ${formatTick(l.peak.x / 1000)} m`).join("; ");

  return (
    <figure className="space-y-2">
      <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} role="img" aria-labelledby="shape-title shape-desc" className="h-auto w-full max-w-3xl rounded border border-rule bg-sheet text-ink">
        <title id="shape-title">Deflected shape per combination</title>
        <desc id="shape-desc">{description}</desc>
        <g className="text-ink-soft" fontSize="11" fill="currentColor">
          {yTicks.map((t) => (
            <g key={`y${t}`}>
              <line x1={PAD.left} x2={WIDTH - PAD.right} y1={sy(t)} y2={sy(t)} stroke="var(--color-rule)" strokeWidth={t === 0 ? 0 : 1} />
              <text x={PAD.left - 6} y={sy(t) + 4} textAnchor="end">
                {formatTick(t)}
              </text>
            </g>
          ))}
          {xTicks.map((t) => (
            <text key={`x${t}`} x={sx(t * 1000)} y={HEIGHT - PAD.bottom + 16} textAnchor="middle">
              {formatTick(t)}
            </text>
          ))}
          <text x={PAD.left + plotW / 2} y={HEIGHT - 8} textAnchor="middle">
            Position from the left end, x (m)
          </text>
          <text transform={`translate(14 ${PAD.top + plotH / 2}) rotate(-90)`} textAnchor="middle">
            Deflection (mm, + downward)
          </text>
        </g>
        {/* The undeflected member. */}
        <line x1={sx(xMin)} x2={sx(xMax)} y1={sy(0)} y2={sy(0)} stroke="var(--color-ink-soft)" strokeWidth="3" opacity="0.35" />
        {nodesMm.filter(Number.isFinite).map((x, i) => (
          <path key={`n${i}`} d={`M${sx(x)} ${sy(0) + 2}l6 10h-12z`} fill="var(--color-ink-soft)" aria-hidden="true" />
        ))}
        {lines.map((l) => (
          <g key={l.id} stroke="var(--color-action)" fill="var(--color-action)">
            <polyline points={l.points.map((p) => `${sx(p.x).toFixed(1)},${sy(p.y).toFixed(1)}`).join(" ")} fill="none" strokeWidth="2" strokeDasharray={l.style.dash || undefined} />
            <Marker kind={l.style.marker} x={sx(l.peak.x)} y={sy(l.peak.y)} />
          </g>
        ))}
      </svg>
      <figcaption>
        <ul className="flex flex-wrap gap-x-5 gap-y-1 text-xs">
          {lines.map((l) => (
            <li key={l.id} className="flex items-center gap-1.5">
              <svg aria-hidden="true" width="34" height="10" viewBox="0 0 34 10" stroke="var(--color-action)" fill="var(--color-action)">
                <line x1="0" x2="34" y1="5" y2="5" strokeWidth="2" strokeDasharray={l.style.dash || undefined} />
                <Marker kind={l.style.marker} x={17} y={5} />
              </svg>
              <span className="[overflow-wrap:anywhere]">
                {l.id}: largest {formatTick(l.peak.y)} mm at x = {formatTick(l.peak.x / 1000)} m
              </span>
            </li>
          ))}
        </ul>
      </figcaption>
    </figure>
  );
}
