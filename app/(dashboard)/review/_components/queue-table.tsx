import Link from "next/link";

import type { ReviewState } from "@/db/schema/reviews";
import { CARRIED_OVER_LABEL, dispositionKindLabels, reviewStateLabels } from "@/lib/review-vocabulary";
import type { QueueRow } from "@/lib/server/review/list-review-queue";

import { categoryLabels, formatCheckKey, formatRatio } from "../../schedules/_components/format";

export type QueueTableProps = { rows: QueueRow[]; state: ReviewState };

const cell = "border-t border-rule px-2 py-1.5 align-top";

/** The queue as a dense table: one member per row, the figures an engineer sorts by, and any decision carried over. */
export function QueueTable({ rows, state }: QueueTableProps) {
  if (rows.length === 0) {
    return (
      <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">
        {state === "awaiting_review" ? "Nothing matching these filters is waiting for review." : "No member matches these filters."}
      </p>
    );
  }
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet">
      <table className="w-full min-w-[56rem] border-collapse text-left text-sm tabular-nums">
        <caption className="sr-only">Members in review ({reviewStateLabels[state]})</caption>
        <thead className="bg-paper text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="px-2 py-1.5">Mark</th>
            <th scope="col" className="px-2 py-1.5">Schedule</th>
            <th scope="col" className="px-2 py-1.5">Project</th>
            <th scope="col" className="px-2 py-1.5">Category</th>
            <th scope="col" className="px-2 py-1.5">Outcome</th>
            <th scope="col" className="px-2 py-1.5">Governing check</th>
            <th scope="col" className="px-2 py-1.5 text-right">Utilization</th>
            <th scope="col" className="px-2 py-1.5">In queue since</th>
            <th scope="col" className="px-2 py-1.5">Review</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={`${row.scheduleId}:${row.memberIndex}`}>
              <th scope="row" className={`${cell} font-medium [overflow-wrap:anywhere]`}>
                <Link href={`/schedules/${row.scheduleId}/members/${encodeURIComponent(row.mark)}`} className="text-action underline">
                  {row.mark}
                </Link>
              </th>
              <td className={`${cell} [overflow-wrap:anywhere]`}>
                {row.scheduleName}
                {row.reference ? <span className="block text-xs text-ink-soft">{row.reference}</span> : null}
              </td>
              <td className={`${cell} [overflow-wrap:anywhere]`}>{row.projectName ?? "—"}</td>
              <td className={cell}>{categoryLabels[row.category] ?? row.category}</td>
              <td className={cell}>{row.outcome === "fail" ? <span className="text-fail">Fails</span> : <span className="text-caution">Not checked (error)</span>}</td>
              <td className={cell}>{formatCheckKey(row.governingCheck)}</td>
              <td className={`${cell} text-right`}>{formatRatio(row.utilization)}</td>
              <td className={`${cell} whitespace-nowrap`}>{row.queuedAt.slice(0, 16).replace("T", " ")} UTC</td>
              <td className={cell}>
                {reviewStateLabels[row.state]}
                {row.carriedOver ? (
                  <span className="mt-1 block text-xs text-ink-soft">
                    <strong className="font-semibold">{CARRIED_OVER_LABEL}:</strong> {dispositionKindLabels[row.carriedOver.kind]} by {row.carriedOver.decidedByName} on {row.carriedOver.fromScheduleName}
                    {" "}(not applied)
                  </span>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
