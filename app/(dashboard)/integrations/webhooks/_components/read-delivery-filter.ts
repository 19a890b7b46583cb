import { allEventTypes } from "@/lib/server/webhooks/events/event-types";
import { isDeliveryStatus, type DeliveryFilter } from "@/lib/server/webhooks/list-deliveries";

type Query = { get(name: string): string | null };

/**
 * The delivery log's filters from a query string. Unknown values are ignored rather than trusted:
 * only the organization's own endpoint ids and known names pass.
 */
export function readDeliveryFilter(query: Query, endpointIds: readonly string[]): DeliveryFilter {
  const single = (name: string) => {
    const v = query.get(name);
    return v && v.length <= 64 ? v : undefined;
  };
  const endpoint = single("endpoint");
  const status = single("status");
  const event = single("event");
  return {
    endpointId: endpointIds.find((id) => id === endpoint),
    status: isDeliveryStatus(status) ? status : undefined,
    eventType: (allEventTypes as readonly string[]).find((t) => t === event),
  };
}
