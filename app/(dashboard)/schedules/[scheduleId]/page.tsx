import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";

import { Notice } from "@/components/ui/notice";
import { SafetyCaution } from "@/components/ui/safety-caution";
import { getSchedule } from "@/db/queries/schedules";
import { requirePage } from "@/lib/server/auth/guards";
import { can, getRequestContext } from "@/lib/server/auth/request-context";
import { hasResultFilters, readResultQuery, toResultSearchParams } from "@/lib/server/schedules/result-query";
import { getResultsView, RESULTS_PAGE_SIZE } from "@/lib/server/schedules/results-view";

import { PageHeader } from "../../_components/page-header";
import { ProfileVersionNotice } from "../../settings/limit-profiles/_components/profile-version-notice";
import { readColumns } from "../_components/result-columns";
import { ResultFiltersForm } from "../_components/result-filters-form";
import { ScheduleSummary } from "../_components/schedule-summary";
import { ResultsLiveView } from "./page-client";

type SearchParams = Record<string, string | string[] | undefined>;
type SchedulePageProps = {
  params: Promise<{ scheduleId: string }>;
  searchParams: Promise<SearchParams>;
};

/** The page title names the schedule; a schedule the visitor may not see is just "Schedule". */
export async function generateMetadata({ params }: SchedulePageProps): Promise<Metadata> {
  const { scheduleId } = await params;
  const context = await getRequestContext();
  const schedule = context?.active ? await getSchedule(context.active.organizationId, scheduleId) : null;
  return { title: schedule ? `${schedule.name} · results` : "Schedule" };
}

function toSearchParams(params: SearchParams): URLSearchParams {
  const out = new URLSearchParams();
  for (const [name, value] of Object.entries(params)) {
    for (const v of Array.isArray(value) ? value : value === undefined ? [] : [value]) out.append(name, v);
  }
  return out;
}

export default async function SchedulePage({ params, searchParams }: SchedulePageProps) {
  const { scheduleId } = await params;
  const context = await requirePage("/schedules/[scheduleId]", `/schedules/${encodeURIComponent(scheduleId)}`);
  // Another organization's schedule reads exactly like a missing one.
  const schedule = await getSchedule(context.active!.organizationId, scheduleId);
  if (!schedule) notFound();

  const search = toSearchParams(await searchParams);
  const { query, problems } = readResultQuery(search);
  const columns = readColumns(search.getAll("col"), search.get("cols"));
  const view = await getResultsView(schedule, query);
  const base = `/schedules/${schedule.id}`;
  const filterParams = toResultSearchParams(query);
  const linkParams = { ...filterParams, cols: columns.join(",") };
  const liveParams = new URLSearchParams(filterParams);
  if (query.position) liveParams.set("cursor", search.get("cursor")!);
  else if (query.page) liveParams.set("page", String(query.page));
  const filtered = hasResultFilters(query.filters);
  const exportQuery = new URLSearchParams(filterParams).toString();

  return (
    <>
      <p className="mb-2 text-xs print:hidden">
        <Link href="/schedules" className="text-action underline">
          Schedules
        </Link>
      </p>
      {/* Marks and names may be long unbroken strings: let them wrap anywhere rather than widen the page. */}
      <div className="[&_h1]:[overflow-wrap:anywhere] [&_p]:[overflow-wrap:anywhere]">
        <PageHeader title={schedule.name} lead={schedule.reference ?? undefined}>
          <span className="flex gap-2 print:hidden">
            <a href={`${base}/results.csv${exportQuery ? `?${exportQuery}` : ""}`} className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper" download>
              Export CSV{filtered ? " (filtered)" : ""}
            </a>
            <Link href={`${base}/record`} className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper">
              Printable record
            </Link>
          </span>
        </PageHeader>
      </div>
      <SafetyCaution />
      <ScheduleSummary schedule={schedule} />
      <ProfileVersionNotice organizationId={context.active!.organizationId} scheduleId={schedule.id} canRecheck={can(context, "schedules:submit")} />

      <section aria-labelledby="results-heading" className="mt-6">
        <div className="mb-2 space-y-2">
          <h2 id="results-heading" className="font-semibold">
            Results
          </h2>
          <ResultFiltersForm action={base} sort={query.sort} filters={query.filters} columns={columns} />
        </div>
        {problems.length > 0 ? (
          <div className="mb-2">
            <Notice tone="info">Not applied, not a value Sagline knows: {problems.map((p) => `${p.pointer.slice("/query/".length)} ${p.message}`).join("; ")}.</Notice>
          </div>
        ) : null}
        <ResultsLiveView
          scheduleId={schedule.id}
          initial={view}
          queryString={liveParams.toString()}
          linkParams={linkParams}
          columns={columns}
          unitSystem={schedule.unitSystem}
          filtered={filtered}
          pageSize={RESULTS_PAGE_SIZE}
        />
      </section>
    </>
  );
}
