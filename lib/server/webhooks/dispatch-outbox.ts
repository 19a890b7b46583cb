import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";
import { createId } from "@/lib/server/ids";

import { enqueueDeliveries } from "./enqueue";

const BATCH = 100;

interface PendingEvent {
  id: string;
  organization_id: string;
  type: string;
  payload: { scheduleId?: unknown } | null;
}

/**
 * Fans undispatched outbox events out to deliveries: one per enabled endpoint of the event's
 * organization subscribed to its type, plus the schedule's callback endpoint when it belongs to the
 * same organization. FOR UPDATE SKIP LOCKED lets several worker processes run this at once; the
 * unique (event, endpoint) pair makes a repeat harmless. Returns how many events it dispatched.
 */
export async function dispatchOutbox(): Promise<number> {
  const created = await getSql().begin(async (tx) => {
    const events = await tx<PendingEvent[]>`
      select id, organization_id, type, payload from outbox_events
      where dispatched_at is null
      order by created_at
      limit ${BATCH}
      for update skip locked`;
    const deliveries: { id: string; eventId: string }[] = [];
    for (const event of events) {
      // A savepoint per event: one that cannot be dispatched is logged and left for the next run,
      // never holding back the rest of the batch.
      try {
        await tx.savepoint(async (sp) => {
          deliveries.push(...(await dispatchEvent(sp, event)));
        });
      } catch (error) {
        console.error(`[webhooks] could not dispatch ${event.id}: ${(error as Error).message}`);
      }
    }
    return { events: events.length, deliveries };
  });
  // After the commit: a failure here leaves pending deliveries that reconcileDeliveries re-queues.
  await enqueueDeliveries(created.deliveries.map((d) => ({ deliveryId: d.id, attemptNumber: 1 })));
  return created.events;
}

async function dispatchEvent(tx: TransactionSql, event: PendingEvent): Promise<{ id: string; eventId: string }[]> {
  const deliveries: { id: string; eventId: string }[] = [];
  const subscribed = await tx<{ id: string }[]>`
    select id from webhook_endpoints
    where organization_id = ${event.organization_id} and enabled and event_types ? ${event.type}`;
  const endpointIds = new Set(subscribed.map((e) => e.id));
  const scheduleId = typeof event.payload?.scheduleId === "string" ? event.payload.scheduleId : null;
  if (scheduleId && event.type.startsWith("schedule.")) {
    // Another organization's endpoint id in callbackEndpointId is ignored, never delivered to.
    const callbacks = await tx<{ id: string }[]>`
      select e.id from schedules s
      join webhook_endpoints e on e.id = s.callback_endpoint_id and e.organization_id = s.organization_id
      where s.id = ${scheduleId} and s.organization_id = ${event.organization_id} and e.enabled`;
    for (const c of callbacks) endpointIds.add(c.id);
  }
  if (endpointIds.size > 0) {
    const rows = [...endpointIds].map((endpointId) => ({
      id: createId("whd"),
      organization_id: event.organization_id,
      event_id: event.id,
      endpoint_id: endpointId,
      event_type: event.type,
      next_attempt_at: new Date().toISOString(),
    }));
    const inserted = await tx<{ id: string }[]>`
      insert into webhook_deliveries ${tx(rows)}
      on conflict (event_id, endpoint_id) do nothing
      returning id`;
    for (const row of inserted) deliveries.push({ id: row.id, eventId: event.id });
  }
  await tx`update outbox_events set dispatched_at = now(), updated_at = now() where id = ${event.id}`;
  return deliveries;
}

/** Drains the outbox (several batches), for the periodic task. */
export async function dispatchOutboxUntilEmpty(maxBatches = 20): Promise<number> {
  let total = 0;
  for (let i = 0; i < maxBatches; i += 1) {
    const n = await dispatchOutbox();
    total += n;
    if (n < BATCH) break;
  }
  return total;
}

/**
 * Postgres is the source of truth: deliveries whose attempt is overdue (Redis lost the job, or the
 * enqueue after a commit failed) are queued again. Natural job ids keep this from doubling work.
 */
export async function reconcileDeliveries(graceSeconds = 60): Promise<number> {
  const overdue = await getSql()<{ id: string; attempt_count: number }[]>`
    select id, attempt_count from webhook_deliveries
    where status in ('pending', 'failed') and next_attempt_at < now() - make_interval(secs => ${graceSeconds})
    order by next_attempt_at
    limit 500`;
  await enqueueDeliveries(overdue.map((d) => ({ deliveryId: d.id, attemptNumber: d.attempt_count + 1 })));
  return overdue.length;
}
