// The whole path on the running worker: an outbox event (inserted directly, as the schedule
// pipeline writes it) is dispatched, signed, delivered to the fake partner (which verifies with the
// independent `standardwebhooks` package), retried while the partner is down, and processed once.
import { and, eq } from "drizzle-orm";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { memberOutcomes, outboxEvents, schedules, webhookAttempts, webhookDeliveries, webhookEndpoints } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { createId } from "@/lib/server/ids";
import { createResultDownloadToken } from "@/lib/server/schedules/result-download-link";
import { dispatchOutbox, reconcileDeliveries } from "@/lib/server/webhooks/dispatch-outbox";
import { setEndpointEnabled } from "@/lib/server/webhooks/endpoints";
import { resendDelivery, resendFailedSince } from "@/lib/server/webhooks/resend";
import { createTestKey } from "@/tests/helpers/api-keys";
import { APP_URL } from "@/tests/helpers/app";
import { waitForMail } from "@/tests/helpers/mail";
import { compileApiSchema } from "@/tests/helpers/schemas";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";
import { closeQueues } from "@/workers/queues";

import { configurePartner, createTestOrganization, insertEndpoint, insertOutboxEvent, PARTNER_URL, readPartner, waitFor } from "./support";

let org: Awaited<ReturnType<typeof createTestOrganization>>;
let other: Awaited<ReturnType<typeof createTestOrganization>>;
beforeAll(async () => {
  org = await createTestOrganization("outbox");
  other = await createTestOrganization("outbox-other");
});
afterAll(async () => {
  await closeQueues();
  await org.remove();
  await other.remove();
});

const unique = () => `r${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/** An endpoint of `organizationId` at a fresh fake-partner receiver that knows its secret. */
async function partnerEndpoint(organizationId: string, eventTypes?: string[], mode = "ok") {
  const receiver = unique();
  const endpoint = await insertEndpoint(organizationId, `${PARTNER_URL}/hooks/${receiver}`, eventTypes);
  await configurePartner(receiver, { secrets: [endpoint.secret], mode });
  return { receiver, endpoint };
}

async function deliveriesOf(eventId: string) {
  return getDb().select().from(webhookDeliveries).where(eq(webhookDeliveries.eventId, eventId));
}

async function insertSchedule(organizationId: string, values: Partial<typeof schedules.$inferInsert> = {}) {
  const id = createId("sch");
  await getDb()
    .insert(schedules)
    .values({ id, organizationId, name: "Lumenbrook Depot hall B roof", reference: "HM-C-R", source: "api-json", profile: {}, header: {}, memberCount: 2, chunkCount: 1, status: "completed", ...values });
  return id;
}

describe("dispatch", () => {
  it("creates one delivery per enabled, subscribed endpoint, once, with several dispatchers racing", async () => {
    const subscribed = await partnerEndpoint(org.organizationId, ["schedule.failed"]);
    const unsubscribed = await partnerEndpoint(org.organizationId, ["schedule.completed"]);
    const disabled = await partnerEndpoint(org.organizationId, ["schedule.failed"]);
    await getDb().update(webhookEndpoints).set({ enabled: false, disabledReason: "manual" }).where(eq(webhookEndpoints.id, disabled.endpoint.id));
    const otherOrg = await partnerEndpoint(other.organizationId, ["schedule.failed"]);

    const eventId = await insertOutboxEvent(org.organizationId, "schedule.failed", { scheduleId: "sch_missing", status: "failed", reason: "The schedule has no members." });
    // The worker's periodic dispatcher runs too; SKIP LOCKED and the unique pair keep this to one each.
    await Promise.all(Array.from({ length: 5 }, () => dispatchOutbox()));
    const [event] = await waitFor("dispatch", async () => {
      const rows = await getDb().select().from(outboxEvents).where(eq(outboxEvents.id, eventId));
      return rows[0]?.dispatchedAt ? rows : null;
    });
    expect(event!.dispatchedAt).toBeInstanceOf(Date);
    const deliveries = await deliveriesOf(eventId);
    expect(deliveries.map((d) => d.endpointId)).toEqual([subscribed.endpoint.id]);

    const received = await waitFor("the partner to process it", async () => {
      const state = await readPartner(subscribed.receiver);
      return state.processed.length > 0 ? state : null;
    });
    expect(received.processed).toEqual([eventId]);
    expect(received.deliveries.every((d) => d.verified)).toBe(true);
    expect(JSON.parse(received.deliveries[0]!.body)).toMatchObject({ type: "schedule.failed", data: { status: "failed", failureReason: "The schedule has no members." } });
    for (const receiver of [unsubscribed.receiver, disabled.receiver, otherOrg.receiver]) expect((await readPartner(receiver)).deliveries).toEqual([]);
  });

  it("adds the schedule's callback endpoint, but never another organization's", async () => {
    const callback = await partnerEndpoint(org.organizationId, ["member.dispositioned"]);
    const foreign = await partnerEndpoint(other.organizationId, ["member.dispositioned"]);
    const own = await insertSchedule(org.organizationId, { callbackEndpointId: callback.endpoint.id, status: "failed", failureReason: "No members" });
    const stolen = await insertSchedule(org.organizationId, { callbackEndpointId: foreign.endpoint.id, status: "failed", failureReason: "No members" });
    const ownEvent = await insertOutboxEvent(org.organizationId, "schedule.failed", { scheduleId: own, status: "failed", reason: "No members" });
    const stolenEvent = await insertOutboxEvent(org.organizationId, "schedule.failed", { scheduleId: stolen, status: "failed", reason: "No members" });
    await dispatchOutbox();
    await waitFor("dispatch", async () => (await getDb().select().from(outboxEvents).where(eq(outboxEvents.id, stolenEvent)))[0]?.dispatchedAt);
    expect((await deliveriesOf(ownEvent)).map((d) => d.endpointId)).toContain(callback.endpoint.id);
    expect((await deliveriesOf(stolenEvent)).map((d) => d.endpointId)).not.toContain(foreign.endpoint.id);
    await waitFor("the callback delivery", async () => (await readPartner(callback.receiver)).processed.includes(ownEvent));
    expect((await readPartner(foreign.receiver)).deliveries).toEqual([]);
  });

  it("sends schedule.completed with failing rows first, conforming to its JSON Schema", async () => {
    const { receiver } = await partnerEndpoint(org.organizationId, ["schedule.completed"]);
    const scheduleId = await insertSchedule(org.organizationId, { memberCount: 2, checkedCount: 2, passCount: 1, failCount: 1, completedAt: new Date() });
    await getDb()
      .insert(memberOutcomes)
      .values([
        { scheduleId, memberIndex: 1, mark: "R-02", category: "roof_beam", pass: false, governingCheck: "frequency", utilization: 1.2, factorOfSafety: 0.83, detail: {} },
        { scheduleId, memberIndex: 0, mark: "R-01", category: "roof_beam", pass: true, governingCheck: "live, span 1", utilization: 0.64, factorOfSafety: 1.56, limitRatio: 240, achievedRatio: 375, detail: {} },
      ]);
    const eventId = await insertOutboxEvent(org.organizationId, "schedule.completed", { scheduleId, status: "completed" });
    const state = await waitFor("delivery", async () => {
      const s = await readPartner(receiver);
      return s.processed.includes(eventId) ? s : null;
    });
    const body = JSON.parse(state.deliveries.find((d) => d.webhookId === eventId)!.body);
    const validate = compileApiSchema("events/schedule.completed", { strict: true, allowUnionTypes: true });
    expect(validate(body), JSON.stringify(validate.errors)).toBe(true);
    expect(body.data.rows).toEqual([
      // a member that fails on frequency alone: the frequency governs and has no deflection figures
      { mark: "R-02", status: "fail", governingCheck: "frequency", utilization: 1.2, factorOfSafety: 0.83, limitRatio: null, achievedRatio: null },
      { mark: "R-01", status: "pass", governingCheck: "live, span 1", utilization: 0.64, factorOfSafety: 1.56, limitRatio: 240, achievedRatio: 375 },
    ]);
    expect(body.data).toMatchObject({ scheduleId, counts: { members: 2, pass: 1, fail: 1 }, truncated: false, resultsUrl: expect.stringContaining(`/api/v1/schedules/${scheduleId}/results`) });
  });
});

describe("a schedule submitted through the API", () => {
  it("ends in a verified schedule.completed at the partner, matching the results the API serves", async () => {
    const { receiver } = await partnerEndpoint(org.organizationId, ["schedule.completed"]);
    const key = await createTestKey(["schedules:write", "results:read"], org.organizationId);
    // Same beams as tests/integration/api/v1/schedules.test.ts: 4 m passes span/360, 9 m does not
    // (5wL^4/(384EI), AISC Manual Table 3-23 case 1, from memory).
    const submitted = await request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc([createBeam("W-01", 4), createBeam("W-02", 9)], "Webhook drill, Fenwick Quay"));
    expect(submitted.status).toBe(202);
    const scheduleId = submitted.body.id as string;
    await waitForSchedule(key, scheduleId);
    const state = await waitFor("schedule.completed at the partner", async () => {
      const s = await readPartner(receiver);
      return s.processed.length ? s : null;
    });
    const delivery = state.deliveries.find((d) => d.processed)!;
    expect(delivery.verified).toBe(true);
    const body = JSON.parse(delivery.body);
    expect(body).toMatchObject({ type: "schedule.completed", data: { scheduleId, name: "Webhook drill, Fenwick Quay", counts: { members: 2, pass: 1, fail: 1, error: 0 }, truncated: false } });
    // the failing member first, then the passing one
    expect(body.data.rows.map((r: { mark: string; status: string; governingCheck: string }) => [r.mark, r.status, r.governingCheck])).toEqual([
      ["W-02", "fail", "live, span 1"],
      ["W-01", "pass", "live, span 1"],
    ]);

    // The partner followed both signed links without an API key.
    const downloads = await waitFor("the partner's downloads", async () => {
      const s = await readPartner(receiver);
      const d = s.deliveries.find((x) => x.processed)?.downloads ?? [];
      return d.length === 2 ? d : null;
    });
    expect(downloads.map(({ format, status, lines }) => ({ format, status, lines }))).toEqual([
      // the header, the two rows and the safety caution line
      { format: "csv", status: 200, lines: 4 },
      { format: "ndjson", status: 200, lines: 2 },
    ]);
    expect(downloads[0]!.firstLine).toBe("mark,category,status,governing_check,utilization,factor_of_safety,limit_ratio,achieved_ratio,notes,deflection_mm,allowed_deflection_mm,section,material,quantity,spans_mm,review_state");
    expect(downloads[1]!.contentType).toMatch(/^application\/x-ndjson/);
    expect(JSON.parse(downloads[1]!.firstLine)).toMatchObject({ mark: "W-01", status: "pass" });

    // The same table the API serves with a key.
    const csvLink = new URL(body.data.download.csv as string);
    const viaLink = await request(APP_URL).get(csvLink.pathname);
    const viaKey = await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/results?format=csv`).set("authorization", `Bearer ${key}`);
    expect(viaLink.status).toBe(200);
    expect(viaLink.text).toBe(viaKey.text);

    // Tampered, foreign and expired links are refused with a problem, never a 500.
    const token = csvLink.pathname.split("/").pop()!;
    const [payload, signature] = token.split(".") as [string, string];
    const asNdjson = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(payload, "base64url").toString()), f: "ndjson" })).toString("base64url");
    for (const bad of [`${asNdjson}.${signature}`, `${payload}.${signature.slice(0, -2)}`, "not-a-token", createResultDownloadToken({ organizationId: other.organizationId, scheduleId, format: "csv", expiresAt: 4_000_000_000 }, `${getEnv().NEXTAUTH_SECRET}-other`)]) {
      const refused = await request(APP_URL).get(`/api/v1/result-downloads/${bad}`);
      expect(refused.status, bad).toBe(403);
      expect(refused.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(refused.body).toMatchObject({ type: "https://sagline.dev/problems/download-link-invalid", status: 403 });
      expect(JSON.stringify(refused.body)).not.toContain(bad.slice(0, 20));
    }
    const expired = createResultDownloadToken({ organizationId: org.organizationId, scheduleId, format: "csv", expiresAt: Math.floor(Date.now() / 1000) - 1 }, getEnv().NEXTAUTH_SECRET);
    const gone = await request(APP_URL).get(`/api/v1/result-downloads/${expired}`);
    expect(gone.status).toBe(410);
    expect(gone.body).toMatchObject({ type: "https://sagline.dev/problems/download-link-expired", status: 410 });
    // A genuine link for a schedule of the wrong organization finds nothing.
    const crossed = createResultDownloadToken({ organizationId: other.organizationId, scheduleId, format: "csv", expiresAt: 4_000_000_000 }, getEnv().NEXTAUTH_SECRET);
    expect((await request(APP_URL).get(`/api/v1/result-downloads/${crossed}`)).status).toBe(404);
  });
});

describe("the delivery reconciler", () => {
  it("re-queues an overdue delivery whose job Redis lost, from PostgreSQL", async () => {
    const { receiver, endpoint } = await partnerEndpoint(org.organizationId, ["schedule.failed"]);
    // A delivery with no job behind it, overdue by two minutes (as after a Redis flush).
    const eventId = createId("evt");
    const deliveryId = createId("whd");
    await getDb().insert(outboxEvents).values({ id: eventId, organizationId: org.organizationId, type: "schedule.failed", payload: { scheduleId: "sch_lost", reason: "Lost job drill" }, dispatchedAt: new Date() });
    await getDb().insert(webhookDeliveries).values({ id: deliveryId, organizationId: org.organizationId, eventId, endpointId: endpoint.id, eventType: "schedule.failed", nextAttemptAt: new Date(Date.now() - 120_000) });
    expect(await reconcileDeliveries()).toBeGreaterThanOrEqual(1);
    await waitFor("the reconciled delivery", async () => (await readPartner(receiver)).processed.includes(eventId));
    const [row] = await getDb().select().from(webhookDeliveries).where(eq(webhookDeliveries.id, deliveryId));
    expect(row).toMatchObject({ status: "succeeded", attemptCount: 1 });
  });
});

describe("a receiver that is down for a while, then back", () => {
  it("ends with exactly one processed event under the same webhook-id, every delivery verifying", async () => {
    const { receiver, endpoint } = await partnerEndpoint(org.organizationId, ["schedule.failed"], "down");
    const eventId = await insertOutboxEvent(org.organizationId, "schedule.failed", { scheduleId: "sch_down", status: "failed", reason: "Receiver drill" });
    // Other endpoints of this organization subscribed to schedule.failed get their own deliveries.
    const delivery = await waitFor("the delivery", async () => (await deliveriesOf(eventId)).find((d) => d.endpointId === endpoint.id));
    await waitFor(
      "three failed attempts",
      async () => (await getDb().select().from(webhookAttempts).where(eq(webhookAttempts.deliveryId, delivery.id))).length >= 3,
      15_000,
    );
    await configurePartner(receiver, { mode: "ok" });
    const done = await waitFor("success", async () => {
      const [row] = await getDb().select().from(webhookDeliveries).where(eq(webhookDeliveries.id, delivery.id));
      return row?.status === "succeeded" ? row : null;
    });
    expect(done.attemptCount).toBeGreaterThanOrEqual(4);
    const state = await readPartner(receiver);
    expect(state.processed).toEqual([eventId]);
    expect(state.deliveries.length).toBeGreaterThanOrEqual(4);
    expect(new Set(state.deliveries.map((d) => d.webhookId))).toEqual(new Set([eventId]));
    expect(state.deliveries.every((d) => d.verified)).toBe(true);
    expect(state.deliveries.filter((d) => d.processed)).toHaveLength(1);

    // A resend from the console reaches the partner again with the same webhook-id; it stays processed once.
    await resendDelivery({ organizationId: org.organizationId, deliveryId: delivery.id });
    const again = await waitFor("the resend", async () => {
      const s = await readPartner(receiver);
      return s.deliveries.length > state.deliveries.length ? s : null;
    });
    expect(again.deliveries.at(-1)).toMatchObject({ webhookId: eventId, verified: true, processed: false, answeredStatus: 200 });
    expect(again.processed).toEqual([eventId]);
    const [endpointRow] = await getDb().select().from(webhookEndpoints).where(eq(webhookEndpoints.id, endpoint.id));
    expect(endpointRow).toMatchObject({ enabled: true, consecutiveFailedDeliveries: 0 });
  });
});

describe("sustained failure on the worker", () => {
  it("disables the endpoint after the whole retry schedule and e-mails the integrators", async () => {
    const { receiver, endpoint } = await partnerEndpoint(org.organizationId, ["schedule.failed"], "500");
    const eventId = await insertOutboxEvent(org.organizationId, "schedule.failed", { scheduleId: "sch_fail", status: "failed", reason: "Failure drill" });
    // npm test scales the schedule by 0.0002: about 8 s for all nine attempts.
    const row = await waitFor(
      "the endpoint to be disabled",
      async () => {
        const [r] = await getDb().select().from(webhookEndpoints).where(and(eq(webhookEndpoints.id, endpoint.id), eq(webhookEndpoints.enabled, false)));
        return r;
      },
      40_000,
    );
    expect(row.disabledReason).toBe("failing");
    const delivery = (await deliveriesOf(eventId)).find((d) => d.endpointId === endpoint.id);
    expect(delivery).toMatchObject({ status: "dead", attemptCount: 9, lastStatusCode: 500 });
    expect((await readPartner(receiver)).deliveries).toHaveLength(9);
    const mail = await waitForMail(org.people.integrator.email, "Webhook endpoint disabled");
    expect(mail.text).toContain(`${PARTNER_URL}/hooks/${receiver}`);
    expect(mail.text).toContain("HTTP 500");

    // The partner fixes its receiver; the integrator enables the endpoint and resends what failed.
    await configurePartner(receiver, { mode: "ok" });
    await setEndpointEnabled({ organizationId: org.organizationId, endpointId: endpoint.id, enabled: true });
    const resent = await resendFailedSince({ organizationId: org.organizationId, since: new Date(Date.now() - 5 * 60_000), endpointId: endpoint.id });
    expect(resent).toBe(1);
    const state = await waitFor("the resent delivery", async () => {
      const s = await readPartner(receiver);
      return s.processed.includes(eventId) ? s : null;
    });
    expect(state.processed).toEqual([eventId]);
    expect(state.deliveries.every((d) => d.verified && d.webhookId === eventId)).toBe(true);
    // The partner answers before the worker records the answer: wait for the row, not the partner.
    const after = await waitFor("the resent delivery to be recorded", async () => {
      const row = (await deliveriesOf(eventId)).find((d) => d.endpointId === endpoint.id);
      return row?.status === "pending" ? null : row;
    });
    expect(after).toMatchObject({ status: "succeeded", attemptCount: 10 });
  });
});
