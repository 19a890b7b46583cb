import { rotateEndpointSecret } from "@/lib/server/webhooks/endpoints";

import { withApiKey } from "../../../_lib/with-api-key";
import { assertEndpointIdShape, noStore } from "../../_lib/schemas";

export const dynamic = "force-dynamic";

// POST /api/v1/webhook-endpoints/{endpointId}/rotate-secret: a new secret; the old one keeps signing until previousSecretExpiresAt.
export const POST = withApiKey<{ endpointId: string }>("webhooks:manage", async (_request, key, { endpointId }) => {
  assertEndpointIdShape(endpointId);
  const { secret, previousSecretExpiresAt } = await rotateEndpointSecret({ organizationId: key.organizationId, endpointId });
  return Response.json({ secret, previousSecretExpiresAt }, { headers: noStore });
});
