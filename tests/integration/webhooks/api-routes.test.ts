// /api/v1/webhook-endpoints with an API key holding webhooks:manage: create (secret once, SSRF
// refused with a pointer), read, change, test, rotate, delete; another organization's ids are 404.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { compileApiSchema } from "@/tests/helpers/schemas";

import { configurePartner, createTestOrganization, PARTNER_URL, readPartner, verifyWith, waitFor } from "./support";

let org: Awaited<ReturnType<typeof createTestOrganization>>;
let key: string;
let outsiderKey: string;
beforeAll(async () => {
  org = await createTestOrganization("api");
  key = await createTestKey(["webhooks:manage"], org.organizationId);
  outsiderKey = await createTestKey(["webhooks:manage"]);
});
afterAll(async () => {
  await org.remove();
});

const api = (k = key) => ({
  get: (path: string) => request(APP_URL).get(path).set("authorization", `Bearer ${k}`),
  post: (path: string, body?: unknown) => request(APP_URL).post(path).set("authorization", `Bearer ${k}`).send(body as object),
  patch: (path: string, body: unknown) => request(APP_URL).patch(path).set("authorization", `Bearer ${k}`).send(body as object),
  delete: (path: string) => request(APP_URL).delete(path).set("authorization", `Bearer ${k}`),
});

const validateEndpoint = compileApiSchema("webhook-endpoint", { strict: true, allowUnionTypes: true });

describe("/api/v1/webhook-endpoints", () => {
  it("creates an endpoint, returning the secret once, and serves it without the secret after", async () => {
    const receiver = `api${Date.now().toString(36)}`;
    const created = await api().post("/api/v1/webhook-endpoints", { url: `${PARTNER_URL}/hooks/${receiver}`, description: "Ostrovel ERP", eventTypes: ["schedule.completed"] });
    expect(created.status).toBe(201);
    expect(created.body.secret).toMatch(/^whsec_/);
    expect(validateEndpoint(created.body.endpoint), JSON.stringify(validateEndpoint.errors)).toBe(true);
    const id = created.body.endpoint.id as string;
    expect(created.headers.location).toBe(`/api/v1/webhook-endpoints/${id}`);

    const one = await api().get(`/api/v1/webhook-endpoints/${id}`);
    expect(one.status).toBe(200);
    expect(validateEndpoint(one.body)).toBe(true);
    expect(JSON.stringify(one.body)).not.toContain(created.body.secret);
    const list = await api().get("/api/v1/webhook-endpoints");
    expect(list.body.data.map((e: { id: string }) => e.id)).toContain(id);
    expect(list.text).not.toContain("whsec_");

    const changed = await api().patch(`/api/v1/webhook-endpoints/${id}`, { eventTypes: ["schedule.failed", "member.dispositioned"], enabled: false });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ eventTypes: ["schedule.failed", "member.dispositioned"], enabled: false, disabledReason: "manual" });
    const refusedTest = await api().post(`/api/v1/webhook-endpoints/${id}/test`);
    expect(refusedTest.status).toBe(409);
    expect(refusedTest.headers["content-type"]).toContain("application/problem+json");
    expect((await api().patch(`/api/v1/webhook-endpoints/${id}`, { enabled: true })).body.enabled).toBe(true);

    const rotated = await api().post(`/api/v1/webhook-endpoints/${id}/rotate-secret`);
    expect(rotated.status).toBe(200);
    expect(rotated.body.secret).toMatch(/^whsec_/);
    expect(rotated.body.secret).not.toBe(created.body.secret);
    // During the overlap the partner may still hold only the old secret: it must still verify.
    await configurePartner(receiver, { secrets: [created.body.secret] });
    const test = await api().post(`/api/v1/webhook-endpoints/${id}/test`);
    expect(test.status).toBe(202);
    const state = await waitFor("the test event", async () => {
      const s = await readPartner(receiver);
      return s.processed.includes(test.body.eventId) ? s : null;
    });
    const delivery = state.deliveries.find((d) => d.webhookId === test.body.eventId)!;
    expect(delivery.verified).toBe(true);
    const asRequest = { body: delivery.body, path: "", headers: { "webhook-id": delivery.webhookId, "webhook-timestamp": delivery.webhookTimestamp, "webhook-signature": delivery.webhookSignature } };
    expect(verifyWith(rotated.body.secret, asRequest)).toBeTruthy();

    expect((await api().delete(`/api/v1/webhook-endpoints/${id}`)).status).toBe(204);
    expect((await api().get(`/api/v1/webhook-endpoints/${id}`)).status).toBe(404);
  });

  it.each([
    [{ url: "http://169.254.169.254/latest/meta-data/", eventTypes: ["schedule.completed"] }, "/url"],
    [{ url: "http://2130706433/", eventTypes: ["schedule.completed"] }, "/url"],
    [{ url: "https://partner.example/", eventTypes: ["schedule.exploded"] }, "/eventTypes/0"],
    [{ url: "https://partner.example/", eventTypes: [] }, "/eventTypes"],
    [{ url: "https://partner.example/", eventTypes: ["schedule.completed"], secret: "whsec_mine" }, "/secret"],
  ])("refuses %j with 422 naming %s", async (body, pointer) => {
    const response = await api().post("/api/v1/webhook-endpoints", body);
    expect(response.status).toBe(422);
    expect(response.headers["content-type"]).toContain("application/problem+json");
    expect(response.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
  });

  it("answers another organization's endpoint exactly like a missing one", async () => {
    const created = await api().post("/api/v1/webhook-endpoints", { url: `${PARTNER_URL}/hooks/private`, eventTypes: ["schedule.completed"] });
    const id = created.body.endpoint.id as string;
    for (const [method, path] of [
      ["get", `/api/v1/webhook-endpoints/${id}`],
      ["delete", `/api/v1/webhook-endpoints/${id}`],
      ["post", `/api/v1/webhook-endpoints/${id}/rotate-secret`],
      ["post", `/api/v1/webhook-endpoints/${id}/test`],
    ] as const) {
      const theirs = await api(outsiderKey)[method](path);
      const missing = await api(outsiderKey)[method](path.replace(id, "wh_0000000000000000"));
      expect(theirs.status, `${method} ${path}`).toBe(404);
      expect({ ...theirs.body, instance: undefined }).toEqual({ ...missing.body, instance: undefined });
    }
    expect((await api(outsiderKey).patch(`/api/v1/webhook-endpoints/${id}`, { enabled: false })).status).toBe(404);
    expect((await api().get(`/api/v1/webhook-endpoints/${id}`)).body.enabled).toBe(true);
  });
});
