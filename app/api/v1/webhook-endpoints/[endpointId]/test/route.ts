import { sendTestEvent } from "@/lib/server/webhooks/endpoints";

import { withApiKey } from "../../../_lib/with-api-key";
import { assertEndpointIdShape, noStore } from "../../_lib/schemas";

export const dynamic = "force-dynamic";

// POST /api/v1/webhook-endpoints/{endpointId}/test: queues a webhook.test event to this endpoint only.
export const POST = withApiKey<{ endpointId: string }>("webhooks:manage", async (_request, key, { endpointId }) => {
  assertEndpointIdShape(endpointId);
  const { eventId, deliveryId } = await sendTestEvent({ organizationId: key.organizationId, endpointId });
  return Response.json({ eventId, deliveryId }, { status: 202, headers: noStore });
});
