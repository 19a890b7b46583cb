import { getSchedule } from "@/db/queries/schedules";
import { withSessionRoute } from "@/lib/server/auth/guards";
import { assertFound } from "@/lib/server/errors";
import { representSchedule } from "@/lib/server/schedules/represent";

// GET /api/schedules/{scheduleId}/progress: status, progress and counts for the dashboard's progress bar (cookie session).
export const GET = withSessionRoute<{ scheduleId: string }>("GET /api/schedules/[scheduleId]/progress", async (_request, context, params) => {
  const schedule = assertFound(await getSchedule(context!.active!.organizationId, params.scheduleId), "The schedule");
  const { id, status, failureReason, progress, counts } = representSchedule(schedule);
  return Response.json({ id, status, failureReason, progress, counts }, { headers: { "cache-control": "no-store" } });
});
