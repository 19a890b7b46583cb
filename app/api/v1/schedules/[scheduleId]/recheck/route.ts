import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { recheckSchedule } from "@/lib/server/criteria/recheck-schedule";
import { DomainError } from "@/lib/server/errors";
import { scheduleLinks } from "@/lib/server/schedules/represent";

export const dynamic = "force-dynamic";

// POST /api/v1/schedules/{scheduleId}/recheck: submits the schedule again against its organization profile's current version, linked to the old one.
export const POST = withApiKey<{ scheduleId: string }>("schedules:write", async (_request, key, { scheduleId }) => {
  if (!/^sch_[0-9a-z]{1,40}$/.test(scheduleId)) throw new DomainError("not_found", "The schedule was not found.");
  const created = await recheckSchedule({ organizationId: key.organizationId, scheduleId, apiKeyId: key.apiKeyId });
  return Response.json({ ...created, links: scheduleLinks(created.id) }, { status: 202, headers: { location: `/api/v1/schedules/${created.id}`, "cache-control": "no-store" } });
});
