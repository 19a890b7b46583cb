"use client";

import { QueryProvider } from "@/components/data/query-provider";
import { Notice } from "@/components/ui/notice";
import type { DigestFrequency, Role } from "@/db/schema";
import type { QueueView } from "@/lib/server/review/get-queue-view";
import type { QueueOptions } from "@/lib/server/review/list-queue-options";
import type { QueueQuery } from "@/lib/server/review/queue-filters";

import { BulkDispositionForm } from "./_components/bulk-disposition-form";
import { DigestPreferenceForm } from "./_components/digest-preference-form";
import { LiveQueue } from "./_components/live-queue";
import { QueueFiltersForm } from "./_components/queue-filters-form";

export type ReviewPageClientProps = {
  view: QueueView;
  query: QueueQuery;
  /** The filters, sort and cursor of this page as query parameters (what the live route reads). */
  queryString: string;
  /** The same without the cursor. */
  linkParams: string;
  options: QueueOptions;
  notice: string | null;
  firstPage: boolean;
  canDisposition: boolean;
  roleLabel: Role;
  digestFrequency: DigestFrequency | null;
};

/** The review queue: filters, the live table, and for engineers the bulk action and the digest preference. */
export function ReviewPageClient({ view, query, queryString, linkParams, options, notice, firstPage, canDisposition, roleLabel, digestFrequency }: ReviewPageClientProps) {
  return (
    <div className="mt-4 space-y-5">
      {notice ? <Notice tone="info">{notice}</Notice> : null}
      {canDisposition ? null : (
        <p className="rounded border border-rule bg-sheet px-3 py-2 text-sm text-ink-soft">
          Your role ({roleLabel}) reads the queue and each member&apos;s history. Engineers and administrators record dispositions.
        </p>
      )}
      <QueueFiltersForm query={query} options={options} />
      <QueryProvider>
        <LiveQueue initial={view} queryString={queryString} linkParams={linkParams} state={query.state} firstPage={firstPage} />
      </QueryProvider>
      {canDisposition && query.state === "awaiting_review" ? <BulkDispositionForm query={query} /> : null}
      {canDisposition && digestFrequency ? <DigestPreferenceForm frequency={digestFrequency} /> : null}
    </div>
  );
}
