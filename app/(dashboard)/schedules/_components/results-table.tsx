import Link from "next/link";

import type { ResultRow } from "@/db/queries/schedules";
import { TERMS } from "@/lib/vocabulary";

import { categoryLabels, formatCheckKey, formatRatio, formatSignedMm, formatSpanRatio } from "./format";
import { OutcomeLabel } from "./outcome-label";

export type ResultsTableProps = { scheduleId: string; rows: ResultRow[] };

const rowTones = {
  pass: "",
  fail: "bg-red-50 [&>*:first-child]:border-l-4 [&>*:first-child]:border-l-fail",
  error: "bg-caution-bg [&>*:first-child]:border-l-4 [&>*:first-child]:border-l-caution",
};

export function ResultsTable({ scheduleId, rows }: ResultsTableProps) {
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet">
      <table className="w-full min-w-[44rem] border-collapse text-left">
        <caption className="sr-only">Member results; failing members are marked Fail with a triangle</caption>
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className="px-3 py-2 font-medium">Mark</th>
            <th scope="col" className="px-3 py-2 font-medium">Category</th>
            <th scope="col" className="px-3 py-2 font-medium">Governing check</th>
            <th scope="col" className="px-3 py-2 text-right font-medium">Deflection (mm)</th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Achieved <span className="normal-case">l/N</span> (limit)
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">Utilization</th>
            <th scope="col" className="px-3 py-2 text-right font-medium">Factor of safety</th>
            <th scope="col" className="px-3 py-2 font-medium">{TERMS.outcome.label}</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.memberIndex} className={`border-t border-rule align-top ${rowTones[r.status]}`} data-status={r.status}>
              <th scope="row" className="min-w-[8rem] max-w-[16rem] px-3 py-1.5 font-medium">
                <Link href={`/schedules/${scheduleId}/members/${encodeURIComponent(r.mark)}`} className="text-action underline-offset-2 hover:underline [overflow-wrap:anywhere]">
                  {r.mark}
                </Link>
              </th>
              <td className="px-3 py-1.5">{categoryLabels[r.category] ?? r.category}</td>
              <td className="px-3 py-1.5">
                {formatCheckKey(r.governingCheck)}
                {r.notes.length > 0 ? <p className="text-xs text-caution [overflow-wrap:anywhere]">{r.notes.join("; ")}</p> : null}
              </td>
              <td className="px-3 py-1.5 text-right">{formatSignedMm(r.governingDeflectionMm)}</td>
              <td className="px-3 py-1.5 text-right whitespace-nowrap">
                {r.limitRatio === null ? "—" : `${formatSpanRatio(r.achievedRatio)} (${formatSpanRatio(r.limitRatio)})`}
              </td>
              <td className={`px-3 py-1.5 text-right ${r.status === "fail" ? "font-semibold" : ""}`}>{formatRatio(r.utilization)}</td>
              <td className="px-3 py-1.5 text-right" title={r.factorOfSafety === null && r.status !== "error" ? "no deflection under this check" : undefined}>
                {formatRatio(r.factorOfSafety)}
              </td>
              <td className="px-3 py-1.5">
                <OutcomeLabel status={r.status} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
