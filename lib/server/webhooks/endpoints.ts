import { and, desc, eq } from "drizzle-orm";

import { getDb } from "@/db/client";
import { outboxEvents, webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { DomainError, assertFound } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";

import { getWebhookConfig } from "./config";
import { enqueueDeliveries } from "./enqueue";
import { subscribableEventTypes, type SubscribableEventType } from "./events/event-types";
import { createSigningSecret } from "./sign";
import { UnsafeUrlError, vetWebhookUrl, type Resolver } from "./ssrf-guard";

export const URL_MAX_LENGTH = 2_000;
export const DESCRIPTION_MAX_LENGTH = 300;
export const ENDPOINTS_PER_ORGANIZATION = 50;

/** What an integrator sees of an endpoint; the secret only through revealEndpointSecret. */
export interface EndpointView {
  id: string;
  url: string;
  description: string;
  eventTypes: string[];
  enabled: boolean;
  disabledReason: "manual" | "gone" | "failing" | null;
  disabledAt: Date | null;
  rotationEndsAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

function toView(row: typeof webhookEndpoints.$inferSelect, now = new Date()): EndpointView {
  const overlap = row.previousSecretExpiresAt && row.previousSecretExpiresAt > now ? row.previousSecretExpiresAt : null;
  return {
    id: row.id,
    url: row.url,
    description: row.description,
    eventTypes: row.eventTypes,
    enabled: row.enabled,
    disabledReason: row.disabledReason,
    disabledAt: row.disabledAt,
    rotationEndsAt: overlap,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/** Registration-time SSRF check (literal and DNS); the same guard runs again before every attempt. */
export async function assertSafeEndpointUrl(url: string, resolve?: Resolver): Promise<string> {
  if (url.length > URL_MAX_LENGTH) throw new DomainError("invalid_input", "The URL is too long.", [{ pointer: "url", message: `Use at most ${URL_MAX_LENGTH} characters.` }]);
  try {
    const target = await vetWebhookUrl(url, { allowlist: getWebhookConfig().allowlist, resolve });
    return target.url.toString();
  } catch (e) {
    if (e instanceof UnsafeUrlError) {
      throw new DomainError("invalid_input", "This URL cannot receive webhooks.", [{ pointer: "url", message: `The URL ${e.message}.` }]);
    }
    throw e;
  }
}

function assertEventTypes(eventTypes: readonly string[]): SubscribableEventType[] {
  const unique = [...new Set(eventTypes)];
  const unknown = unique.filter((t) => !(subscribableEventTypes as readonly string[]).includes(t));
  if (unknown.length > 0) throw new DomainError("invalid_input", "Unknown event type.", [{ pointer: "eventTypes", message: `Unknown event type ${unknown.join(", ")}.` }]);
  if (unique.length === 0) throw new DomainError("invalid_input", "Choose at least one event.", [{ pointer: "eventTypes", message: "Choose at least one event." }]);
  return unique as SubscribableEventType[];
}

export async function listEndpoints(organizationId: string): Promise<EndpointView[]> {
  const rows = await getDb().select().from(webhookEndpoints).where(eq(webhookEndpoints.organizationId, organizationId)).orderBy(desc(webhookEndpoints.createdAt), desc(webhookEndpoints.id));
  return rows.map((r) => toView(r));
}

async function getEndpointRow(organizationId: string, endpointId: string) {
  const [row] = await getDb().select().from(webhookEndpoints).where(and(eq(webhookEndpoints.id, endpointId), eq(webhookEndpoints.organizationId, organizationId)));
  // Another organization's endpoint answers exactly like a missing one.
  return assertFound(row, "The webhook endpoint");
}

export async function getEndpoint(organizationId: string, endpointId: string): Promise<EndpointView> {
  return toView(await getEndpointRow(organizationId, endpointId));
}

export async function createEndpoint(input: { organizationId: string; url: string; description?: string; eventTypes: readonly string[] }, resolve?: Resolver): Promise<EndpointView> {
  const eventTypes = assertEventTypes(input.eventTypes);
  const url = await assertSafeEndpointUrl(input.url, resolve);
  const existing = await listEndpoints(input.organizationId);
  if (existing.length >= ENDPOINTS_PER_ORGANIZATION) throw new DomainError("conflict", `An organization can register at most ${ENDPOINTS_PER_ORGANIZATION} endpoints.`);
  const [row] = await getDb()
    .insert(webhookEndpoints)
    .values({ id: createId("wh"), organizationId: input.organizationId, url, description: (input.description ?? "").trim(), eventTypes, secret: createSigningSecret() })
    .returning();
  return toView(row!);
}

export async function updateEndpoint(
  input: { organizationId: string; endpointId: string; url?: string; description?: string; eventTypes?: readonly string[] },
  resolve?: Resolver,
): Promise<EndpointView> {
  await getEndpointRow(input.organizationId, input.endpointId);
  const changes: Partial<typeof webhookEndpoints.$inferInsert> = { updatedAt: new Date() };
  if (input.url !== undefined) changes.url = await assertSafeEndpointUrl(input.url, resolve);
  if (input.description !== undefined) changes.description = input.description.trim();
  if (input.eventTypes !== undefined) changes.eventTypes = assertEventTypes(input.eventTypes);
  const [row] = await getDb().update(webhookEndpoints).set(changes).where(and(eq(webhookEndpoints.id, input.endpointId), eq(webhookEndpoints.organizationId, input.organizationId))).returning();
  return toView(assertFound(row, "The webhook endpoint"));
}

/** Enabling clears the disabled reason and the failure count; disabling by hand records "manual". */
export async function setEndpointEnabled(input: { organizationId: string; endpointId: string; enabled: boolean }): Promise<EndpointView> {
  const now = new Date();
  const [row] = await getDb()
    .update(webhookEndpoints)
    .set(input.enabled ? { enabled: true, disabledReason: null, disabledAt: null, consecutiveFailedDeliveries: 0, updatedAt: now } : { enabled: false, disabledReason: "manual", disabledAt: now, updatedAt: now })
    .where(and(eq(webhookEndpoints.id, input.endpointId), eq(webhookEndpoints.organizationId, input.organizationId)))
    .returning();
  return toView(assertFound(row, "The webhook endpoint"));
}

export async function deleteEndpoint(input: { organizationId: string; endpointId: string }): Promise<void> {
  const deleted = await getDb()
    .delete(webhookEndpoints)
    .where(and(eq(webhookEndpoints.id, input.endpointId), eq(webhookEndpoints.organizationId, input.organizationId)))
    .returning({ id: webhookEndpoints.id });
  assertFound(deleted[0], "The webhook endpoint");
}

/** The signing secret(s), for integrators and administrators only (the caller checks the permission). */
export async function revealEndpointSecret(input: { organizationId: string; endpointId: string }): Promise<{ secret: string; previousSecret: string | null; previousSecretExpiresAt: Date | null }> {
  const row = await getEndpointRow(input.organizationId, input.endpointId);
  const overlap = row.previousSecretExpiresAt && row.previousSecretExpiresAt > new Date();
  return { secret: row.secret, previousSecret: overlap ? row.previousSecret : null, previousSecretExpiresAt: overlap ? row.previousSecretExpiresAt : null };
}

/**
 * Issues a new secret. The old one keeps signing alongside it (two signatures per delivery) until
 * the overlap ends, so the receiver can switch without losing a delivery. A second rotation during
 * an overlap replaces the previous secret with the one being retired. Rotations of one endpoint
 * queue on its row lock, so each hands out exactly the secret it stored and retires the one the
 * rotation before it stored.
 */
export async function rotateEndpointSecret(input: { organizationId: string; endpointId: string; overlapMs?: number }): Promise<{ secret: string; previousSecretExpiresAt: Date }> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .select({ id: webhookEndpoints.id, secret: webhookEndpoints.secret })
      .from(webhookEndpoints)
      .where(and(eq(webhookEndpoints.id, input.endpointId), eq(webhookEndpoints.organizationId, input.organizationId)))
      .for("update");
    const current = assertFound(row, "The webhook endpoint");
    const now = new Date();
    const previousSecretExpiresAt = new Date(now.getTime() + (input.overlapMs ?? getWebhookConfig().rotationOverlapMs));
    const secret = createSigningSecret();
    const [stored] = await tx
      .update(webhookEndpoints)
      .set({ secret, previousSecret: current.secret, previousSecretExpiresAt, updatedAt: now })
      .where(eq(webhookEndpoints.id, current.id))
      .returning({ secret: webhookEndpoints.secret });
    if (stored?.secret !== secret) throw new Error(`webhook endpoint ${current.id}: the rotated secret was not stored`);
    return { secret, previousSecretExpiresAt };
  });
}

/** Sends webhook.test to this endpoint only (it is not fanned out to other subscribers). */
export async function sendTestEvent(input: { organizationId: string; endpointId: string }): Promise<{ eventId: string; deliveryId: string }> {
  const endpoint = await getEndpointRow(input.organizationId, input.endpointId);
  if (!endpoint.enabled) throw new DomainError("conflict", "Enable the endpoint before sending it a test event.");
  const eventId = createId("evt");
  const deliveryId = createId("whd");
  const now = new Date();
  await getDb().transaction(async (tx) => {
    await tx.insert(outboxEvents).values({ id: eventId, organizationId: input.organizationId, type: "webhook.test", payload: { endpointId: endpoint.id }, dispatchedAt: now });
    await tx.insert(webhookDeliveries).values({ id: deliveryId, organizationId: input.organizationId, eventId, endpointId: endpoint.id, eventType: "webhook.test", nextAttemptAt: now });
  });
  await enqueueDeliveries([{ deliveryId, attemptNumber: 1 }]);
  return { eventId, deliveryId };
}
