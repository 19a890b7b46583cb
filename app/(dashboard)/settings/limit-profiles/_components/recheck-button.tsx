"use client";

import Link from "next/link";
import { useActionState } from "react";

import { SubmitButton } from "@/components/forms/submit-button";
import { Notice } from "@/components/ui/notice";

import { recheckSchedule } from "../actions";

export type RecheckButtonProps = { scheduleId: string; version: number };

/** Submits the schedule again against the profile's current version; links to the new schedule. */
export function RecheckButton({ scheduleId, version }: RecheckButtonProps) {
  const [state, action] = useActionState(recheckSchedule, null);
  return (
    <form action={action} aria-label="Recheck with the new version" className="space-y-2">
      <input type="hidden" name="scheduleId" value={scheduleId} />
      {state && !state.ok ? <Notice tone="error">{state.message}</Notice> : null}
      {state?.ok && state.data ? (
        <Notice tone="ok">
          {state.message}{" "}
          <Link href={`/schedules/${state.data.scheduleId}`} className="underline">
            Open the recheck
          </Link>
        </Notice>
      ) : (
        <SubmitButton tone="quiet" pendingLabel="Submitting…">
          Recheck with the new version (v{version})
        </SubmitButton>
      )}
    </form>
  );
}
