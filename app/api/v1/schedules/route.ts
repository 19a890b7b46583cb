import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { listSchedules } from "@/db/queries/schedules";
import { decodeCursor, encodeCursor, isScheduleCursor, nextLink, readLimit } from "@/lib/server/http/cursor";
import { SCHEDULE_PAGE_DEFAULT, SCHEDULE_PAGE_MAX } from "@/lib/server/schedules/page-limits";
import { representSchedule } from "@/lib/server/schedules/represent";
import { submitScheduleRequest } from "@/lib/server/schedules/submit-from-request";
import { warmUpScheduleIntakeAtServerStart } from "@/lib/server/schedules/warm-up";

warmUpScheduleIntakeAtServerStart();

// POST /api/v1/schedules: submit a whole schedule (JSON, CSV or multipart); 202 with its id.
export const POST = withApiKey("schedules:write", async (request, key) => {
  const { status, body, replayed } = await submitScheduleRequest(request, { organizationId: key.organizationId, apiKeyId: key.apiKeyId });
  const id = (body as { id: string }).id;
  return Response.json(body, {
    status,
    headers: { location: `/api/v1/schedules/${id}`, ...(replayed ? { "idempotent-replayed": "true" } : {}) },
  });
});

// GET /api/v1/schedules: the organization's schedules, newest first, cursor-paginated.
export const GET = withApiKey("results:read", async (request, key) => {
  const url = new URL(request.url);
  const limit = readLimit(url.searchParams.get("limit"), SCHEDULE_PAGE_MAX, SCHEDULE_PAGE_DEFAULT);
  const after = decodeCursor(url.searchParams.get("cursor"), isScheduleCursor);
  const { rows, hasMore } = await listSchedules(key.organizationId, { limit, after });
  const last = rows.at(-1);
  const cursor = hasMore && last ? encodeCursor({ createdAt: last.createdAt.toISOString(), id: last.id }) : null;
  return Response.json(
    { data: rows.map(representSchedule), links: { next: cursor ? `/api/v1/schedules?cursor=${cursor}&limit=${limit}` : null } },
    { headers: nextLink(url, cursor) },
  );
});
