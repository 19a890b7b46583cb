import { deleteSectionCatalogue, getSectionCatalogueOrThrow, setSectionCatalogueInUse } from "@/lib/server/criteria/section-catalogues";

import { assertIdShape, noStore, validateCatalogueUpdate } from "../../_lib/criteria-bodies";
import { readJsonBody } from "../../_lib/validate-body";
import { withApiKey } from "../../_lib/with-api-key";

export const dynamic = "force-dynamic";

type Params = { catalogueId: string };

// GET /api/v1/section-catalogues/{catalogueId}: one catalogue with its sections in file order.
export const GET = withApiKey<Params>("results:read", async (_request, key, { catalogueId }) => {
  assertIdShape(catalogueId, "cat", "section catalogue");
  return Response.json(await getSectionCatalogueOrThrow(key.organizationId, catalogueId), { headers: noStore });
});

// PATCH /api/v1/section-catalogues/{catalogueId}: puts the catalogue in or out of use for schedules submitted from now on.
export const PATCH = withApiKey<Params>("criteria:manage", async (request, key, { catalogueId }) => {
  assertIdShape(catalogueId, "cat", "section catalogue");
  const body = await readJsonBody(request, validateCatalogueUpdate);
  return Response.json(await setSectionCatalogueInUse(key.organizationId, catalogueId, body.inUse), { headers: noStore });
});

// DELETE /api/v1/section-catalogues/{catalogueId}: removes it; schedules already submitted keep the sections they were checked with.
export const DELETE = withApiKey<Params>("criteria:manage", async (_request, key, { catalogueId }) => {
  assertIdShape(catalogueId, "cat", "section catalogue");
  await deleteSectionCatalogue(key.organizationId, catalogueId);
  return new Response(null, { status: 204, headers: noStore });
});
