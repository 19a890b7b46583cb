"use client";

import { useQuery } from "@tanstack/react-query";

import { fetchJson } from "@/components/data/fetch-json";
import { QueryProvider } from "@/components/data/query-provider";
import type { ResultsView } from "@/lib/server/schedules/results-view";
import { formatOutcomeCount } from "@/lib/vocabulary";

import { isScheduleFinished } from "../_components/format";
import type { OptionalColumn } from "../_components/result-columns";
import { ResultsPager } from "../_components/results-pager";
import { ResultsTable } from "../_components/results-table";

export type ResultsLiveViewProps = {
  scheduleId: string;
  initial: ResultsView;
  /** The query parameters of this view (filters, sort, cursor or page), as the live route reads them. */
  queryString: string;
  /** Parameters links keep (filters, sort, columns), without cursor or page. */
  linkParams: Record<string, string>;
  columns: readonly OptionalColumn[];
  unitSystem: string;
  filtered: boolean;
  pageSize: number;
};

const POLL_MS = 2000;

function ResultsLive(props: ResultsLiveViewProps) {
  const { scheduleId, initial, queryString } = props;
  const query = useQuery({
    queryKey: ["schedule-results", scheduleId, queryString],
    queryFn: ({ signal }) => fetchJson<ResultsView>(`/api/schedules/${encodeURIComponent(scheduleId)}/results${queryString ? `?${queryString}` : ""}`, signal),
    initialData: initial,
    initialDataUpdatedAt: 0,
    // While the workers run, counts and rows refresh; a finished schedule no longer changes.
    refetchInterval: (q) => (q.state.data && isScheduleFinished(q.state.data.schedule.status) ? false : POLL_MS),
    refetchOnWindowFocus: !isScheduleFinished(initial.schedule.status),
  });
  const view = query.data;
  const s = view.schedule;
  const running = !isScheduleFinished(s.status);
  return (
    <>
      <p aria-live="polite" className="mb-2 text-sm" data-testid="live-counts">
        <span className="font-medium" data-testid="match-count">
          {view.total.toLocaleString("en-GB")} {props.filtered ? "matching" : "checked"}
        </span>
        <span className="text-ink-soft">
          {" "}
          · {s.checked.toLocaleString("en-GB")} of {s.members.toLocaleString("en-GB")} checked · {formatOutcomeCount(s.passed, "pass")} · {formatOutcomeCount(s.failed, "fail")} ·{" "}
          {formatOutcomeCount(s.errors, "error")}{running ? " · updating while the workers check" : ""}
        </span>
      </p>
      {query.isError ? (
        <p role="status" className="mb-2 text-xs text-caution">
          Live updates are not available right now ({query.error.message}); showing what was last read, still trying.
        </p>
      ) : null}
      {view.rows.length === 0 ? (
        <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">
          {s.checked === 0 ? "No member has been checked yet." : props.filtered ? "No member matches these filters." : "No more members."}
        </p>
      ) : (
        <ResultsTable scheduleId={scheduleId} rows={view.rows} columns={props.columns} unitSystem={props.unitSystem} />
      )}
      <ResultsPager
        base={`/schedules/${scheduleId}`}
        params={props.linkParams}
        page={view.page}
        pageCount={view.pageCount}
        total={view.total}
        next={view.next}
        previous={view.previous}
        pageSize={props.pageSize}
      />
    </>
  );
}

/** The results table and its counts, rendered on the server first and kept current in the browser while the schedule runs. */
export function ResultsLiveView(props: ResultsLiveViewProps) {
  return (
    <QueryProvider>
      <ResultsLive {...props} />
    </QueryProvider>
  );
}
