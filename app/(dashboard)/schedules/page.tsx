import type { Metadata } from "next";
import Link from "next/link";

import { Notice } from "@/components/ui/notice";
import { SafetyCaution } from "@/components/ui/safety-caution";
import { listSchedules } from "@/db/queries/schedules";
import { OUTCOME_LABELS } from "@/lib/vocabulary";
import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";

import { formatDateTime } from "../_components/format-date-time";
import { PageHeader } from "../_components/page-header";
import { encodeCursor, isScheduleCursor, readPageCursor } from "./_components/cursor";
import { toQuery } from "./_components/search-query";
import { ScheduleListRow } from "./_components/schedule-list-row";

export const metadata: Metadata = { title: "Schedules" };

const PAGE_SIZE = 25;

type SchedulesPageProps = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function SchedulesPage({ searchParams }: SchedulesPageProps) {
  const context = await requirePage("/schedules");
  const query = toQuery(await searchParams);
  const { cursor, invalid } = readPageCursor(query.get("cursor"), isScheduleCursor);
  const { rows, hasMore } = await listSchedules(context.active!.organizationId, { limit: PAGE_SIZE, after: cursor });
  const last = rows.at(-1);
  const next = hasMore && last ? encodeCursor({ createdAt: last.createdAt.toISOString(), id: last.id }) : null;
  return (
    <>
      <PageHeader
        title="Schedules"
        lead={`Member schedules submitted to ${context.active?.organizationName ?? "this organization"}, with each member's serviceability result.`}
      >
        {can(context, "schedules:submit") ? (
          <Link href="/schedules/new" className="inline-flex items-center gap-1 rounded border border-action bg-action px-3 py-1.5 text-sm font-medium text-white hover:bg-action-strong">
            Submit a CSV
          </Link>
        ) : null}
      </PageHeader>
      <SafetyCaution />
      <p className="mt-2 text-xs text-ink-soft">
        <Link href="/verification" className="text-action underline">
          How the engine is verified
        </Link>{" "}
        against handbook formulas.
      </p>
      {invalid ? (
        <div className="mt-4">
          <Notice tone="info">That page link is not one Sagline issued; showing the newest schedules.</Notice>
        </div>
      ) : null}
      {rows.length === 0 ? (
        <p className="mt-6 rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">
          {cursor ? "No older schedules." : "No schedules have been submitted yet. Schedules arrive through the API or a CSV upload."}
        </p>
      ) : (
        <div className="mt-6 overflow-x-auto rounded border border-rule bg-sheet">
          <table className="w-full min-w-[44rem] border-collapse text-left">
            <caption className="sr-only">Schedules, newest first</caption>
            <thead className="text-xs uppercase tracking-wide text-ink-soft">
              <tr className="border-b border-rule">
                <th scope="col" className="px-3 py-2 font-medium">Schedule</th>
                <th scope="col" className="px-3 py-2 font-medium">Status</th>
                <th scope="col" className="px-3 py-2 font-medium">Progress</th>
                <th scope="col" className="px-3 py-2 text-right font-medium">{OUTCOME_LABELS.pass}</th>
                <th scope="col" className="px-3 py-2 text-right font-medium">{OUTCOME_LABELS.fail}</th>
                <th scope="col" className="px-3 py-2 text-right font-medium">{OUTCOME_LABELS.error}</th>
                <th scope="col" className="px-3 py-2 font-medium">Submitted</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((s) => (
                <ScheduleListRow key={s.id} schedule={s} submitted={formatDateTime(s.createdAt)} />
              ))}
            </tbody>
          </table>
        </div>
      )}
      <nav aria-label="Pages" className="mt-3 flex gap-3">
        {cursor ? (
          <Link className="text-action underline" href="/schedules">
            Newest
          </Link>
        ) : null}
        {next ? (
          <Link className="text-action underline" href={`/schedules?cursor=${next}`}>
            Older schedules
          </Link>
        ) : null}
      </nav>
    </>
  );
}
