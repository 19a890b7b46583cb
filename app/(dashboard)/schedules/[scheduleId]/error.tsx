"use client";

export type ScheduleErrorProps = { error: Error & { digest?: string }; reset: () => void };

/** A failure while reading the results: says so plainly, offers a retry, and never shows internals. */
export default function ScheduleError({ error, reset }: ScheduleErrorProps) {
  return (
    <div role="alert" className="rounded border border-caution/30 bg-caution-bg p-4 text-sm text-caution">
      <p className="font-semibold">The results could not be read just now.</p>
      <p className="mt-1">Nothing was changed. Try again in a moment{error.digest ? ` (reference ${error.digest})` : ""}.</p>
      <button type="button" onClick={reset} className="mt-3 rounded border border-rule bg-sheet px-3 py-1.5 font-medium text-ink hover:bg-paper">
        Try again
      </button>
    </div>
  );
}
