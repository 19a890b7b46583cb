import { deleteLimitProfile, getLimitProfileOrThrow, updateLimitProfile } from "@/lib/server/criteria/limit-profiles";

import { assertIdShape, noStore, validateLimitProfileWrite } from "../../_lib/criteria-bodies";
import { readJsonBody } from "../../_lib/validate-body";
import { withApiKey } from "../../_lib/with-api-key";

export const dynamic = "force-dynamic";

type Params = { profileId: string };

// GET /api/v1/limit-profiles/{profileId}: one profile with every version, newest first.
export const GET = withApiKey<Params>("results:read", async (_request, key, { profileId }) => {
  assertIdShape(profileId, "lp", "limit profile");
  return Response.json(await getLimitProfileOrThrow(key.organizationId, profileId), { headers: noStore });
});

// PUT /api/v1/limit-profiles/{profileId}: saves a change as a new version; stored results never change.
export const PUT = withApiKey<Params>("criteria:manage", async (request, key, { profileId }) => {
  assertIdShape(profileId, "lp", "limit profile");
  const body = await readJsonBody(request, validateLimitProfileWrite);
  return Response.json(await updateLimitProfile(key.organizationId, profileId, body), { headers: noStore });
});

// DELETE /api/v1/limit-profiles/{profileId}: removes the profile; schedules checked against it keep their stored profile.
export const DELETE = withApiKey<Params>("criteria:manage", async (_request, key, { profileId }) => {
  assertIdShape(profileId, "lp", "limit profile");
  await deleteLimitProfile(key.organizationId, profileId);
  return new Response(null, { status: 204, headers: noStore });
});
