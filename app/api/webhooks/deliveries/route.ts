import { readDeliveryFilter } from "@/app/(dashboard)/integrations/webhooks/_components/read-delivery-filter";
import { withSessionRoute } from "@/lib/server/auth/guards";
import { listEndpoints } from "@/lib/server/webhooks/endpoints";
import { listDeliveries } from "@/lib/server/webhooks/list-deliveries";

// GET /api/webhooks/deliveries: the newest deliveries with their attempts, filtered, for the dashboard's live log (cookie session).
export const GET = withSessionRoute("GET /api/webhooks/deliveries", async (request, context) => {
  const organizationId = context!.active!.organizationId;
  const endpoints = await listEndpoints(organizationId);
  const filter = readDeliveryFilter(new URL(request.url).searchParams, endpoints.map((e) => e.id));
  return Response.json({ data: await listDeliveries(organizationId, filter) }, { headers: { "cache-control": "no-store" } });
});
