import type { SupportKind } from "@/lib/engine/model";

export type SupportSymbolProps = {
  kind: SupportKind;
  /** Where the member meets the support, px. */
  x: number;
  y: number;
  /** Which end of the member the node is at: a fixed end's wall goes on the outer side. */
  end: "left" | "right" | "interior";
  index: number;
};

/** Words for each kind, for labels and descriptions (a free end is no support). */
export const SUPPORT_WORDS: Record<SupportKind, string> = {
  pinned: "pinned",
  roller: "roller",
  fixed: "fixed",
  spring: "spring",
  free: "free end",
};

function Ground({ x, y, half = 11 }: { x: number; y: number; half?: number }) {
  return (
    <g>
      <line x1={x - half} x2={x + half} y1={y} y2={y} strokeWidth="1.5" />
      {[-8, -3, 2, 7].map((dx) => (
        <line key={dx} x1={x + dx} x2={x + dx - 4} y1={y} y2={y + 4} strokeWidth="1" />
      ))}
    </g>
  );
}

/**
 * A support drawn by kind, in ink only (shape carries the meaning, not colour): a triangle for a
 * pin, a triangle on rollers, a hatched wall for a fixed end, a zigzag for a spring. A free end
 * (an overhang's tip) is not a support and draws nothing.
 */
export function SupportSymbol({ kind, x, y, end, index }: SupportSymbolProps) {
  if (kind === "free") return null;
  const common = { "data-support-kind": kind, "data-support-index": index, stroke: "currentColor", fill: "none" } as const;
  if (kind === "pinned") {
    return (
      <g {...common}>
        <path d={`M${x} ${y}l-8 13h16z`} strokeWidth="1.5" fill="var(--color-sheet)" />
        <Ground x={x} y={y + 13} />
      </g>
    );
  }
  if (kind === "roller") {
    return (
      <g {...common}>
        <path d={`M${x} ${y}l-8 11h16z`} strokeWidth="1.5" fill="var(--color-sheet)" />
        <circle cx={x - 4} cy={y + 14} r="2.6" strokeWidth="1.2" />
        <circle cx={x + 4} cy={y + 14} r="2.6" strokeWidth="1.2" />
        <Ground x={x} y={y + 17} />
      </g>
    );
  }
  if (kind === "spring") {
    const zig = Array.from({ length: 6 }, (_, k) => `l${k % 2 === 0 ? 5 : -10} 2.5`).join("") + "l5 1.5";
    return (
      <g {...common}>
        <path d={`M${x} ${y}v3${zig}v3`} strokeWidth="1.3" />
        <Ground x={x} y={y + 21} />
      </g>
    );
  }
  // fixed: a wall on the outer side of an end; an interior fixed node is drawn as a clamp block
  if (end === "interior") {
    return (
      <g {...common}>
        <rect x={x - 5} y={y - 9} width="10" height="18" strokeWidth="1.5" fill="var(--color-sheet)" />
        <line x1={x - 5} x2={x + 5} y1={y - 9} y2={y + 9} strokeWidth="1" />
        <line x1={x - 5} x2={x + 5} y1={y + 9} y2={y - 9} strokeWidth="1" />
      </g>
    );
  }
  const out = end === "left" ? -1 : 1;
  return (
    <g {...common}>
      <line x1={x} x2={x} y1={y - 14} y2={y + 14} strokeWidth="2" />
      {[-12, -6, 0, 6].map((dy) => (
        <line key={dy} x1={x} x2={x + out * 6} y1={y + dy} y2={y + dy + 6} strokeWidth="1" />
      ))}
    </g>
  );
}
