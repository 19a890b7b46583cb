// The review flow through the public API on the running services: the queue a checked schedule
// fills, its filters and keyset pages, dispositions with their problems, the member's history,
// carry-over to a later submission, the member.dispositioned webhook as the fake partner verifies
// it, and the digest e-mail in the SMTP fake.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { APP_URL } from "@/tests/helpers/app";
import { waitForMail } from "@/tests/helpers/mail";
import { compileApiSchema, describeSchemaErrors } from "@/tests/helpers/schemas";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";
import { configurePartner, insertEndpoint, PARTNER_URL, readPartner, waitFor } from "@/tests/integration/webhooks/support";
import { closeQueues } from "@/workers/queues";

import { createReviewOrganization } from "../../review/support";

let org: Awaited<ReturnType<typeof createReviewOrganization>>;
let other: Awaited<ReturnType<typeof createReviewOrganization>>;
let writer: string;
let reader: string;
let scheduleId: string;
const reference = `REV-${Date.now().toString(36)}`;
const receiver = `review${Date.now().toString(36)}`;

const api = () => request(APP_URL);
const bearer = (key: string) => `Bearer ${key}`;
// B1 passes; B2 (9 m) and B3 (10 m) fail the live-load limit (utilizations about 2.4 and 4.2 with these loads).
const members = () => [createBeam("B1", 6, 7.5), createBeam("B2", 9, 12), createBeam("B3", 10, 15)];

async function submit(key: string) {
  const response = await api().post("/api/v1/schedules").set("Authorization", bearer(key)).send({ ...createScheduleDoc(members(), "Review test, invented hall"), reference });
  expect(response.status).toBe(202);
  const done = await waitForSchedule(key, response.body.id as string);
  expect(done.status).toBe("completed");
  return response.body.id as string;
}

beforeAll(async () => {
  org = await createReviewOrganization("api");
  other = await createReviewOrganization("api-other");
  writer = await org.key(["schedules:write", "results:read", "review:write"]);
  reader = await org.key(["schedules:write", "results:read"]);
  const endpoint = await insertEndpoint(org.organizationId, `${PARTNER_URL}/hooks/${receiver}`, ["member.dispositioned"]);
  await configurePartner(receiver, { secrets: [endpoint.secret] });
  scheduleId = await submit(writer);
});
afterAll(async () => {
  await closeQueues();
  await org.remove();
  await other.remove();
});

describe("GET /api/v1/review", () => {
  const validPage = compileApiSchema("review-queue-page", { strict: true, allowUnionTypes: true });

  it("lists the failed members, highest utilization first, one keyset page at a time", async () => {
    const first = await api().get("/api/v1/review?limit=1").set("Authorization", bearer(reader));
    expect(first.status).toBe(200);
    expect(validPage(first.body), describeSchemaErrors(validPage.errors)).toBe(true);
    expect(first.body.data.map((r: { mark: string }) => r.mark)).toEqual(["B3"]);
    expect(first.body.data[0]).toMatchObject({ scheduleId, reference, outcome: "fail", state: "awaiting_review", carriedOver: null });
    expect(first.body.data[0].utilization).toBeGreaterThan(1);
    expect(first.headers.link).toMatch(/rel="next"/);
    const second = await api().get(first.body.links.next as string).set("Authorization", bearer(reader));
    expect(second.body.data.map((r: { mark: string }) => r.mark)).toEqual(["B2"]);
    expect(second.body.links.next).toBeNull();
  });

  it("filters by schedule, category, governing check and utilization, and sorts by age", async () => {
    const above = (value: number) => api().get(`/api/v1/review?scheduleId=${scheduleId}&utilizationAbove=${value}`).set("Authorization", bearer(reader));
    const all = (await above(0)).body.data as { mark: string; utilization: number; governingCheck: string }[];
    expect(all.map((r) => r.mark).sort()).toEqual(["B2", "B3"]);
    const lower = Math.min(...all.map((r) => r.utilization));
    expect(((await above(lower)).body.data as { mark: string }[]).length).toBe(1);
    const byCheck = await api().get(`/api/v1/review?governingCheck=${encodeURIComponent(all[0]!.governingCheck)}&category=floor_beam&sort=age`).set("Authorization", bearer(reader));
    expect(byCheck.body.data.length).toBeGreaterThanOrEqual(1);
    const otherCategory = await api().get("/api/v1/review?category=lintel").set("Authorization", bearer(reader));
    expect(otherCategory.body.data).toEqual([]);
  });

  it("answers 400 naming a bad parameter, and never shows another organization's members", async () => {
    const bad = await api().get("/api/v1/review?utilizationAbove=lots").set("Authorization", bearer(reader));
    expect(bad.status).toBe(400);
    expect(bad.headers["content-type"]).toMatch(/application\/problem\+json/);
    expect(bad.body.errors[0].pointer).toBe("/query/utilizationAbove");
    const sort = await api().get("/api/v1/review?sort=mark").set("Authorization", bearer(reader));
    expect(sort.status).toBe(400);
    expect(sort.body.errors[0].pointer).toBe("/query/sort");
    const cursor = await api().get("/api/v1/review?cursor=bm90LW91cnM").set("Authorization", bearer(reader));
    expect(cursor.status).toBe(400);
    expect(cursor.body.errors[0].pointer).toBe("/query/cursor");
    const foreign = await api().get("/api/v1/review").set("Authorization", bearer(await other.key(["results:read"])));
    expect(foreign.body.data).toEqual([]);
  });
});

describe("POST /api/v1/schedules/{id}/members/{mark}/dispositions", () => {
  const post = (key: string, mark: string, body: unknown, id = scheduleId) =>
    api().post(`/api/v1/schedules/${id}/members/${encodeURIComponent(mark)}/dispositions`).set("Authorization", bearer(key)).send(body as object);

  it.each([
    ["a key without review:write", () => reader, "B2", { kind: "member_to_be_revised" }, 403, "insufficient-scope"],
    ["accepting without a justification", () => writer, "B2", { kind: "accepted_with_justification" }, 422, "invalid-input"],
    ["accepting with a token justification", () => writer, "B2", { kind: "accepted_with_justification", justification: "ok" }, 422, "invalid-input"],
    ["an unknown kind", () => writer, "B2", { kind: "approved" }, 422, "invalid-input"],
    ["an unknown field", () => writer, "B2", { kind: "member_to_be_revised", by: "someone else" }, 422, "invalid-input"],
    ["a member that passed", () => writer, "B1", { kind: "member_to_be_revised" }, 409, "conflict"],
    ["a mark that does not exist", () => writer, "NOPE", { kind: "member_to_be_revised" }, 404, "not-found"],
  ] as const)("refuses %s", async (_label, key, mark, body, status, type) => {
    const response = await post(key(), mark, body);
    expect(response.status).toBe(status);
    expect(response.body.type).toBe(`https://sagline.dev/problems/${type}`);
    if (status === 422) expect(response.body.errors[0].pointer).toMatch(/^\/(justification|kind|by)$/);
  });

  it("refuses another organization's schedule as not found", async () => {
    const response = await post(await other.key(["review:write"]), "B2", { kind: "member_to_be_revised" });
    expect(response.status).toBe(404);
  });

  it("records a justification, shows it in the member's history, sends member.dispositioned, and carries it over (unapplied) to the next submission", async () => {
    const justification = "Checked against the measured camber of the invented hall; within the agreed tolerance.";
    const response = await post(writer, "B2", { kind: "accepted_with_justification", justification });
    expect(response.status).toBe(201);
    expect(compileApiSchema("disposition", { strict: true, allowUnionTypes: true })(response.body)).toBe(true);
    expect(response.body).toMatchObject({ kind: "accepted_with_justification", justification, state: "accepted_with_justification", bulkId: null });
    expect(response.body.decidedByName).toMatch(/^API key "review test/);

    const member = await api().get(`/api/v1/schedules/${scheduleId}/members/B2`).set("Authorization", bearer(reader));
    expect(member.body.review.state).toBe("accepted_with_justification");
    expect(member.body.review.history).toHaveLength(1);
    expect(member.body.review.history[0]).toMatchObject({ id: response.body.id, justification, carriedOver: false });
    const passed = await api().get(`/api/v1/schedules/${scheduleId}/members/B1`).set("Authorization", bearer(reader));
    expect(passed.body.review).toEqual({ state: "not_required", history: [] });
    const queue = await api().get(`/api/v1/review?scheduleId=${scheduleId}`).set("Authorization", bearer(reader));
    expect(queue.body.data.map((r: { mark: string }) => r.mark)).toEqual(["B3"]);

    const delivery = await waitFor("the partner to verify member.dispositioned", async () => {
      const { deliveries } = await readPartner(receiver);
      return deliveries.find((d) => d.verified && JSON.parse(d.body).data.dispositionId === response.body.id);
    });
    const event = JSON.parse(delivery.body);
    const validEvent = compileApiSchema("events/member.dispositioned", { strict: true, allowUnionTypes: true });
    expect(validEvent(event), describeSchemaErrors(validEvent.errors)).toBe(true);
    expect(event.data).toMatchObject({ scheduleId, reference, mark: "B2", disposition: "accepted_with_justification", note: justification, bulkId: null });
    expect(event.data.memberUrl).toBe(new URL(`/api/v1/schedules/${scheduleId}/members/B2`, APP_URL).toString());

    const revision = await submit(writer);
    const carried = await api().get(`/api/v1/schedules/${revision}/members/B2`).set("Authorization", bearer(reader));
    expect(carried.body.review.state).toBe("awaiting_review");
    expect(carried.body.review.history).toEqual([expect.objectContaining({ id: response.body.id, carriedOver: true, scheduleId, justification })]);
    const inQueue = await api().get(`/api/v1/review?scheduleId=${revision}`).set("Authorization", bearer(reader));
    const b2 = (inQueue.body.data as { mark: string; state: string; carriedOver: { dispositionId: string } | null }[]).find((r) => r.mark === "B2");
    expect(b2).toMatchObject({ state: "awaiting_review", carriedOver: { dispositionId: response.body.id } });
    // B3 was never decided, so nothing carries over for it.
    expect((inQueue.body.data as { mark: string; carriedOver: unknown }[]).find((r) => r.mark === "B3")?.carriedOver).toBeNull();
  });
});

describe("the review:write scope", () => {
  it.each([
    ["admin", true],
    ["engineer", true],
    ["integrator", false],
    ["viewer", false],
  ] as const)("a key with it can be made by a person with the %s role: %s", async (role, allowed) => {
    const attempt = createApiKey({ organizationId: org.organizationId, name: `grant by ${role}`, scopes: ["review:write"], createdBy: { userId: org.people[role].id, role } });
    if (allowed) await expect(attempt).resolves.toMatchObject({ apiKey: { scopes: ["review:write"] } });
    else await expect(attempt).rejects.toMatchObject({ code: expect.stringMatching(/forbidden|invalid_input/) });
  });

  it("a key cannot hand review:write to a key it makes unless it holds it", async () => {
    const manager = await org.key(["keys:manage"]);
    const response = await api().post("/api/v1/api-keys").set("Authorization", bearer(manager)).send({ name: "wider", scopes: ["review:write"] });
    expect(response.status).toBe(403);
  });
});

describe("the review digest", () => {
  it("reaches the organization's engineer in the SMTP fake, with a link to the schedule's members in review", async () => {
    const mail = await waitForMail(org.people.engineer.email, "Sagline review digest", 60_000);
    expect(mail.text).toContain(`/review?scheduleId=${scheduleId}`);
    expect(mail.text).toContain("Review test, invented hall");
    expect(mail.text).toContain("Caution:");
    // Viewers and integrators do not disposition, so they get no digest.
    const response = await fetch(new URL(`api/messages?to=${encodeURIComponent(org.people.viewer.email)}`, process.env.MAIL_UI_URL ?? "http://127.0.0.1:3794/"));
    expect(((await response.json()) as unknown[]).length).toBe(0);
  });
});
