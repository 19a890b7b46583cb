import { createOrganizationMaterial, listOrganizationMaterials } from "@/lib/server/criteria/organization-materials";

import { noStore, validateMaterialWrite } from "../_lib/criteria-bodies";
import { readJsonBody } from "../_lib/validate-body";
import { withApiKey } from "../_lib/with-api-key";

export const dynamic = "force-dynamic";

// GET /api/v1/materials: the organization's own materials (at most 500); library materials are listed in the Schedule schema.
export const GET = withApiKey("results:read", async (_request, key) => {
  return Response.json({ data: await listOrganizationMaterials(key.organizationId) }, { headers: noStore });
});

// POST /api/v1/materials: adds a material, usable by its id in schedules and CSV.
export const POST = withApiKey("criteria:manage", async (request, key) => {
  const body = await readJsonBody(request, validateMaterialWrite);
  const material = await createOrganizationMaterial(key.organizationId, body);
  return Response.json(material, { status: 201, headers: { ...noStore, location: `/api/v1/materials/${material.id}` } });
});
