"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect } from "react";

import { fetchJson } from "@/components/data/fetch-json";
import type { ReviewState } from "@/db/schema/reviews";
import type { QueueView } from "@/lib/server/review/get-queue-view";

import { QueueTable } from "./queue-table";

export type LiveQueueProps = {
  initial: QueueView;
  /** The queue's filters, sort and cursor as query parameters: the same for the page and its live route. */
  queryString: string;
  /** The filters and sort without the cursor, for the "Next page" link. */
  linkParams: string;
  state: ReviewState;
  firstPage: boolean;
};

// While workers check, members enter the queue every few seconds; otherwise new work is rare.
const CHECKING_POLL_MS = 2000;
const IDLE_POLL_MS = 15_000;

/** The queue table, rendered on the server first and refreshed in the browser without a reload. */
export function LiveQueue({ initial, queryString, linkParams, state, firstPage }: LiveQueueProps) {
  const queryKey = ["review-queue", queryString];
  const client = useQueryClient();
  const query = useQuery({
    queryKey,
    queryFn: ({ signal }) => fetchJson<QueueView>(`/api/review${queryString ? `?${queryString}` : ""}`, signal),
    initialData: initial,
    initialDataUpdatedAt: 0,
    refetchInterval: (q) => ((q.state.data?.unfinishedSchedules ?? 0) > 0 ? CHECKING_POLL_MS : IDLE_POLL_MS),
  });
  // A disposition re-renders the page on the server: its fresh rows replace what was polled.
  useEffect(() => {
    client.setQueryData(["review-queue", queryString], initial);
  }, [client, initial, queryString]);

  const view = query.data;
  const nextParams = new URLSearchParams(linkParams);
  if (view.nextCursor) nextParams.set("cursor", view.nextCursor);
  return (
    <>
      <p aria-live="polite" className="text-sm text-ink-soft" data-testid="queue-live-status">
        {view.unfinishedSchedules > 0
          ? `${view.unfinishedSchedules} schedule${view.unfinishedSchedules === 1 ? " is" : "s are"} being checked: the queue updates every few seconds.`
          : "The queue updates by itself when a schedule is checked."}
      </p>
      {query.isError ? (
        <p role="status" className="text-xs text-caution">
          The queue is not updating right now ({query.error.message}); showing what was last read, still trying.
        </p>
      ) : null}
      <QueueTable rows={view.rows} state={state} />
      <nav aria-label="Queue pages" className="flex gap-4 text-sm">
        {firstPage ? null : (
          <Link href="/review" className="text-action underline">
            First page
          </Link>
        )}
        {view.nextCursor ? (
          <Link href={`/review?${nextParams.toString()}`} className="text-action underline">
            Next page
          </Link>
        ) : null}
      </nav>
    </>
  );
}
