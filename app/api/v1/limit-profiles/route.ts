import { createLimitProfile, listLimitProfiles } from "@/lib/server/criteria/limit-profiles";

import { noStore, validateLimitProfileWrite } from "../_lib/criteria-bodies";
import { readJsonBody } from "../_lib/validate-body";
import { withApiKey } from "../_lib/with-api-key";

export const dynamic = "force-dynamic";

// GET /api/v1/limit-profiles: the organization's limit profiles (at most 200), each at its current version.
export const GET = withApiKey("results:read", async (_request, key) => {
  return Response.json({ data: await listLimitProfiles(key.organizationId) }, { headers: noStore });
});

// POST /api/v1/limit-profiles: creates a profile (version 1) from a preset or a definition.
export const POST = withApiKey("criteria:manage", async (request, key) => {
  const body = await readJsonBody(request, validateLimitProfileWrite);
  const profile = await createLimitProfile(key.organizationId, body);
  return Response.json(profile, { status: 201, headers: { ...noStore, location: `/api/v1/limit-profiles/${profile.id}` } });
});
