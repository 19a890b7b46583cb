import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { getSchedule, listResults, type ResultStatus } from "@/db/queries/schedules";
import { DomainError, assertFound } from "@/lib/server/errors";
import { decodeCursor, encodeCursor, isIndexCursor, nextLink, readLimit } from "@/lib/server/http/cursor";
import { SAFETY_CAUTION } from "@/lib/safety";
import { RESULT_PAGE_DEFAULT, RESULT_PAGE_MAX } from "@/lib/server/schedules/page-limits";
import { representResult, resultsToCsv } from "@/lib/server/schedules/represent";

const statuses: ResultStatus[] = ["pass", "fail", "error"];

function wantsCsv(request: Request, url: URL): boolean {
  const format = url.searchParams.get("format");
  if (format !== null && format !== "json" && format !== "csv") {
    throw new DomainError("bad_request", 'format must be "json" or "csv".', [{ pointer: "/query/format", message: "json or csv" }]);
  }
  return format === "csv" || (format === null && (request.headers.get("accept") ?? "").includes("text/csv"));
}

// GET /api/v1/schedules/{scheduleId}/results: the pass/fail table, filtered and cursor-paginated, as JSON or CSV.
export const GET = withApiKey<{ scheduleId: string }>("results:read", async (request, key, params) => {
  const schedule = assertFound(await getSchedule(key.organizationId, params.scheduleId), "The schedule");
  const url = new URL(request.url);
  const status = url.searchParams.get("status");
  if (status !== null && !statuses.includes(status as ResultStatus)) {
    throw new DomainError("bad_request", 'status must be "pass", "fail" or "error".', [{ pointer: "/query/status", message: "pass, fail or error" }]);
  }
  const csv = wantsCsv(request, url);
  const limit = readLimit(url.searchParams.get("limit"), csv ? 100_000 : RESULT_PAGE_MAX, csv ? 100_000 : RESULT_PAGE_DEFAULT);
  const cursor = decodeCursor(url.searchParams.get("cursor"), isIndexCursor);
  const { rows, hasMore } = await listResults(schedule.id, {
    limit,
    afterIndex: cursor?.after,
    status: (status as ResultStatus | null) ?? undefined,
    category: url.searchParams.get("category") ?? undefined,
  });
  const last = rows.at(-1);
  const next = hasMore && last ? encodeCursor({ after: last.memberIndex }) : null;
  const headers = { ...nextLink(url, next), "x-schedule-status": schedule.status };
  if (csv) {
    return new Response(resultsToCsv(rows, !cursor), {
      headers: { ...headers, "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${schedule.id}-results.csv"` },
    });
  }
  return Response.json(
    { schedule: { id: schedule.id, status: schedule.status }, data: rows.map(representResult), links: { next: next ? `${url.pathname}?${new URLSearchParams({ ...Object.fromEntries(url.searchParams), cursor: next })}` : null }, caution: SAFETY_CAUTION },
    { headers },
  );
});
