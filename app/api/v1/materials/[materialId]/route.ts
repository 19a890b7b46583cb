import { deleteOrganizationMaterial, getOrganizationMaterialOrThrow, updateOrganizationMaterial } from "@/lib/server/criteria/organization-materials";

import { assertIdShape, noStore, validateMaterialWrite } from "../../_lib/criteria-bodies";
import { readJsonBody } from "../../_lib/validate-body";
import { withApiKey } from "../../_lib/with-api-key";

export const dynamic = "force-dynamic";

type Params = { materialId: string };

// GET /api/v1/materials/{materialId}: one organization material.
export const GET = withApiKey<Params>("results:read", async (_request, key, { materialId }) => {
  assertIdShape(materialId, "mat", "material");
  return Response.json(await getOrganizationMaterialOrThrow(key.organizationId, materialId), { headers: noStore });
});

// PUT /api/v1/materials/{materialId}: replaces its values for schedules submitted from now on.
export const PUT = withApiKey<Params>("criteria:manage", async (request, key, { materialId }) => {
  assertIdShape(materialId, "mat", "material");
  const body = await readJsonBody(request, validateMaterialWrite);
  return Response.json(await updateOrganizationMaterial(key.organizationId, materialId, body), { headers: noStore });
});

// DELETE /api/v1/materials/{materialId}: removes it; schedules already submitted keep the values they were checked with.
export const DELETE = withApiKey<Params>("criteria:manage", async (_request, key, { materialId }) => {
  assertIdShape(materialId, "mat", "material");
  await deleteOrganizationMaterial(key.organizationId, materialId);
  return new Response(null, { status: 204, headers: noStore });
});
