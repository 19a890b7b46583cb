"use client";

import { useRouter } from "next/navigation";
import { useTransition } from "react";

import { Button } from "./button";

export type ErrorBoundaryProps = { error: Error & { digest?: string }; reset: () => void };

/**
 * What a dashboard page shows when it failed on our side, most often because the database was
 * unreachable for a moment: plain words, a retry, the reference that our logs carry, and nothing
 * of the server's insides (production hides the message; the digest is safe to show).
 */
export function UnavailableNotice({ error, reset }: ErrorBoundaryProps) {
  const router = useRouter();
  const [retrying, startRetry] = useTransition();
  // reset() alone re-renders what the browser already holds; the failure was on the server, so ask it again.
  const retry = () =>
    startRetry(() => {
      router.refresh();
      reset();
    });
  return (
    <section aria-labelledby="unavailable-heading" role="alert" className="mx-auto max-w-lg rounded border border-caution/40 bg-caution-bg p-4 text-caution">
      <h1 id="unavailable-heading" className="font-semibold">
        Sagline could not open this page just now
      </h1>
      <p className="mt-1">Its records could not be reached. Nothing was changed. Try again in a moment.</p>
      {error.digest ? <p className="mt-1 text-sm">Reference {error.digest}</p> : null}
      <div className="mt-3 flex gap-3">
        <Button onClick={retry} disabled={retrying}>
          Try again
        </Button>
        <a href="/schedules" className="self-center text-action underline">
          Schedules
        </a>
      </div>
    </section>
  );
}
