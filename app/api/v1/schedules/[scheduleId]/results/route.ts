import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { findPosition } from "@/db/queries/results";
import { getSchedule } from "@/db/queries/schedules";
import { SAFETY_CAUTION } from "@/lib/safety";
import { DomainError, assertFound } from "@/lib/server/errors";
import { nextLink, readLimit } from "@/lib/server/http/cursor";
import { RESULT_PAGE_DEFAULT, RESULT_PAGE_MAX } from "@/lib/server/schedules/page-limits";
import { representResult } from "@/lib/server/schedules/represent";
import { encodeResultCursor, readResultQueryOrThrow, type ResultQuery } from "@/lib/server/schedules/result-query";
import { listScheduleResults } from "@/lib/server/schedules/list-schedule-results";
import { streamResultsCsv } from "@/lib/server/schedules/stream-results-csv";

const CSV_PAGE_MAX = 100_000;

function wantsCsv(request: Request, url: URL): boolean {
  const format = url.searchParams.get("format");
  if (format !== null && format !== "json" && format !== "csv") {
    throw new DomainError("bad_request", 'format must be "json" or "csv".', [{ pointer: "/query/format", message: "json or csv" }]);
  }
  return format === "csv" || (format === null && (request.headers.get("accept") ?? "").includes("text/csv"));
}

function pageLink(url: URL, cursor: string | null): string | null {
  if (!cursor) return null;
  const params = new URLSearchParams(url.searchParams);
  params.delete("page");
  params.set("cursor", cursor);
  return `${url.pathname}?${params}`;
}

/** A CSV page streams its rows; its next cursor is found first (one read of the page's keys). */
async function findCsvNext(scheduleId: string, query: ResultQuery, limit: number): Promise<string | null> {
  const end = await findPosition(scheduleId, { sort: query.sort, filters: query.filters, skip: limit, from: query.position, page: (query.position?.page ?? 1) + 1 });
  return end?.more ? encodeResultCursor(end.position) : null;
}

// GET /api/v1/schedules/{scheduleId}/results: the results table, sorted, filtered, searched by mark prefix and keyset-paginated, as JSON or CSV.
export const GET = withApiKey<{ scheduleId: string }>("results:read", async (request, key, params) => {
  const schedule = assertFound(await getSchedule(key.organizationId, params.scheduleId), "The schedule");
  const url = new URL(request.url);
  const query = readResultQueryOrThrow(url.searchParams);
  const csv = wantsCsv(request, url);
  const limit = readLimit(url.searchParams.get("limit"), csv ? CSV_PAGE_MAX : RESULT_PAGE_MAX, csv ? CSV_PAGE_MAX : RESULT_PAGE_DEFAULT);
  if (csv) {
    if (query.position?.back) throw new DomainError("bad_request", "CSV pages only move forward; use links.next.", [{ pointer: "/query/cursor", message: "a previous-page cursor" }]);
    if (query.page !== undefined) throw new DomainError("bad_request", "CSV pages follow cursors, not page numbers.", [{ pointer: "/query/page", message: "not for CSV" }]);
    const next = await findCsvNext(schedule.id, query, limit);
    return new Response(streamResultsCsv(schedule.id, query, { limit, withHeader: !query.position }), {
      headers: { ...nextLink(url, next), "x-schedule-status": schedule.status, "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${schedule.id}-results.csv"` },
    });
  }
  const page = await listScheduleResults(schedule, query, limit);
  return Response.json(
    {
      schedule: { id: schedule.id, status: schedule.status },
      data: page.rows.map(representResult),
      page: { number: page.page, count: page.pageCount, total: page.total },
      links: { next: pageLink(url, page.next), previous: pageLink(url, page.previous) },
      caution: SAFETY_CAUTION,
    },
    { headers: { ...nextLink(url, page.next), "x-schedule-status": schedule.status } },
  );
});

