import { getSchedule, listResults } from "@/db/queries/schedules";
import { MAX_MEMBERS } from "@/lib/engine/intake";
import { withSessionRoute } from "@/lib/server/auth/guards";
import { DomainError, assertFound } from "@/lib/server/errors";
import { resultsToCsv } from "@/lib/server/schedules/represent";

import { readResultFilters } from "../../_components/result-filters";

/** A schedule holds at most MAX_MEMBERS members: one page is all of them. */
const EXPORT_LIMIT = MAX_MEMBERS;

// GET /schedules/{scheduleId}/results.csv: the results table as CSV for the dashboard (cookie session), formula prefixes neutralised.
export const GET = withSessionRoute<{ scheduleId: string }>("GET /schedules/[scheduleId]/results.csv", async (request, context, params) => {
  const schedule = assertFound(await getSchedule(context!.active!.organizationId, params.scheduleId), "The schedule");
  const filters = readResultFilters(new URL(request.url).searchParams);
  if (filters.rejected.length > 0) throw new DomainError("bad_request", `Unknown filter: ${filters.rejected.join(", ")}.`);
  const { rows } = await listResults(schedule.id, { limit: EXPORT_LIMIT, status: filters.status, category: filters.category });
  return new Response(resultsToCsv(rows, true), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${schedule.id}-results.csv"`,
      "cache-control": "no-store",
    },
  });
});
