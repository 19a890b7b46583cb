import { createEndpoint, listEndpoints, revealEndpointSecret } from "@/lib/server/webhooks/endpoints";

import { readJsonBody } from "../_lib/validate-body";
import { withApiKey } from "../_lib/with-api-key";
import { noStore, validateEndpointCreate, withJsonPointers } from "./_lib/schemas";

export const dynamic = "force-dynamic";

// GET /api/v1/webhook-endpoints: this organization's endpoints (at most 50), newest first; never their secrets.
export const GET = withApiKey("webhooks:manage", async (_request, key) => {
  return Response.json({ data: await listEndpoints(key.organizationId) }, { headers: noStore });
});

// POST /api/v1/webhook-endpoints: registers an endpoint (SSRF-checked); its signing secret is in this answer.
export const POST = withApiKey("webhooks:manage", async (request, key) => {
  const body = await readJsonBody(request, validateEndpointCreate);
  const endpoint = await withJsonPointers(() => createEndpoint({ organizationId: key.organizationId, url: body.url, description: body.description, eventTypes: body.eventTypes }));
  const { secret } = await revealEndpointSecret({ organizationId: key.organizationId, endpointId: endpoint.id });
  return Response.json({ endpoint, secret }, { status: 201, headers: { ...noStore, location: `/api/v1/webhook-endpoints/${endpoint.id}` } });
});
