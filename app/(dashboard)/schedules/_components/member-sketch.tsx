import type { Load } from "@/lib/engine/model";
import type { MemberModelView } from "@/lib/server/schedules/describe-member-model";

import { DIAGRAM_WIDTH, formatTick, getAxis, type XScale } from "./diagram-scale";
import { formatQuantity, formatSignificant, prettyUnit, toDisplay, type DisplayUnits } from "./display-units";
import { SUPPORT_WORDS, SupportSymbol } from "./support-symbol";

/** Loads drawn one per row; the rest are counted, and all of them are in the inputs table. */
export const MAX_SKETCHED_LOADS = 10;
/** Each load row: a label line, then the arrows. */
const ROW_PX = 36;
const LABEL_PX = 13;
const TOP_PX = 10;

export type MemberSketchProps = { model: MemberModelView; scale: XScale; units: DisplayUnits; id: string };

function describeLoad(load: Load, units: DisplayUnits): string {
  const where = (mm: number | undefined, fallback: string) => (mm === undefined ? fallback : formatQuantity(mm, "length", units, 4));
  switch (load.kind) {
    case "uniform":
      return `${load.loadCase} ${formatQuantity(load.wNPerMm, "distributedLoad", units)} from ${where(load.startMm, "the left end")} to ${where(load.endMm, "the right end")}`;
    case "linear":
      return `${load.loadCase} ${formatQuantity(load.wStartNPerMm, "distributedLoad", units)} to ${formatQuantity(load.wEndNPerMm, "distributedLoad", units)} from ${where(load.startMm, "")} to ${where(load.endMm, "")}`;
    case "point":
      return `${load.loadCase} ${formatQuantity(load.pN, "force", units)} at ${where(load.atMm, "")}`;
    case "moment":
      return `${load.loadCase} moment ${formatQuantity(load.mNmm, "moment", units)} (clockwise +) at ${where(load.atMm, "")}`;
  }
}

/** The short label drawn beside a load: case and intensity. */
function labelLoad(load: Load, units: DisplayUnits): string {
  switch (load.kind) {
    case "uniform":
      return `${load.loadCase} ${formatQuantity(load.wNPerMm, "distributedLoad", units, 3)}`;
    case "linear":
      return `${load.loadCase} ${formatSignificant(toDisplay(load.wStartNPerMm, "distributedLoad", units), 3)} to ${formatQuantity(load.wEndNPerMm, "distributedLoad", units, 3)}`;
    case "point":
      return `${load.loadCase} ${formatQuantity(load.pN, "force", units, 3)}`;
    case "moment":
      return `${load.loadCase} ${formatQuantity(load.mNmm, "moment", units, 3)}`;
  }
}

function Arrow({ x, top, bottom, up }: { x: number; top: number; bottom: number; up: boolean }) {
  const tip = up ? top : bottom;
  const head = up ? `M${x} ${tip}l-3 5h6z` : `M${x} ${tip}l-3 -5h6z`;
  return (
    <g>
      <line x1={x} x2={x} y1={top} y2={bottom} strokeWidth="1" />
      <path d={head} fill="currentColor" stroke="none" />
    </g>
  );
}

function LoadRow({ load, row, scale, memberEndMm, units }: { load: Load; row: number; scale: XScale; memberEndMm: number; units: DisplayUnits }) {
  const labelY = TOP_PX + row * ROW_PX + 10;
  const top = TOP_PX + row * ROW_PX + LABEL_PX;
  const bottom = TOP_PX + (row + 1) * ROW_PX - 3;
  const label = labelLoad(load, units);
  if (load.kind === "point" || load.kind === "moment") {
    const x = scale.toPx(load.atMm);
    const anchor = x > DIAGRAM_WIDTH - 160 ? "end" : "start";
    const textX = anchor === "end" ? x - 12 : x + 12;
    return (
      <g data-load-kind={load.kind}>
        {load.kind === "point" ? (
          <Arrow x={x} top={top} bottom={bottom} up={load.pN < 0} />
        ) : (
          <g>
            {/* clockwise positive (model.ts): the arrowhead shows the sense */}
            <path d={`M${x - 7} ${bottom - 4}a8 8 0 1 1 14 0`} strokeWidth="1.3" fill="none" />
            <path d={load.mNmm >= 0 ? `M${x + 7} ${bottom - 1}l-3.5 -5h7z` : `M${x - 7} ${bottom - 1}l-3.5 -5h7z`} fill="currentColor" stroke="none" />
          </g>
        )}
        <text x={textX} y={labelY + 12} textAnchor={anchor} fontSize="11" fill="currentColor" stroke="none">
          {label}
        </text>
      </g>
    );
  }
  const startMm = load.startMm ?? 0;
  const endMm = load.endMm ?? memberEndMm;
  const x0 = scale.toPx(startMm);
  const x1 = scale.toPx(endMm);
  const wStart = load.kind === "uniform" ? load.wNPerMm : load.wStartNPerMm;
  const wEnd = load.kind === "uniform" ? load.wNPerMm : load.wEndNPerMm;
  const peak = Math.max(Math.abs(wStart), Math.abs(wEnd)) || 1;
  const heightAt = (w: number) => 4 + ((bottom - top - 4) * Math.abs(w)) / peak;
  const arrows = Math.max(2, Math.min(24, Math.round((x1 - x0) / 28)));
  const xs = Array.from({ length: arrows + 1 }, (_, k) => x0 + ((x1 - x0) * k) / arrows);
  const anchor = x0 > DIAGRAM_WIDTH - 200 ? "end" : "start";
  return (
    <g data-load-kind={load.kind}>
      <path d={`M${x0} ${bottom - heightAt(wStart)}L${x1} ${bottom - heightAt(wEnd)}`} strokeWidth="1.2" />
      {xs.map((x, k) => {
        const w = wStart + ((wEnd - wStart) * k) / arrows;
        return <Arrow key={k} x={x} top={bottom - heightAt(w)} bottom={bottom} up={w < 0} />;
      })}
      <text x={anchor === "end" ? x1 : x0 + 2} y={labelY} textAnchor={anchor} fontSize="11" fill="currentColor" stroke="none">
        {label}
      </text>
    </g>
  );
}

/**
 * The member as analysed: its span lengths on an x axis, its supports drawn by kind (overhang
 * tips left free) and its loads sketched above it, one load per row, upward loads with upward
 * arrows. Ink only; every fact is also in the text description for screen readers.
 */
export function MemberSketch({ model, scale, units, id }: MemberSketchProps) {
  const sketched = model.loads.slice(0, MAX_SKETCHED_LOADS);
  const hidden = model.loads.length - sketched.length;
  const rows = Math.max(1, sketched.length);
  const beamY = TOP_PX + rows * ROW_PX + 8;
  const axisY = beamY + 40;
  const height = axisY + 40;
  const memberEndMm = scale.maxMm;
  const lengthUnit = units.length;
  const xTicks = getAxis(toDisplay(scale.minMm, "length", units), toDisplay(scale.maxMm, "length", units), 8).ticks.filter(
    (t) => t >= toDisplay(scale.minMm, "length", units) - 1e-9 && t <= toDisplay(scale.maxMm, "length", units) + 1e-9,
  );
  const pxOfDisplay = (t: number) => scale.toPx(t / toDisplay(1, "length", units));
  const lastNode = model.supports.length - 1;
  const supportsText = model.supports
    .map((s, i) => `${i === 0 ? "left end" : i === lastNode ? "right end" : `node ${i + 1}`} at ${formatQuantity(s.atMm, "length", units)}: ${SUPPORT_WORDS[s.kind]}${s.springNPerMm !== null ? ` ${formatQuantity(s.springNPerMm, "springStiffness", units)}` : ""}`)
    .join("; ");
  const loadsText = model.loads.length === 0 ? "no applied loads" : model.loads.map((load) => describeLoad(load, units)).join("; ");
  const selfWeight = model.selfWeightCase ? `; self-weight added to ${model.selfWeightCase}` : "";

  return (
    <svg
      viewBox={`0 0 ${DIAGRAM_WIDTH} ${height}`}
      role="img"
      aria-labelledby={`${id}-title ${id}-desc`}
      className="h-auto w-full rounded border border-rule bg-sheet text-ink"
      data-testid="member-sketch"
    >
      <title id={`${id}-title`}>Member, supports and loads as analysed</title>
      <desc id={`${id}-desc`}>{`Supports: ${supportsText}. Loads: ${loadsText}${selfWeight}.`}</desc>
      <g stroke="currentColor" fill="none">
        {sketched.map((load, row) => (
          <LoadRow key={row} load={load} row={row} scale={scale} memberEndMm={memberEndMm} units={units} />
        ))}
      </g>
      {hidden > 0 ? (
        <text x={DIAGRAM_WIDTH - 8} y={TOP_PX + rows * ROW_PX} textAnchor="end" fontSize="11" fill="currentColor">
          {hidden} more load{hidden === 1 ? "" : "s"}: see the inputs
        </text>
      ) : null}
      <line x1={scale.toPx(scale.minMm)} x2={scale.toPx(scale.maxMm)} y1={beamY} y2={beamY} stroke="currentColor" strokeWidth="4" />
      {model.spans.map((span, index) => (
        <text key={index} x={scale.toPx(span.startMm + span.lengthMm / 2)} y={axisY - 6} textAnchor="middle" fontSize="11" fill="currentColor">
          {span.kind === "cantilever" ? "overhang " : "span "}
          {index + 1}: {formatQuantity(span.lengthMm, "length", units, 4)}
        </text>
      ))}
      <g className="text-ink">
        {model.supports.map((support, index) => (
          <SupportSymbol key={index} kind={support.kind} x={scale.toPx(support.atMm)} y={beamY + 2} end={index === 0 ? "left" : index === lastNode ? "right" : "interior"} index={index} />
        ))}
      </g>
      <g fontSize="11" fill="currentColor" className="text-ink-soft">
        <line x1={scale.toPx(scale.minMm)} x2={scale.toPx(scale.maxMm)} y1={axisY} y2={axisY} stroke="currentColor" strokeWidth="1" />
        {xTicks.map((t) => (
          <g key={t}>
            <line x1={pxOfDisplay(t)} x2={pxOfDisplay(t)} y1={axisY} y2={axisY + 4} stroke="currentColor" />
            <text x={pxOfDisplay(t)} y={axisY + 16} textAnchor="middle">
              {formatTick(t)}
            </text>
          </g>
        ))}
        <text x={DIAGRAM_WIDTH / 2} y={axisY + 32} textAnchor="middle">
          {`Position from the left end (${prettyUnit(lengthUnit)})`}
        </text>
      </g>
    </svg>
  );
}
