import type { CheckLimitUsed } from "@/lib/server/schedules/describe-member-model";
import type { MemberCheckRow } from "@/lib/server/schedules/get-member-report";
import { getDeflectionDirection } from "@/lib/engine/deflection-direction";
import { TERMS, getSpanLabelOfCheck } from "@/lib/vocabulary";

import { formatQuantity, formatSignificant, prettyUnit, toDisplay, type DisplayUnits } from "./display-units";
import { formatRatio, formatSpanRatio } from "./format";
import { OutcomeLabel } from "./outcome-label";

/** Spans loaded per variable case, 1-based like the Span column: "live 1, 3; snow none". */
/** loadedSpans holds the engine's span indices; each is named as its checks name it ("span 1", "left overhang"). */
function describeLoadedSpans(loadedSpans: Record<string, number[]> | undefined, spanLabels: ReadonlyMap<number, string>): string {
  // no pattern applied (one clear span, patterns off, or no variable load): every load as given
  if (loadedSpans === undefined) return "all";
  return Object.entries(loadedSpans)
    .map(([loadCase, spans]) => `${loadCase} ${spans.length === 0 ? "none" : spans.map((span) => spanLabels.get(span) ?? `span ${span + 1}`).join(", ")}`)
    .join("; ");
}

/** A signed deflection (+ down) as its magnitude in the display unit and its direction. */
function formatDeflection(valueMm: number | null | undefined, units: DisplayUnits): string {
  if (valueMm === null || valueMm === undefined || !Number.isFinite(valueMm)) return "—";
  const direction = getDeflectionDirection(valueMm);
  const magnitude = formatQuantity(Math.abs(valueMm), "deflection", units, 3);
  return direction === "none" ? magnitude : `${magnitude} ${direction}`;
}

export type MemberChecksTableProps = {
  checks: MemberCheckRow[];
  governingKey: string | null;
  units: DisplayUnits;
  /** Combination labels by id, when the model is known. */
  labels?: Record<string, string>;
  limits?: CheckLimitUsed[];
};

const th = "px-2 py-2 align-bottom font-medium";

export function MemberChecksTable({ checks, governingKey, units, labels = {}, limits = [] }: MemberChecksTableProps) {
  if (checks.length === 0) return <p className="text-ink-soft">No checks were recorded for this member.</p>;
  const spanLabels = new Map(checks.map((c) => [c.spanIndex, getSpanLabelOfCheck(c.checkKey)]));
  const limitOf = (c: MemberCheckRow) => limits.find((l) => l.combinationId === c.combinationId && l.spanIndex === c.spanIndex);
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Every deflection check of this member</caption>
        <thead className="text-xs text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className={th}>Combination</th>
            <th scope="col" className={th}>Span</th>
            <th scope="col" className={th}>Spans loaded</th>
            <th scope="col" className={`${th} text-right`}>Largest deflection</th>
            <th scope="col" className={`${th} text-right`}>At ({prettyUnit(units.length)} from left)</th>
            <th scope="col" className={`${th} text-right`}>Allowed</th>
            <th scope="col" className={`${th} text-right`}>
              l/N achieved <span className="block font-normal">(limit)</span>
            </th>
            <th scope="col" className={`${th} text-right`}>Utilization</th>
            <th scope="col" className={`${th} text-right`}>Factor of safety</th>
            <th scope="col" className={th}>{TERMS.outcome.label}</th>
          </tr>
        </thead>
        <tbody>
          {checks.map((c) => {
            const limit = limitOf(c);
            return (
              <tr key={c.checkKey} className={`border-t border-rule ${c.pass ? "" : "bg-red-50 [&>*:first-child]:border-l-4 [&>*:first-child]:border-l-fail"}`}>
                <th scope="row" className="px-2 py-1.5 font-medium [overflow-wrap:anywhere]">
                  {labels[c.combinationId] ?? c.combinationId}
                  {labels[c.combinationId] ? <span className="block text-xs font-normal text-ink-soft">{c.combinationId}</span> : null}
                  {c.checkKey === governingKey ? <span className="block text-xs font-semibold">governing</span> : null}
                </th>
                <td className="px-2 py-1.5">
                  {getSpanLabelOfCheck(c.checkKey)}
                  {c.spanKind === "cantilever" ? <span className="block text-xs text-ink-soft">cantilever</span> : null}
                </td>
                <td className="px-2 py-1.5 text-ink-soft [overflow-wrap:anywhere]">{describeLoadedSpans(c.loadedSpans, spanLabels)}</td>
                <td className="px-2 py-1.5 text-right">
                  <span className="whitespace-nowrap">{formatDeflection(c.deflectionMm, units)}</span>
                  {c.deflectionBasis !== undefined ? (
                    <span className="block text-xs text-ink-soft">
                      {c.deflectionBasis === "chord" ? "from chord" : "total"}; chord {formatDeflection(c.chordDeflectionMm, units)}, total {formatDeflection(c.totalDeflectionMm, units)}, settlement{" "}
                      {(c.supportSettlementMm ?? []).map((v) => formatDeflection(v, units)).join(" / ")}
                    </span>
                  ) : null}
                </td>
                <td className="px-2 py-1.5 text-right">{formatSignificant(toDisplay(c.atMm, "length", units), 3)}</td>
                <td className="px-2 py-1.5 text-right">
                  <span className="whitespace-nowrap">{formatQuantity(c.allowedMm, "deflection", units, 3)}</span>
                  {limit?.capGoverned ? <span className="block text-xs font-semibold">cap governs</span> : null}
                </td>
                <td className="px-2 py-1.5 text-right whitespace-nowrap">
                  {formatSpanRatio(c.achievedRatio)} <span className="text-ink-soft">({formatSpanRatio(c.limitRatio)})</span>
                </td>
                <td className={`px-2 py-1.5 text-right ${c.pass ? "" : "font-semibold"}`}>{formatRatio(c.utilization)}</td>
                <td className="px-2 py-1.5 text-right">{formatRatio(c.factorOfSafety)}</td>
                <td className="px-2 py-1.5">
                  <OutcomeLabel status={c.pass ? "pass" : "fail"} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
