import { getSchedule } from "@/db/queries/schedules";
import { withSessionRoute } from "@/lib/server/auth/guards";
import { assertFound } from "@/lib/server/errors";
import { readResultQueryOrThrow } from "@/lib/server/schedules/result-query";
import { getResultsView } from "@/lib/server/schedules/results-view";

// GET /api/schedules/{scheduleId}/results: one page of the results table with the schedule's live counts, for the dashboard (cookie session).
export const GET = withSessionRoute<{ scheduleId: string }>("GET /api/schedules/[scheduleId]/results", async (request, context, params) => {
  const schedule = assertFound(await getSchedule(context!.active!.organizationId, params.scheduleId), "The schedule");
  const query = readResultQueryOrThrow(new URL(request.url).searchParams);
  return Response.json(await getResultsView(schedule, query), { headers: { "cache-control": "no-store" } });
});
