import type { MemberCheckRow } from "@/lib/server/schedules/get-member-report";
import { TERMS, getSpanLabelOfCheck } from "@/lib/vocabulary";
import { formatMm, formatNumber, formatRatio, formatSignedMm, formatSpanRatio } from "./format";
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

export type MemberChecksTableProps = { checks: MemberCheckRow[]; governingKey: string | null };

export function MemberChecksTable({ checks, governingKey }: MemberChecksTableProps) {
  if (checks.length === 0) return <p className="text-ink-soft">No checks were recorded for this member.</p>;
  const spanLabels = new Map(checks.map((c) => [c.spanIndex, getSpanLabelOfCheck(c.checkKey)]));
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet">
      <table className="w-full min-w-[52rem] border-collapse text-left">
        <caption className="sr-only">Every deflection check of this member</caption>
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className="px-2 py-2 font-medium">Combination</th>
            <th scope="col" className="px-2 py-2 font-medium">Span</th>
            <th scope="col" className="px-2 py-2 font-medium">Spans loaded</th>
            <th scope="col" className="px-2 py-2 text-right font-medium">Deflection (mm)</th>
            <th scope="col" className="px-2 py-2 text-right font-medium">At x (m)</th>
            <th scope="col" className="px-2 py-2 text-right font-medium">Allowed (mm)</th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Achieved <span className="normal-case">l/N</span>
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Limit <span className="normal-case">l/N</span>
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">Utilization</th>
            <th scope="col" className="px-2 py-2 text-right font-medium">Factor of safety</th>
            <th scope="col" className="px-2 py-2 font-medium">{TERMS.outcome.label}</th>
          </tr>
        </thead>
        <tbody>
          {checks.map((c) => (
            <tr key={c.checkKey} className={`border-t border-rule ${c.pass ? "" : "bg-red-50 [&>*:first-child]:border-l-4 [&>*:first-child]:border-l-fail"}`}>
              <th scope="row" className="px-2 py-1.5 font-medium [overflow-wrap:anywhere]">
                {c.combinationId}
                {c.checkKey === governingKey ? <span className="block text-xs font-normal text-ink-soft">governing</span> : null}
              </th>
              <td className="px-2 py-1.5">
                {getSpanLabelOfCheck(c.checkKey)}
                {c.spanKind === "cantilever" ? <span className="text-ink-soft"> · cantilever</span> : null}
              </td>
              <td className="px-2 py-1.5 text-ink-soft">{describeLoadedSpans(c.loadedSpans, spanLabels)}</td>
              <td className="px-2 py-1.5 text-right">
                {formatSignedMm(c.deflectionMm)}
                {c.deflectionBasis !== undefined ? (
                  <span className="block text-xs text-ink-soft">
                    {c.deflectionBasis === "chord" ? "from chord" : "total"}; chord {formatMm(c.chordDeflectionMm ?? null)}, total {formatMm(c.totalDeflectionMm ?? null)}, settlement {(c.supportSettlementMm ?? []).map((v) => formatMm(v)).join(" / ")}
                  </span>
                ) : null}
              </td>
              <td className="px-2 py-1.5 text-right">{formatNumber(c.atMm / 1000, 3)}</td>
              <td className="px-2 py-1.5 text-right">{formatMm(c.allowedMm)}</td>
              <td className="px-2 py-1.5 text-right">{formatSpanRatio(c.achievedRatio)}</td>
              <td className="px-2 py-1.5 text-right">{formatSpanRatio(c.limitRatio)}</td>
              <td className={`px-3 py-1.5 text-right ${c.pass ? "" : "font-semibold"}`}>{formatRatio(c.utilization)}</td>
              <td className="px-2 py-1.5 text-right">{formatRatio(c.factorOfSafety)}</td>
              <td className="px-2 py-1.5">
                <OutcomeLabel status={c.pass ? "pass" : "fail"} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
