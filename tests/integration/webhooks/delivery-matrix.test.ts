// One delivery attempt against a loopback receiver per case: the status-code matrix, redirects,
// timeouts, the retry timing (Retry-After), idempotent re-runs, exhaustion and auto-disable with
// e-mail. attemptDelivery is called directly with its configuration injected, so nothing here is
// queued for the worker process.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { webhookAttempts, webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { attemptDelivery, type AttemptDeps } from "@/lib/server/webhooks/deliver";
import { MAX_ATTEMPTS_PER_ROUND } from "@/lib/server/webhooks/retry-schedule";
import { MAIL_UI_URL } from "@/tests/helpers/app";
import { waitForMail } from "@/tests/helpers/mail";

import { createTestOrganization, insertDelivery, insertEndpoint, startReceiver, verifyWith, type Reply } from "./support";

let org: Awaited<ReturnType<typeof createTestOrganization>>;
beforeAll(async () => {
  org = await createTestOrganization("matrix");
});
afterAll(async () => {
  await org.remove();
});

// random 0.5 sits in the middle of the +/-20 % jitter band, so delays equal the published base x scale.
function depsFor(port: number, extra: Partial<AttemptDeps> = {}): AttemptDeps {
  return { config: { allowlist: [`127.0.0.1:${port}`], retryScale: 0.001, timeoutMs: 500, disableAfterDeadDeliveries: 1 }, random: () => 0.5, ...extra };
}

async function setUp(reply: Reply) {
  const receiver = await startReceiver(reply);
  const endpoint = await insertEndpoint(org.organizationId, receiver.url);
  const { eventId, deliveryId } = await insertDelivery(org.organizationId, endpoint.id);
  return { receiver, endpoint, eventId, deliveryId };
}

async function readDelivery(deliveryId: string) {
  const [delivery] = await getDb().select().from(webhookDeliveries).where(eq(webhookDeliveries.id, deliveryId));
  const attempts = await getDb().select().from(webhookAttempts).where(eq(webhookAttempts.deliveryId, deliveryId)).orderBy(webhookAttempts.attemptNumber);
  return { delivery: delivery!, attempts };
}

describe("a delivery attempt", () => {
  it("succeeds on 2xx, signed so the independent verifier accepts it, with the event id as webhook-id", async () => {
    const { receiver, endpoint, eventId, deliveryId } = await setUp(() => ({ status: 204 }));
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(outcome).toEqual({ kind: "succeeded", statusCode: 204 });
    expect(receiver.received).toHaveLength(1);
    const request = receiver.received[0]!;
    expect(request.headers["webhook-id"]).toBe(eventId);
    expect(request.headers["content-type"]).toBe("application/json");
    expect(verifyWith(endpoint.secret, request)).toMatchObject({ type: "webhook.test", data: { endpointId: endpoint.id } });
    // The body carries ids, never the secret.
    expect(request.body).not.toContain(endpoint.secret.slice(6, 20));
    const { delivery, attempts } = await readDelivery(deliveryId);
    expect(delivery).toMatchObject({ status: "succeeded", attemptCount: 1, lastStatusCode: 204, nextAttemptAt: null });
    expect(attempts).toHaveLength(1);
    expect(attempts[0]).toMatchObject({ attemptNumber: 1, statusCode: 204, outcome: "succeeded", error: null });
    expect(attempts[0]!.latencyMs).toBeGreaterThanOrEqual(0);
    await receiver.close();
  });

  it("keeps only the first 2 KB of the receiver's answer", async () => {
    const { receiver, deliveryId } = await setUp(() => ({ status: 200, body: "é".repeat(3_000) }));
    await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    const { attempts } = await readDelivery(deliveryId);
    expect(Buffer.byteLength(attempts[0]!.responseBody ?? "", "utf8")).toBeLessThanOrEqual(2_048);
    expect(attempts[0]!.responseBody!.length).toBeGreaterThan(1_000);
    await receiver.close();
  });

  it("does not follow a redirect: 3xx is a failure to retry", async () => {
    const elsewhere = await startReceiver();
    const { receiver, deliveryId } = await setUp(() => ({ status: 307, headers: { location: elsewhere.url } }));
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port, { config: { allowlist: [`127.0.0.1:${receiver.port}`, `127.0.0.1:${elsewhere.port}`], retryScale: 0.001, timeoutMs: 500 } }));
    expect(outcome).toMatchObject({ kind: "retry", statusCode: 307, next: { attemptNumber: 2, delayMs: 5 } });
    expect(elsewhere.received).toHaveLength(0);
    expect((await readDelivery(deliveryId)).delivery.status).toBe("failed");
    await Promise.all([receiver.close(), elsewhere.close()]);
  });

  it.each([
    ["429 with Retry-After 2 s", 429, { "retry-after": "2" }, 2_000],
    ["503 with Retry-After 3 s", 503, { "retry-after": "3" }, 3_000],
    ["500 without Retry-After: the schedule's 5 s x 0.001", 500, {}, 5],
    ["400 (Retry-After only counts on 429 and 5xx)", 400, { "retry-after": "100" }, 5],
    ["404", 404, {}, 5],
  ])("retries after %s", async (_label, status, headers, expectedDelayMs) => {
    const { receiver, deliveryId } = await setUp(() => ({ status, headers }));
    const before = Date.now();
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(outcome).toMatchObject({ kind: "retry", statusCode: status, next: { attemptNumber: 2, delayMs: expectedDelayMs } });
    const { delivery } = await readDelivery(deliveryId);
    expect(delivery.status).toBe("failed");
    expect(delivery.nextAttemptAt!.getTime()).toBeGreaterThanOrEqual(before + expectedDelayMs);
    await receiver.close();
  });

  it("gives up on a receiver that does not answer within the timeout", async () => {
    const { receiver, deliveryId } = await setUp(() => ({ status: 200, delayMs: 3_000 }));
    const started = Date.now();
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(Date.now() - started).toBeLessThan(2_500);
    expect(outcome).toMatchObject({ kind: "retry", statusCode: null, error: "no answer within 500 ms" });
    expect((await readDelivery(deliveryId)).attempts[0]).toMatchObject({ statusCode: null, error: "no answer within 500 ms", outcome: "retry" });
    await receiver.close();
  });

  it("records a dropped connection and a refused one as failures", async () => {
    const { receiver, deliveryId } = await setUp(() => "drop");
    const dropped = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(dropped).toMatchObject({ kind: "retry", statusCode: null, error: expect.stringMatching(/reset|socket hang up/) });
    await receiver.close();
    const refused = await attemptDelivery({ deliveryId, attemptNumber: 2 }, depsFor(receiver.port));
    expect(refused).toMatchObject({ kind: "retry", error: "connection refused" });
  });

  it("410 Gone ends the delivery, disables the endpoint and e-mails integrators and admins only", async () => {
    const { receiver, endpoint, deliveryId } = await setUp(() => ({ status: 410 }));
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(outcome).toMatchObject({ kind: "dead", statusCode: 410, disabled: "gone" });
    const [row] = await getDb().select().from(webhookEndpoints).where(eq(webhookEndpoints.id, endpoint.id));
    expect(row).toMatchObject({ enabled: false, disabledReason: "gone" });
    const mail = await waitForMail(org.people.integrator.email, "Webhook endpoint disabled");
    expect(mail.text).toContain(receiver.url);
    expect(mail.text).toContain("410 Gone");
    await waitForMail(org.people.admin.email, "Webhook endpoint disabled");
    const viewerMail = (await (await fetch(new URL(`api/messages?to=${encodeURIComponent(org.people.viewer.email)}`, MAIL_UI_URL))).json()) as unknown[];
    expect(viewerMail).toEqual([]);
    await receiver.close();
  });

  it("sends nothing to a disabled endpoint and ends the delivery", async () => {
    const { receiver, endpoint, deliveryId } = await setUp(() => ({ status: 200 }));
    await getDb().update(webhookEndpoints).set({ enabled: false, disabledReason: "manual" }).where(eq(webhookEndpoints.id, endpoint.id));
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(outcome).toMatchObject({ kind: "dead", error: "endpoint disabled" });
    expect(receiver.received).toHaveLength(0);
    await receiver.close();
  });
});

describe("event bodies", () => {
  it("sends member.dispositioned as the review flow wrote it", async () => {
    const receiver = await startReceiver();
    const endpoint = await insertEndpoint(org.organizationId, receiver.url);
    const payload = {
      dispositionId: "dsp_1",
      scheduleId: "sch_review1",
      reference: null,
      mark: "B-07",
      disposition: "accepted_with_justification",
      by: "Tomasz Achebe",
      note: "Checked against site survey.",
      decidedAt: "2026-12-02T07:00:00.000Z",
      bulkId: null,
    };
    const { deliveryId } = await insertDelivery(org.organizationId, endpoint.id, "member.dispositioned", payload);
    expect((await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port))).kind).toBe("succeeded");
    expect(verifyWith(endpoint.secret, receiver.received[0]!)).toEqual({ type: "member.dispositioned", timestamp: expect.any(String), data: { ...payload, memberUrl: expect.stringMatching(/\/api\/v1\/schedules\/sch_review1\/members\/B-07$/) } });
    await receiver.close();
  });

  it("treats an event whose body cannot be built as a failed attempt, sending nothing", async () => {
    const receiver = await startReceiver();
    const endpoint = await insertEndpoint(org.organizationId, receiver.url);
    const { deliveryId } = await insertDelivery(org.organizationId, endpoint.id, "member.dispositioned", { scheduleId: "sch_x", mark: "" });
    const outcome = await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(outcome).toMatchObject({ kind: "retry", statusCode: null, error: expect.stringContaining("payload is malformed (dispositionId, mark, disposition, by, decidedAt)") });
    expect(receiver.received).toHaveLength(0);
    await receiver.close();
  });
});

describe("retries", () => {
  it("keep the same webhook-id with a fresh timestamp, every one verifying, until success", async () => {
    const { receiver, endpoint, eventId, deliveryId } = await setUp((_req, index) => (index < 2 ? { status: 500 } : { status: 200 }));
    const t0 = Date.now();
    const deps = (offsetS: number) => depsFor(receiver.port, { now: () => new Date(t0 + offsetS * 1000) });
    expect((await attemptDelivery({ deliveryId, attemptNumber: 1 }, deps(0))).kind).toBe("retry");
    expect((await attemptDelivery({ deliveryId, attemptNumber: 2 }, deps(7))).kind).toBe("retry");
    expect((await attemptDelivery({ deliveryId, attemptNumber: 3 }, deps(45))).kind).toBe("succeeded");
    expect(receiver.received.map((r) => r.headers["webhook-id"])).toEqual([eventId, eventId, eventId]);
    const stamps = receiver.received.map((r) => Number(r.headers["webhook-timestamp"]));
    expect(stamps[1]! - stamps[0]!).toBe(7);
    expect(stamps[2]! - stamps[0]!).toBe(45);
    // Each verifies on its own (the verifier's +/-5 minute window holds for all three).
    for (const request of receiver.received) expect(verifyWith(endpoint.secret, request)).toBeTruthy();
    // The body is the same every time; only the signed timestamp changes.
    expect(new Set(receiver.received.map((r) => r.body)).size).toBe(1);
    await receiver.close();
  });

  it("are idempotent: a repeated or stale job records nothing and sends nothing", async () => {
    const { receiver, deliveryId } = await setUp(() => ({ status: 500 }));
    await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port));
    expect(await attemptDelivery({ deliveryId, attemptNumber: 1 }, depsFor(receiver.port))).toEqual({ kind: "skipped", reason: "stale attempt" });
    expect(await attemptDelivery({ deliveryId, attemptNumber: 5 }, depsFor(receiver.port))).toEqual({ kind: "skipped", reason: "stale attempt" });
    expect(receiver.received).toHaveLength(1);
    expect((await readDelivery(deliveryId)).attempts).toHaveLength(1);
    await receiver.close();
  });

  it("end after the whole published schedule, disabling the endpoint and e-mailing about it", async () => {
    const { receiver, endpoint, deliveryId } = await setUp(() => ({ status: 502 }));
    const outcomes = [];
    for (let n = 1; n <= MAX_ATTEMPTS_PER_ROUND; n += 1) outcomes.push(await attemptDelivery({ deliveryId, attemptNumber: n }, depsFor(receiver.port)));
    // Delays after attempts 1..8: 5 s, 30 s, 2 min, 10 min, 30 min, 1 h, 3 h, 6 h, scaled by 0.001.
    expect(outcomes.slice(0, -1).map((o) => (o.kind === "retry" ? o.next.delayMs : null))).toEqual([5, 30, 120, 600, 1_800, 3_600, 10_800, 21_600]);
    expect(outcomes.at(-1)).toMatchObject({ kind: "dead", statusCode: 502, disabled: "failing" });
    expect(await attemptDelivery({ deliveryId, attemptNumber: MAX_ATTEMPTS_PER_ROUND + 1 }, depsFor(receiver.port))).toMatchObject({ kind: "skipped" });
    const { delivery, attempts } = await readDelivery(deliveryId);
    expect(delivery).toMatchObject({ status: "dead", attemptCount: 9, nextAttemptAt: null });
    expect(attempts.map((a) => a.outcome)).toEqual([...Array(8).fill("retry"), "dead"]);
    const [row] = await getDb().select().from(webhookEndpoints).where(eq(webhookEndpoints.id, endpoint.id));
    expect(row).toMatchObject({ enabled: false, disabledReason: "failing" });
    const mail = await waitForMail(org.people.integrator.email, "Webhook endpoint disabled");
    expect(mail.text).toContain("Every attempt of the published retry schedule failed");
    await receiver.close();
  });
});
