import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { SAFETY_CAUTION } from "@/lib/safety";
import { nextLink, readLimit } from "@/lib/server/http/cursor";
import { listReviewQueue, QUEUE_MAX_LIMIT } from "@/lib/server/review/list-review-queue";
import { readQueueQuery } from "@/lib/server/review/queue-filters";
import { representQueueRow } from "@/lib/server/review/represent-queue-row";

// GET /api/v1/review: the review queue across the organization's schedules, filtered and sorted, cursor-paginated.
export const GET = withApiKey("results:read", async (request, key) => {
  const url = new URL(request.url);
  const query = readQueueQuery(url.searchParams);
  const limit = readLimit(url.searchParams.get("limit"), QUEUE_MAX_LIMIT, 50);
  const page = await listReviewQueue(key.organizationId, query, { limit, cursor: url.searchParams.get("cursor") });
  let next: string | null = null;
  if (page.nextCursor) {
    const nextUrl = new URL(url);
    nextUrl.searchParams.set("cursor", page.nextCursor);
    next = `${nextUrl.pathname}${nextUrl.search}`;
  }
  return Response.json({ data: page.rows.map(representQueueRow), links: { next }, caution: SAFETY_CAUTION }, { headers: nextLink(url, page.nextCursor) });
});
