"use client";

import Link from "next/link";

import { Notice } from "@/components/ui/notice";
import type { DigestFrequency, Role } from "@/db/schema";
import type { QueueRow } from "@/lib/server/review/list-review-queue";
import type { QueueOptions } from "@/lib/server/review/list-queue-options";
import type { QueueQuery } from "@/lib/server/review/queue-filters";

import { BulkDispositionForm } from "./_components/bulk-disposition-form";
import { DigestPreferenceForm } from "./_components/digest-preference-form";
import { QueueFiltersForm } from "./_components/queue-filters-form";
import { QueueTable } from "./_components/queue-table";

export type ReviewPageClientProps = {
  rows: QueueRow[];
  query: QueueQuery;
  options: QueueOptions;
  notice: string | null;
  nextHref: string | null;
  firstPage: boolean;
  canDisposition: boolean;
  roleLabel: Role;
  digestFrequency: DigestFrequency | null;
};

/** The review queue: filters, the table, and for engineers the bulk action and the digest preference. */
export function ReviewPageClient({ rows, query, options, notice, nextHref, firstPage, canDisposition, roleLabel, digestFrequency }: ReviewPageClientProps) {
  return (
    <div className="mt-4 space-y-5">
      {notice ? <Notice tone="info">{notice}</Notice> : null}
      {canDisposition ? null : (
        <p className="rounded border border-rule bg-sheet px-3 py-2 text-sm text-ink-soft">
          Your role ({roleLabel}) reads the queue and each member&apos;s history. Engineers and administrators record dispositions.
        </p>
      )}
      <QueueFiltersForm query={query} options={options} />
      <QueueTable rows={rows} state={query.state} />
      <nav aria-label="Queue pages" className="flex gap-4 text-sm">
        {firstPage ? null : (
          <Link href="/review" className="text-action underline">
            First page
          </Link>
        )}
        {nextHref ? (
          <Link href={nextHref} className="text-action underline">
            Next page
          </Link>
        ) : null}
      </nav>
      {canDisposition && query.state === "awaiting_review" ? <BulkDispositionForm query={query} /> : null}
      {canDisposition && digestFrequency ? <DigestPreferenceForm frequency={digestFrequency} /> : null}
    </div>
  );
}
