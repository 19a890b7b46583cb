import { deleteEndpoint, getEndpoint, setEndpointEnabled, updateEndpoint } from "@/lib/server/webhooks/endpoints";

import { readJsonBody } from "../../_lib/validate-body";
import { withApiKey } from "../../_lib/with-api-key";
import { assertEndpointIdShape, noStore, validateEndpointUpdate, withJsonPointers } from "../_lib/schemas";

export const dynamic = "force-dynamic";

type Params = { endpointId: string };

// GET /api/v1/webhook-endpoints/{endpointId}: one endpoint of this organization (404 for another's).
export const GET = withApiKey<Params>("webhooks:manage", async (_request, key, { endpointId }) => {
  assertEndpointIdShape(endpointId);
  return Response.json(await getEndpoint(key.organizationId, endpointId), { headers: noStore });
});

// PATCH /api/v1/webhook-endpoints/{endpointId}: changes URL, description, events or enabled.
export const PATCH = withApiKey<Params>("webhooks:manage", async (request, key, { endpointId }) => {
  assertEndpointIdShape(endpointId);
  const body = await readJsonBody(request, validateEndpointUpdate);
  const organizationId = key.organizationId;
  let endpoint = await getEndpoint(organizationId, endpointId);
  if (body.url !== undefined || body.description !== undefined || body.eventTypes !== undefined) {
    endpoint = await withJsonPointers(() => updateEndpoint({ organizationId, endpointId, url: body.url, description: body.description, eventTypes: body.eventTypes }));
  }
  if (body.enabled !== undefined && body.enabled !== endpoint.enabled) {
    endpoint = await setEndpointEnabled({ organizationId, endpointId, enabled: body.enabled });
  }
  return Response.json(endpoint, { headers: noStore });
});

// DELETE /api/v1/webhook-endpoints/{endpointId}: removes the endpoint and its delivery log.
export const DELETE = withApiKey<Params>("webhooks:manage", async (_request, key, { endpointId }) => {
  assertEndpointIdShape(endpointId);
  await deleteEndpoint({ organizationId: key.organizationId, endpointId });
  return new Response(null, { status: 204, headers: noStore });
});
