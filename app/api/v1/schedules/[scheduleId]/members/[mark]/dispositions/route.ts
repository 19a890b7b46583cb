import dispositionCreateSchema from "@/api-schemas/v1/disposition-create.schema.json";
import { compileSchema, readJsonBody } from "@/app/api/v1/_lib/validate-body";
import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { assertDispositionTarget, recordDispositionFromApi } from "@/lib/server/review/record-disposition-from-api";

const validateDispositionCreate = compileSchema<unknown>(dispositionCreateSchema);

// POST /api/v1/schedules/{scheduleId}/members/{mark}/dispositions: record a disposition (append-only) on a member in review.
export const POST = withApiKey<{ scheduleId: string; mark: string }>("review:write", async (request, key, params) => {
  const mark = await assertDispositionTarget(key, params.scheduleId, params.mark);
  const body = await readJsonBody(request, validateDispositionCreate);
  const recorded = await recordDispositionFromApi(key, params.scheduleId, mark, body);
  return Response.json(recorded, { status: 201 });
});
