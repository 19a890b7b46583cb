import { getSchedule } from "@/db/queries/schedules";
import { MAX_MEMBERS } from "@/lib/engine/intake";
import { withSessionRoute } from "@/lib/server/auth/guards";
import { assertFound } from "@/lib/server/errors";
import { readResultQueryOrThrow } from "@/lib/server/schedules/result-query";
import { streamResultsCsv } from "@/lib/server/schedules/stream-results-csv";

// GET /schedules/{scheduleId}/results.csv: the results table as CSV for the dashboard (cookie session), streamed, formula prefixes neutralised, the caution last.
export const GET = withSessionRoute<{ scheduleId: string }>("GET /schedules/[scheduleId]/results.csv", async (request, context, params) => {
  const schedule = assertFound(await getSchedule(context!.active!.organizationId, params.scheduleId), "The schedule");
  // The whole filtered table, in the view's order; a page's cursor or number does not narrow an export.
  const { sort, filters } = readResultQueryOrThrow(new URL(request.url).searchParams);
  return new Response(streamResultsCsv(schedule.id, { sort, filters }, { limit: MAX_MEMBERS, withHeader: true }), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${schedule.id}-results.csv"`,
      "cache-control": "no-store",
    },
  });
});
