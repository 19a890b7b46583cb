"use client";

import { useQuery } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect } from "react";

import { fetchJson } from "@/components/data/fetch-json";
import { QueryProvider } from "@/components/data/query-provider";

import { isScheduleFinished, scheduleStatusLabels } from "./format";
import { ProgressBar } from "./progress-bar";

export type LiveProgressProps = {
  scheduleId: string;
  initial: { status: string; checked: number; members: number };
  /** Where to go when the workers finish; without it the current page refreshes. */
  finishedHref?: string;
};

type Progress = { status: string; progress: { members: number; checked: number } };

const POLL_MS = 800;

function LiveProgressView({ scheduleId, initial, finishedHref }: LiveProgressProps) {
  const router = useRouter();
  const query = useQuery({
    queryKey: ["schedule-progress", scheduleId],
    queryFn: ({ signal }) => fetchJson<Progress>(`/api/schedules/${encodeURIComponent(scheduleId)}/progress`, signal),
    initialData: { status: initial.status, progress: { members: initial.members, checked: initial.checked } },
    initialDataUpdatedAt: 0,
    // Stops once the workers are done; paused while the tab is hidden (QueryProvider's default).
    refetchInterval: (q) => (q.state.data && isScheduleFinished(q.state.data.status) ? false : POLL_MS),
  });
  const status = query.data.status;
  const finished = isScheduleFinished(status) && !isScheduleFinished(initial.status);
  useEffect(() => {
    if (!finished) return;
    if (finishedHref) router.push(finishedHref);
    else router.refresh();
  }, [finished, finishedHref, router]);

  return (
    <div aria-live="polite" className="space-y-1" data-testid="live-progress">
      <p className="text-sm">
        <span className="font-medium">{scheduleStatusLabels[status] ?? status}</span>
        <span className="text-ink-soft"> · the workers are checking every member</span>
      </p>
      <ProgressBar checked={query.data.progress.checked} members={query.data.progress.members} label="Members checked" />
      {query.isError ? <p className="text-xs text-caution">Progress is not available right now ({query.error.message}); still trying.</p> : null}
    </div>
  );
}

/** Polls the schedule's progress while the workers check it, then moves on. */
export function LiveProgress(props: LiveProgressProps) {
  return (
    <QueryProvider>
      <LiveProgressView {...props} />
    </QueryProvider>
  );
}
