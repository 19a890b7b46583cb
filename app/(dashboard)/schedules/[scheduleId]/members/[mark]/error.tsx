"use client";

import Link from "next/link";

import { Button } from "@/components/ui/button";

/** The member page failed on our side: say so plainly, offer a retry, reveal nothing internal. */
export default function MemberError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <section aria-labelledby="member-error-heading" role="alert" className="rounded border border-caution/40 bg-caution-bg p-4 text-caution">
      <h1 id="member-error-heading" className="font-semibold">
        This member could not be shown
      </h1>
      <p className="mt-1">Something went wrong on our side while reading it. Nothing was changed.</p>
      <div className="mt-3 flex gap-3">
        <Button onClick={() => reset()}>Try again</Button>
        <Link href="/schedules" className="self-center text-action underline">
          Back to the schedules
        </Link>
      </div>
    </section>
  );
}
