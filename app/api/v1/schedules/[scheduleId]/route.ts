import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { getSchedule } from "@/db/queries/schedules";
import { assertFound } from "@/lib/server/errors";
import { representSchedule } from "@/lib/server/schedules/represent";

// GET /api/v1/schedules/{scheduleId}: status, progress and counts.
export const GET = withApiKey<{ scheduleId: string }>("results:read", async (_request, key, params) => {
  const schedule = assertFound(await getSchedule(key.organizationId, params.scheduleId), "The schedule");
  return Response.json(representSchedule(schedule));
});
