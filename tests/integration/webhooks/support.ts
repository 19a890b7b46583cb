// Shared set-up for the webhook tests: a throwaway organization per file, loopback receivers that
// verify with the independent `standardwebhooks` package, and the fake partner's control API.
import { createServer, type IncomingHttpHeaders, type Server } from "node:http";
import type { AddressInfo } from "node:net";

import { eq } from "drizzle-orm";
import { Webhook } from "standardwebhooks";

import { getDb } from "@/db/client";
import { memberships, organizations, outboxEvents, users, webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { hashPassword } from "@/lib/server/auth/passwords";
import { createId } from "@/lib/server/ids";
import { createSigningSecret } from "@/lib/server/webhooks/sign";

export const PARTNER_URL = `http://127.0.0.1:${process.env.PARTNER_PORT ?? 3795}`;

/** A fresh organization with one integrator and one admin, so mail and data are this file's own. */
export async function createTestOrganization(label: string) {
  const organizationId = createId("org");
  await getDb().insert(organizations).values({ id: organizationId, name: `Webhook test ${label} ${organizationId.slice(-4)}`, kind: "fabricator" });
  const people: Record<"integrator" | "admin" | "viewer", { id: string; email: string; password: string }> = {} as never;
  for (const role of ["integrator", "admin", "viewer"] as const) {
    const id = createId("usr");
    const email = `${role}-${id}@test.example`;
    const password = `pw-${id}-long-enough`;
    await getDb().insert(users).values({ id, email, name: `Test ${role}`, passwordHash: await hashPassword(password) });
    await getDb().insert(memberships).values({ id: createId("mem"), userId: id, organizationId, role });
    people[role] = { id, email, password };
  }
  return { organizationId, people, remove: () => getDb().delete(organizations).where(eq(organizations.id, organizationId)) };
}

/** An endpoint row written directly (tests of the delivery machinery, not of registration). */
export async function insertEndpoint(organizationId: string, url: string, eventTypes: string[] = ["schedule.completed", "schedule.failed", "member.dispositioned"]) {
  const [row] = await getDb().insert(webhookEndpoints).values({ id: createId("wh"), organizationId, url, eventTypes, secret: createSigningSecret() }).returning();
  return row!;
}

/** An already-dispatched event with one delivery to this endpoint, for attemptDelivery to work on. */
export async function insertDelivery(organizationId: string, endpointId: string, type = "webhook.test", payload: unknown = { endpointId }) {
  const eventId = createId("evt");
  const deliveryId = createId("whd");
  await getDb().insert(outboxEvents).values({ id: eventId, organizationId, type, payload, dispatchedAt: new Date() });
  await getDb().insert(webhookDeliveries).values({ id: deliveryId, organizationId, eventId, endpointId, eventType: type, nextAttemptAt: new Date() });
  return { eventId, deliveryId };
}

/** An undispatched outbox event, as the schedule pipeline writes it. */
export async function insertOutboxEvent(organizationId: string, type: string, payload: unknown) {
  const id = createId("evt");
  await getDb().insert(outboxEvents).values({ id, organizationId, type, payload });
  return id;
}

export interface ReceivedRequest {
  headers: IncomingHttpHeaders;
  body: string;
  path: string;
}

export type Reply = (req: ReceivedRequest, index: number) => { status: number; headers?: Record<string, string>; body?: string; delayMs?: number } | "drop";

/** A receiver on a loopback port that records every request and answers as told. */
export async function startReceiver(reply: Reply = () => ({ status: 200 })) {
  const received: ReceivedRequest[] = [];
  const server: Server = createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      const record = { headers: req.headers, body, path: req.url ?? "" };
      received.push(record);
      const answer = reply(record, received.length - 1);
      if (answer === "drop") {
        req.socket.destroy();
        return;
      }
      const send = () => res.writeHead(answer.status, answer.headers ?? {}).end(answer.body ?? "");
      if (answer.delayMs) setTimeout(send, answer.delayMs);
      else send();
    });
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const port = (server.address() as AddressInfo).port;
  return {
    port,
    url: `http://127.0.0.1:${port}/hook`,
    received,
    close: () =>
      new Promise<void>((r) => {
        server.closeAllConnections();
        server.close(() => r());
      }),
  };
}

export function verifyWith(secret: string, request: ReceivedRequest): unknown {
  return new Webhook(secret).verify(request.body, {
    "webhook-id": String(request.headers["webhook-id"]),
    "webhook-timestamp": String(request.headers["webhook-timestamp"]),
    "webhook-signature": String(request.headers["webhook-signature"]),
  });
}

export interface PartnerDelivery {
  webhookId: string;
  webhookTimestamp: string;
  webhookSignature: string;
  body: string;
  verified: boolean;
  verifyError: string | null;
  answeredStatus: number | null;
  processed: boolean;
  /** What the fake partner fetched from the event's signed download links (schedule.completed only). */
  downloads: { format: string; status: number | null; contentType: string | null; lines: number; firstLine: string; error: string | null }[];
}

export async function configurePartner(receiver: string, config: { secrets?: string[]; mode?: string; retryAfterSeconds?: number; slowMs?: number }) {
  const response = await fetch(`${PARTNER_URL}/receivers/${receiver}`, { method: "PUT", body: JSON.stringify(config) });
  if (!response.ok) throw new Error(`partner fake: ${response.status}`);
}

export async function readPartner(receiver: string): Promise<{ deliveries: PartnerDelivery[]; processed: string[] }> {
  const response = await fetch(`${PARTNER_URL}/receivers/${receiver}`);
  return (await response.json()) as { deliveries: PartnerDelivery[]; processed: string[] };
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}
