import { withSessionRoute } from "@/lib/server/auth/guards";
import { getQueueView } from "@/lib/server/review/get-queue-view";
import { readQueueQuery } from "@/lib/server/review/queue-filters";
import { REVIEW_PAGE_SIZE } from "@/lib/server/review/list-review-queue";

// GET /api/review: one page of the review queue and how many schedules are still being checked, for the dashboard's live queue (cookie session).
export const GET = withSessionRoute("GET /api/review", async (request, context) => {
  const params = new URL(request.url).searchParams;
  const view = await getQueueView(context!.active!.organizationId, readQueueQuery(params), { limit: REVIEW_PAGE_SIZE, cursor: params.get("cursor") });
  return Response.json(view, { headers: { "cache-control": "no-store" } });
});
