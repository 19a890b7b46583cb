import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";

import { Notice } from "@/components/ui/notice";
import { SafetyCaution } from "@/components/ui/safety-caution";
import { getSchedule, listResults } from "@/db/queries/schedules";
import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";

import { PageHeader } from "../../_components/page-header";
import { ProfileVersionNotice } from "../../settings/limit-profiles/_components/profile-version-notice";
import { encodeCursor, isIndexCursor, readPageCursor } from "../_components/cursor";
import { readResultFilters, toQuery } from "../_components/result-filters";
import { ResultFiltersForm } from "../_components/result-filters-form";
import { ResultsTable } from "../_components/results-table";
import { ScheduleSummary } from "../_components/schedule-summary";

export const metadata: Metadata = { title: "Schedule" };

const PAGE_SIZE = 50;

type SchedulePageProps = {
  params: Promise<{ scheduleId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
};

function buildQuery(values: Record<string, string | undefined>): string {
  const entries = Object.entries(values).filter((e): e is [string, string] => typeof e[1] === "string" && e[1] !== "");
  return entries.length === 0 ? "" : `?${new URLSearchParams(entries)}`;
}

export default async function SchedulePage({ params, searchParams }: SchedulePageProps) {
  const { scheduleId } = await params;
  const context = await requirePage("/schedules/[scheduleId]", `/schedules/${encodeURIComponent(scheduleId)}`);
  // Another organization's schedule reads exactly like a missing one.
  const schedule = await getSchedule(context.active!.organizationId, scheduleId);
  if (!schedule) notFound();

  const query = toQuery(await searchParams);
  const filters = readResultFilters(query);
  const { cursor, invalid } = readPageCursor(query.get("cursor"), isIndexCursor);
  const { rows, hasMore } = await listResults(schedule.id, { limit: PAGE_SIZE, afterIndex: cursor?.after, status: filters.status, category: filters.category });
  const last = rows.at(-1);
  const next = hasMore && last ? encodeCursor({ after: last.memberIndex }) : null;
  const base = `/schedules/${schedule.id}`;
  const filterQuery = { status: filters.status, category: filters.category };
  const filtered = filters.status !== undefined || filters.category !== undefined;

  return (
    <>
      <p className="mb-2 text-xs">
        <Link href="/schedules" className="text-action underline">
          Schedules
        </Link>
      </p>
      {/* Marks and names may be long unbroken strings: let them wrap anywhere rather than widen the page. */}
      <div className="[&_h1]:[overflow-wrap:anywhere] [&_p]:[overflow-wrap:anywhere]">
        <PageHeader title={schedule.name} lead={schedule.reference ?? undefined}>
          <a href={`${base}/results.csv${buildQuery(filterQuery)}`} className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper" download>
            Export CSV{filtered ? " (filtered)" : ""}
          </a>
        </PageHeader>
      </div>
      <SafetyCaution />
      <ScheduleSummary schedule={schedule} />
      <ProfileVersionNotice organizationId={context.active!.organizationId} scheduleId={schedule.id} canRecheck={can(context, "schedules:submit")} />

      <section aria-labelledby="results-heading" className="mt-6">
        <div className="mb-2 flex flex-wrap items-end justify-between gap-3">
          <h2 id="results-heading" className="font-semibold">
            Results
          </h2>
          <ResultFiltersForm action={base} status={filters.status} category={filters.category} />
        </div>
        {filters.rejected.length > 0 ? (
          <div className="mb-2">
            <Notice tone="info">Not applied, not a filter Sagline knows: {filters.rejected.join(", ")}.</Notice>
          </div>
        ) : null}
        {invalid ? (
          <div className="mb-2">
            <Notice tone="info">That page link is not one Sagline issued; showing the first page.</Notice>
          </div>
        ) : null}
        {rows.length === 0 ? (
          <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">
            {schedule.checkedCount === 0 ? "No member has been checked yet." : filtered ? "No member matches these filters." : "No more members."}
          </p>
        ) : (
          <ResultsTable scheduleId={schedule.id} rows={rows} />
        )}
        <nav aria-label="Result pages" className="mt-3 flex gap-3">
          {cursor ? (
            <Link className="text-action underline" href={`${base}${buildQuery(filterQuery)}`}>
              First page
            </Link>
          ) : null}
          {next ? (
            <Link className="text-action underline" href={`${base}${buildQuery({ ...filterQuery, cursor: next })}`}>
              {`Next ${PAGE_SIZE} members`}
            </Link>
          ) : null}
        </nav>
      </section>
    </>
  );
}
