"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";

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

/** Polls the schedule's progress while the workers check it, then moves on. */
export function LiveProgress({ scheduleId, initial, finishedHref }: LiveProgressProps) {
  const router = useRouter();
  const [state, setState] = useState(initial);
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    let stopped = false;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const poll = async () => {
      try {
        const response = await fetch(`/api/schedules/${encodeURIComponent(scheduleId)}/progress`, { cache: "no-store" });
        if (!response.ok) throw new Error(`the progress request answered ${response.status}`);
        const body = (await response.json()) as Progress;
        if (stopped) return;
        setProblem(null);
        setState({ status: body.status, checked: body.progress.checked, members: body.progress.members });
        if (isScheduleFinished(body.status)) {
          if (finishedHref) router.push(finishedHref);
          else router.refresh();
          return;
        }
      } catch (error) {
        if (!stopped) setProblem(`Progress is not available right now (${(error as Error).message}); still trying.`);
      }
      if (!stopped) timer = setTimeout(poll, POLL_MS);
    };
    timer = setTimeout(poll, isScheduleFinished(initial.status) ? 0 : POLL_MS);
    return () => {
      stopped = true;
      if (timer) clearTimeout(timer);
    };
  }, [scheduleId, finishedHref, router, initial.status]);

  return (
    <div aria-live="polite" className="space-y-1" data-testid="live-progress">
      <p className="text-sm">
        <span className="font-medium">{scheduleStatusLabels[state.status] ?? state.status}</span>
        <span className="text-ink-soft"> · the workers are checking every member</span>
      </p>
      <ProgressBar checked={state.checked} members={state.members} label="Members checked" />
      {problem ? <p className="text-xs text-caution">{problem}</p> : null}
    </div>
  );
}
