import { and, eq, gte, inArray } from "drizzle-orm";

import { getDb } from "@/db/client";
import { webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { DomainError, assertFound } from "@/lib/server/errors";

import { enqueueDeliveries } from "./enqueue";

export const RESEND_BATCH_LIMIT = 1_000;

/**
 * Sends a delivery again, with the same webhook-id (receivers deduplicate on it) and a fresh
 * retry schedule. Any state may be resent: a receiver may have lost even a succeeded one.
 */
export async function resendDelivery(input: { organizationId: string; deliveryId: string }): Promise<void> {
  const [row] = await getDb()
    .select({ delivery: webhookDeliveries, enabled: webhookEndpoints.enabled })
    .from(webhookDeliveries)
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .where(and(eq(webhookDeliveries.id, input.deliveryId), eq(webhookDeliveries.organizationId, input.organizationId)));
  const found = assertFound(row, "The delivery");
  if (!found.enabled) throw new DomainError("conflict", "The endpoint is disabled. Enable it first, then resend.");
  const [moved] = await getDb()
    .update(webhookDeliveries)
    .set({ status: "pending", roundAttempts: 0, nextAttemptAt: new Date(), updatedAt: new Date() })
    .where(and(eq(webhookDeliveries.id, found.delivery.id), eq(webhookDeliveries.attemptCount, found.delivery.attemptCount)))
    .returning({ attemptCount: webhookDeliveries.attemptCount });
  if (!moved) throw new DomainError("conflict", "The delivery is being attempted right now; try again in a moment.");
  await enqueueDeliveries([{ deliveryId: found.delivery.id, attemptNumber: moved.attemptCount + 1 }]);
}

/** Resends every failed or dead delivery created since a moment, to enabled endpoints (optionally one). */
export async function resendFailedSince(input: { organizationId: string; since: Date; endpointId?: string }): Promise<number> {
  const conditions = [
    eq(webhookDeliveries.organizationId, input.organizationId),
    inArray(webhookDeliveries.status, ["failed", "dead"]),
    gte(webhookDeliveries.createdAt, input.since),
    eq(webhookEndpoints.enabled, true),
  ];
  if (input.endpointId) conditions.push(eq(webhookDeliveries.endpointId, input.endpointId));
  const rows = await getDb()
    .select({ id: webhookDeliveries.id, attemptCount: webhookDeliveries.attemptCount })
    .from(webhookDeliveries)
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .where(and(...conditions))
    .limit(RESEND_BATCH_LIMIT);
  if (rows.length === 0) return 0;
  const ids = rows.map((r) => r.id);
  await getDb()
    .update(webhookDeliveries)
    .set({ status: "pending", roundAttempts: 0, nextAttemptAt: new Date(), updatedAt: new Date() })
    .where(and(inArray(webhookDeliveries.id, ids), inArray(webhookDeliveries.status, ["failed", "dead"])));
  await enqueueDeliveries(rows.map((r) => ({ deliveryId: r.id, attemptNumber: r.attemptCount + 1 })));
  return rows.length;
}
