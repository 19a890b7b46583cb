import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { getSchedule } from "@/db/queries/schedules";
import { assertFound } from "@/lib/server/errors";
import { SAFETY_CAUTION } from "@/lib/safety";
import { getMemberReview } from "@/lib/server/review/get-member-review";
import { getMemberReport } from "@/lib/server/schedules/get-member-report";

// GET /api/v1/schedules/{scheduleId}/members/{mark}: inputs, every check, the diagram samples and the review of one member.
export const GET = withApiKey<{ scheduleId: string; mark: string }>("results:read", async (_request, key, params) => {
  const schedule = assertFound(await getSchedule(key.organizationId, params.scheduleId), "The schedule");
  const report = assertFound(await getMemberReport(schedule.id, decodeURIComponent(params.mark)), "The member");
  const { units: _units, checks, ...rest } = report;
  const review = await getMemberReview(key.organizationId, schedule.id, report.mark);
  return Response.json({
    schedule: { id: schedule.id, status: schedule.status },
    ...rest,
    // The public names of a check's key and combination (api-schemas/v1/member-result.schema.json).
    checks: checks.map(({ checkKey, combinationId, ...check }) => ({ check: checkKey, combination: combinationId, ...check })),
    units: { length: "mm", rotation: "rad", frequency: "Hz" },
    review,
    caution: SAFETY_CAUTION,
  });
});
