// RELIABILITY figure 5: a partner's webhook receiver is down while a schedule completes (its first
// attempts are dropped without an answer or refused with 503), then comes back. The receiver, a
// loopback server of this drill on the partner port, verifies every delivery with the independent
// `standardwebhooks` verifier. Expect exactly one processed event, the same webhook-id on every
// attempt, every attempt verified, and PostgreSQL holding one event, one delivery and one attempt
// row per try. Retry delays are scaled (WEBHOOK_RETRY_SCALE) so the drill takes seconds, not hours.
import { createServer, type Server } from "node:http";

import { Webhook } from "standardwebhooks";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { createId } from "@/lib/server/ids";
import { createSigningSecret } from "@/lib/server/webhooks/sign";
import { createDrill, drillPorts, submitDrillSchedule, waitForFinalState } from "@/tests/helpers/drill";
import { waitFor } from "@/tests/helpers/local-scripts";
import { closeQueues } from "@/workers/queues";

const drill = createDrill("hook");
const MEMBERS = 20;
/** Attempts the receiver fails before it is back: dropped, 503, dropped. */
const DOWN_ATTEMPTS = 3;
/** 5 s, 30 s, 120 s between the first tries become about 50 ms, 300 ms and 1.2 s. */
const RETRY_SCALE = "0.01";
/** The schedule's completion to the one processed delivery (stated in README). */
const DELIVERED_WITHIN_MS = 30_000;
/** After the success, this long without any further delivery (the reconciler runs every second). */
const QUIET_MS = 3_000;

interface Arrival {
  atMs: number;
  webhookId: string;
  verified: boolean;
  verifyError: string | null;
  answer: number | "dropped";
  processed: boolean;
  type: string | null;
}

const secret = createSigningSecret();
const arrivals: Arrival[] = [];
const processedIds = new Set<string>();
let server: Server;

/** The partner: verifies first, then answers as its state says (down for the first attempts). */
function startPartner(): Promise<void> {
  server = createServer((req, res) => {
    let body = "";
    req.on("data", (c: Buffer) => (body += c.toString("utf8")));
    req.on("end", () => {
      const headers = { "webhook-id": String(req.headers["webhook-id"] ?? ""), "webhook-timestamp": String(req.headers["webhook-timestamp"] ?? ""), "webhook-signature": String(req.headers["webhook-signature"] ?? "") };
      let verified = false;
      let verifyError: string | null = null;
      let type: string | null = null;
      try {
        type = (new Webhook(secret).verify(body, headers) as { type?: string }).type ?? null;
        verified = true;
      } catch (e) {
        verifyError = (e as Error).message;
      }
      const arrival: Arrival = { atMs: Date.now(), webhookId: headers["webhook-id"], verified, verifyError, answer: "dropped", processed: false, type };
      arrivals.push(arrival);
      const index = arrivals.length - 1;
      if (index < DOWN_ATTEMPTS) {
        if (index % 2 === 0) {
          // Down: the connection goes away without an answer.
          req.socket.destroy();
          return;
        }
        arrival.answer = 503;
        res.writeHead(503, { "content-type": "text/plain" }).end("receiver down (drill)");
        return;
      }
      if (!verified) {
        arrival.answer = 401;
        res.writeHead(401).end();
        return;
      }
      arrival.processed = !processedIds.has(arrival.webhookId);
      processedIds.add(arrival.webhookId);
      arrival.answer = 200;
      res.writeHead(200).end(arrival.processed ? "processed" : "duplicate");
    });
  });
  return new Promise((resolve) => server.listen(drillPorts.partner, "127.0.0.1", resolve));
}

async function createOrganizationWithEndpoint() {
  const organizationId = createId("org");
  const endpointId = createId("wh");
  const sql = getSql();
  await sql`insert into organizations (id, name, kind) values (${organizationId}, ${`Webhook drill ${drill.prefix}`}, 'fabricator')`;
  await sql`insert into webhook_endpoints (id, organization_id, url, event_types, secret)
    values (${endpointId}, ${organizationId}, ${`http://127.0.0.1:${drillPorts.partner}/hooks/drill`}, ${JSON.stringify(["schedule.completed"])}::jsonb, ${secret})`;
  return { organizationId, endpointId };
}

beforeAll(async () => {
  await startPartner();
  drill.startWorker({
    ENGINE_WARM_UP: "0",
    WEBHOOK_ALLOWLIST: `127.0.0.1:${drillPorts.partner}`,
    WEBHOOK_RETRY_SCALE: RETRY_SCALE,
    WEBHOOK_TIMEOUT_MS: "3000",
    DELIVERY_RECONCILE_EVERY_MS: "1000",
  });
});

afterAll(async () => {
  drill.killAll();
  await closeQueues();
  server.closeAllConnections();
  await new Promise((r) => server.close(r));
});

describe("a webhook receiver down while a schedule completes, then back", () => {
  it("gets exactly one processed event, the same webhook-id on every attempt, every one verified", { timeout: 300_000 }, async () => {
    const { organizationId, endpointId } = await createOrganizationWithEndpoint();
    const downSinceMs = Date.now();
    const id = await submitDrillSchedule(drill, { markPrefix: "WH", memberCount: MEMBERS, label: "Webhook drill", organizationId });
    const final = await waitForFinalState(id, 120_000);
    expect(final.status).toBe("completed");

    const sql = getSql();
    const delivered = await waitFor(
      "the delivery to succeed",
      async () => {
        const [row] = await sql`select d.id, d.status, d.attempt_count from webhook_deliveries d join outbox_events e on e.id = d.event_id
          where d.endpoint_id = ${endpointId} and e.payload->>'scheduleId' = ${id}`;
        return row?.status === "succeeded" ? row : undefined;
      },
      DELIVERED_WITHIN_MS + 30_000,
    );
    await new Promise((r) => setTimeout(r, QUIET_MS));
    const deliveredMs = Math.round(arrivals.at(-1)!.atMs - final.completedAtMs);
    console.log(`[webhook-receiver] ${arrivals.length} attempts (${arrivals.map((a) => a.answer).join(", ")}); processed ${deliveredMs} ms after the schedule completed`);

    // The fault hit: the schedule completed while the receiver was down, and its first attempts failed there.
    expect(final.completedAtMs).toBeGreaterThan(downSinceMs);
    expect(arrivals.slice(0, DOWN_ATTEMPTS).map((a) => a.answer)).toEqual(["dropped", 503, "dropped"]);
    expect(arrivals.every((a) => a.atMs >= final.completedAtMs - 1000)).toBe(true);
    // Back: one processed event, the same webhook-id on every attempt, every attempt verified.
    expect(arrivals).toHaveLength(DOWN_ATTEMPTS + 1);
    expect(arrivals.at(-1)).toMatchObject({ answer: 200, processed: true, type: "schedule.completed" });
    expect([...processedIds]).toHaveLength(1);
    expect(new Set(arrivals.map((a) => a.webhookId))).toEqual(processedIds);
    expect(arrivals.filter((a) => !a.verified)).toEqual([]);
    expect(deliveredMs).toBeLessThanOrEqual(DELIVERED_WITHIN_MS);

    // PostgreSQL: one event for the schedule, one delivery of it, one attempt row per try.
    const events = await sql`select id from outbox_events where type = 'schedule.completed' and payload->>'scheduleId' = ${id}`;
    expect(events.map((e) => e.id)).toEqual([...processedIds]);
    const deliveries = await sql`select id from webhook_deliveries where event_id = ${events[0]!.id as string}`;
    expect(deliveries.map((d) => d.id)).toEqual([delivered.id]);
    expect(delivered.attempt_count).toBe(DOWN_ATTEMPTS + 1);
    const attempts = await sql`select attempt_number, outcome from webhook_attempts where delivery_id = ${delivered.id as string} order by attempt_number`;
    expect(attempts.map((a) => [a.attempt_number, a.outcome])).toEqual([
      [1, "retry"],
      [2, "retry"],
      [3, "retry"],
      [4, "succeeded"],
    ]);
  });
});
