import Link from "next/link";

import type { ResultPageRow } from "@/db/queries/results";
import { getDeflectionDirection } from "@/lib/engine/deflection-direction";
import { TERMS } from "@/lib/vocabulary";

import { categoryLabels, formatCheckKey, formatDeflection, formatRatio, formatSpanRatio, formatSpans } from "./format";
import { OutcomeLabel } from "./outcome-label";
import { optionalColumnLabels, type OptionalColumn } from "./result-columns";
import { reviewStateLabels } from "./review-state-labels";

export type ResultsTableProps = { scheduleId: string; rows: ResultPageRow[]; columns: readonly OptionalColumn[]; unitSystem: string };

const rowTones = {
  pass: "",
  fail: "bg-red-50 [&>*:first-child]:border-l-4 [&>*:first-child]:border-l-fail",
  error: "bg-caution-bg [&>*:first-child]:border-l-4 [&>*:first-child]:border-l-caution",
};

const head = "px-3 py-2 font-medium";
const cell = "px-3 py-1.5";

function signedDeflection(valueMm: number | null, system: string): string {
  if (valueMm === null) return "—";
  const direction = getDeflectionDirection(valueMm);
  return direction === "none" ? formatDeflection(valueMm, system) : `${formatDeflection(valueMm, system)} ${direction}`;
}

function optionalCell(column: OptionalColumn, r: ResultPageRow, system: string) {
  switch (column) {
    case "section":
      return <td className={`${cell} [overflow-wrap:anywhere]`}>{r.section ?? "—"}</td>;
    case "material":
      return <td className={`${cell} [overflow-wrap:anywhere]`}>{r.material ?? "—"}</td>;
    case "quantity":
      return <td className={`${cell} text-right`}>{r.quantity ?? "—"}</td>;
    case "spans":
      return <td className={`${cell} whitespace-nowrap`}>{formatSpans(r.spansMm, system)}</td>;
    case "deflection":
      return <td className={`${cell} text-right whitespace-nowrap`}>{signedDeflection(r.governingDeflectionMm, system)}</td>;
    case "allowed":
      return <td className={`${cell} text-right whitespace-nowrap`}>{formatDeflection(r.allowedDeflectionMm, system)}</td>;
    case "ratio":
      return <td className={`${cell} text-right whitespace-nowrap`}>{r.limitRatio === null ? "—" : `${formatSpanRatio(r.achievedRatio)} (limit ${formatSpanRatio(r.limitRatio)})`}</td>;
    case "disposition":
      return (
        <td className={cell}>
          {r.review ? (
            <>
              {reviewStateLabels[r.review.state] ?? r.review.state}
              {r.review.decidedBy ? <span className="block text-xs text-ink-soft [overflow-wrap:anywhere]">{r.review.decidedBy}</span> : null}
            </>
          ) : (
            "—"
          )}
        </td>
      );
  }
}

const optionalHeads: Record<OptionalColumn, { right?: boolean }> = {
  section: {},
  material: {},
  quantity: { right: true },
  spans: {},
  deflection: { right: true },
  allowed: { right: true },
  ratio: { right: true },
  disposition: {},
};

/** The results table; every text cell renders as text (React escapes it), marks wrap anywhere. */
export function ResultsTable({ scheduleId, rows, columns, unitSystem }: ResultsTableProps) {
  const unit = unitSystem === "US" ? "in" : "mm";
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet print:overflow-visible print:border-0">
      <table className="w-full min-w-[44rem] border-collapse text-left">
        <caption className="sr-only">Member results; failing members are marked Fail with a triangle</caption>
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className={head}>Mark</th>
            <th scope="col" className={head}>Category</th>
            <th scope="col" className={head}>Governing check</th>
            {columns.map((c) => (
              <th key={c} scope="col" className={`${head} ${optionalHeads[c].right ? "text-right" : ""}`}>
                {c === "ratio" ? (
                  <span className="normal-case">l/N achieved (limit)</span>
                ) : c === "deflection" || c === "allowed" ? (
                  `${c === "allowed" ? "Allowed" : "Deflection"} (${unit})`
                ) : (
                  optionalColumnLabels[c]
                )}
              </th>
            ))}
            <th scope="col" className={`${head} text-right`}>Utilization</th>
            <th scope="col" className={`${head} text-right`}>Factor of safety</th>
            <th scope="col" className={head}>{TERMS.outcome.label}</th>
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
              <td className={cell}>{categoryLabels[r.category] ?? r.category}</td>
              <td className={cell}>
                {formatCheckKey(r.governingCheck)}
                {r.notes.length > 0 ? <RowRemarks notes={r.notes} /> : null}
              </td>
              {columns.map((c) => (
                <OptionalCell key={c} column={c} row={r} system={unitSystem} />
              ))}
              <td className={`${cell} text-right ${r.status === "fail" ? "font-semibold" : ""}`}>{formatRatio(r.utilization)}</td>
              <td className={`${cell} text-right`}>{formatRatio(r.factorOfSafety)}</td>
              <td className={cell}>
                <OutcomeLabel status={r.status} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function OptionalCell({ column, row, system }: { column: OptionalColumn; row: ResultPageRow; system: string }) {
  return optionalCell(column, row, system);
}

/** A row's remarks folded under a count: long cracked-concrete notes would make every row a page tall. */
function RowRemarks({ notes }: { notes: string[] }) {
  return (
    <details className="text-xs text-caution">
      <summary className="cursor-pointer">
        {notes.length} remark{notes.length === 1 ? "" : "s"}
      </summary>
      <ul className="mt-1 list-disc pl-4 [overflow-wrap:anywhere]">
        {notes.map((note, index) => (
          <li key={index}>{note}</li>
        ))}
      </ul>
    </details>
  );
}
