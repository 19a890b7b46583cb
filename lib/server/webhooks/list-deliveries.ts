import { and, asc, desc, eq, inArray, type SQL } from "drizzle-orm";

import { getDb } from "@/db/client";
import { deliveryStatuses, webhookAttempts, webhookDeliveries, webhookEndpoints, type DeliveryStatus } from "@/db/schema";

export const DELIVERY_PAGE_SIZE = 100;

export interface DeliveryFilter {
  endpointId?: string;
  status?: DeliveryStatus;
  eventType?: string;
}

export function isDeliveryStatus(value: string | undefined): value is DeliveryStatus {
  return !!value && (deliveryStatuses as readonly string[]).includes(value);
}

/** The newest deliveries of an organization with every attempt, oldest attempt first. */
export async function listDeliveries(organizationId: string, filter: DeliveryFilter = {}) {
  const conditions: SQL[] = [eq(webhookDeliveries.organizationId, organizationId)];
  if (filter.endpointId) conditions.push(eq(webhookDeliveries.endpointId, filter.endpointId));
  if (filter.status) conditions.push(eq(webhookDeliveries.status, filter.status));
  if (filter.eventType) conditions.push(eq(webhookDeliveries.eventType, filter.eventType));
  const deliveries = await getDb()
    .select({
      id: webhookDeliveries.id,
      eventId: webhookDeliveries.eventId,
      eventType: webhookDeliveries.eventType,
      endpointId: webhookDeliveries.endpointId,
      endpointUrl: webhookEndpoints.url,
      status: webhookDeliveries.status,
      attemptCount: webhookDeliveries.attemptCount,
      nextAttemptAt: webhookDeliveries.nextAttemptAt,
      lastStatusCode: webhookDeliveries.lastStatusCode,
      lastError: webhookDeliveries.lastError,
      createdAt: webhookDeliveries.createdAt,
    })
    .from(webhookDeliveries)
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .where(and(...conditions))
    .orderBy(desc(webhookDeliveries.createdAt), desc(webhookDeliveries.id))
    .limit(DELIVERY_PAGE_SIZE);
  const ids = deliveries.map((d) => d.id);
  const attempts = ids.length
    ? await getDb()
        .select({
          deliveryId: webhookAttempts.deliveryId,
          attemptNumber: webhookAttempts.attemptNumber,
          statusCode: webhookAttempts.statusCode,
          latencyMs: webhookAttempts.latencyMs,
          responseBody: webhookAttempts.responseBody,
          error: webhookAttempts.error,
          outcome: webhookAttempts.outcome,
          createdAt: webhookAttempts.createdAt,
        })
        .from(webhookAttempts)
        .where(inArray(webhookAttempts.deliveryId, ids))
        .orderBy(asc(webhookAttempts.attemptNumber))
    : [];
  return deliveries.map((d) => ({ ...d, attempts: attempts.filter((a) => a.deliveryId === d.id) }));
}

export type DeliveryListItem = Awaited<ReturnType<typeof listDeliveries>>[number];
