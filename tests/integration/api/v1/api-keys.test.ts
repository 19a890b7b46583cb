// /api/v1/api-keys over real HTTP: create (the secret once), list with keyset pages, revoke taking
// effect on the next request, tenant isolation, body validation, coarse last-used, rate limits.
import { eq } from "drizzle-orm";
import { Redis } from "ioredis";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { getRateLimitCounters, getRateLimits } from "@/app/api/v1/_lib/rate-limit";
import { getDb } from "@/db/client";
import { apiKeys, organizations, type ApiKeyScope } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { hashApiKey, isWellFormedApiKey } from "@/lib/server/api-keys/key-format";
import { createId } from "@/lib/server/ids";
import { APP_URL } from "@/tests/helpers/app";
import { compileApiSchema } from "@/tests/helpers/schemas";

const PROBLEMS = "https://sagline.dev/problems/";
const schemaOptions = { strict: true, allowUnionTypes: true, references: ["api-key"] };
const validateCreated = compileApiSchema("api-key-created", schemaOptions);
const validateList = compileApiSchema("api-key-list", schemaOptions);
const validateProblem = compileApiSchema("problem", schemaOptions);

async function createOrganization(): Promise<string> {
  const id = createId("org");
  await getDb().insert(organizations).values({ id, name: `Test fabricator ${id.slice(-5)}`, kind: "fabricator" });
  return id;
}

async function createKey(organizationId: string, scopes: ApiKeyScope[], name = "test key") {
  return createApiKey({ organizationId, name, scopes, createdBy: { commandLine: true } });
}

const api = () => request(APP_URL);
const bearer = (secret: string) => `Bearer ${secret}`;

function expectProblem(response: request.Response, code: string, status: number) {
  expect(response.status, JSON.stringify(response.body)).toBe(status);
  expect(response.headers["content-type"]).toBe("application/problem+json");
  expect(response.body.type).toBe(PROBLEMS + code);
  expect(validateProblem(response.body), JSON.stringify(validateProblem.errors)).toBe(true);
  expect(JSON.stringify(response.body)).not.toMatch(/\n\s+at |node_modules|postgres|SELECT /i);
}

let organizationId: string;
let manager: { secret: string; apiKey: { id: string } };

beforeAll(async () => {
  organizationId = await createOrganization();
  manager = await createKey(organizationId, ["keys:manage", "results:read", "schedules:write"], "manager");
});

describe("POST /api/v1/api-keys", () => {
  it("creates a key, returns its secret once, and the secret works at once", async () => {
    const response = await api().post("/api/v1/api-keys").set("Authorization", bearer(manager.secret)).send({ name: "Shop export", scopes: ["results:read", "keys:manage"], expiresInDays: 30 });
    expect(response.status).toBe(201);
    expect(validateCreated(response.body), JSON.stringify(validateCreated.errors)).toBe(true);
    const { apiKey, key } = response.body;
    expect(isWellFormedApiKey(key)).toBe(true);
    expect(apiKey).toMatchObject({ name: "Shop export", prefix: key.slice(0, 12), scopes: ["results:read", "keys:manage"], status: "active", revokedAt: null, lastUsedAt: null });
    expect(apiKey.createdBy).toEqual({ kind: "api_key", id: manager.apiKey.id, prefix: expect.stringMatching(/^sgl_/) });
    // 30 days of 86,400,000 ms (a day is 86,400 s by definition), within the request's own duration.
    const expiresInMs = Date.parse(apiKey.expiresAt) - Date.parse(apiKey.createdAt);
    expect(Math.abs(expiresInMs - 30 * 86_400_000)).toBeLessThan(1_000);
    // Only the hash is stored.
    const [row] = await getDb().select().from(apiKeys).where(eq(apiKeys.id, apiKey.id));
    expect(row!.secretHash).toBe(hashApiKey(key));
    expect(JSON.stringify(row)).not.toContain(key.slice(12));
    // Shown once: the list never carries it.
    const list = await api().get("/api/v1/api-keys").set("Authorization", bearer(key));
    expect(list.status).toBe(200);
    expect(JSON.stringify(list.body)).not.toContain(key);
  });

  it("cannot grant a scope the calling key lacks", async () => {
    const narrow = await createKey(organizationId, ["keys:manage"]);
    const response = await api().post("/api/v1/api-keys").set("Authorization", bearer(narrow.secret)).send({ name: "wider", scopes: ["keys:manage", "webhooks:manage"] });
    expectProblem(response, "insufficient-scope", 403);
    expect(response.body.detail).toContain("webhooks:manage");
  });

  it.each([
    ["a missing name", { scopes: ["results:read"] }, "/name"],
    ["a blank name", { name: "   ", scopes: ["results:read"] }, "/name"],
    ["a name over 100 characters", { name: "x".repeat(101), scopes: ["results:read"] }, "/name"],
    ["no scopes", { name: "n", scopes: [] }, "/scopes"],
    ["an unknown scope", { name: "n", scopes: ["results:write"] }, "/scopes/0"],
    ["a zero expiry", { name: "n", scopes: ["results:read"], expiresInDays: 0 }, "/expiresInDays"],
    ["a fractional expiry", { name: "n", scopes: ["results:read"], expiresInDays: 1.5 }, "/expiresInDays"],
    ["a string expiry", { name: "n", scopes: ["results:read"], expiresInDays: "30" }, "/expiresInDays"],
    ["an unknown field", { name: "n", scopes: ["results:read"], owner: "me" }, "/owner"],
    ["an array body", [{ name: "n" }], ""],
  ])("answers 422 naming the field for %s", async (_what, body, pointer) => {
    const response = await api().post("/api/v1/api-keys").set("Authorization", bearer(manager.secret)).send(body as object);
    expectProblem(response, "invalid-input", 422);
    expect(response.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
    for (const e of response.body.errors) expect(typeof e.message).toBe("string");
  });

  it("answers 400 for bad JSON, 415 for another media type, 413 for an oversized body", async () => {
    const post = () => api().post("/api/v1/api-keys").set("Authorization", bearer(manager.secret));
    expectProblem(await post().set("Content-Type", "application/json").send('{"name": "n", '), "bad-request", 400);
    expectProblem(await post().set("Content-Type", "text/plain").send('{"name":"n","scopes":["results:read"]}'), "unsupported-media-type", 415);
    expectProblem(await post().set("Content-Type", "application/json").send(JSON.stringify({ name: "n".repeat(80_000), scopes: ["results:read"] })), "too-large", 413);
  });
});

describe("GET /api/v1/api-keys", () => {
  let pagedOrganization: string;
  let pagedManager: string;
  const names = ["k1", "k2", "k3", "k4", "k5"];

  beforeAll(async () => {
    pagedOrganization = await createOrganization();
    pagedManager = (await createKey(pagedOrganization, ["keys:manage"], "paged manager")).secret;
    for (const name of names) await createKey(pagedOrganization, ["results:read"], name);
  });

  it("pages newest first through every key exactly once, following Link rel=next", async () => {
    const seen: string[] = [];
    let url: string | null = "/api/v1/api-keys?limit=2";
    let pages = 0;
    while (url) {
      const response: request.Response = await api().get(url).set("Authorization", bearer(pagedManager));
      expect(response.status).toBe(200);
      expect(validateList(response.body), JSON.stringify(validateList.errors)).toBe(true);
      seen.push(...response.body.data.map((k: { name: string }) => k.name));
      const link = response.headers.link as string | undefined;
      if (response.body.links.next) {
        expect(link).toMatch(new RegExp(`^<${APP_URL}/api/v1/api-keys\\?limit=2&cursor=[A-Za-z0-9_-]+>; rel="next"$`));
        url = new URL(link!.slice(1, link!.indexOf(">"))).pathname + new URL(link!.slice(1, link!.indexOf(">"))).search;
      } else {
        expect(link).toBeUndefined();
        url = null;
      }
      pages += 1;
      expect(pages).toBeLessThan(10);
    }
    // 5 keys + the manager, 2 a page: 3 pages, newest first.
    expect(pages).toBe(3);
    expect(seen).toEqual([...names].reverse().concat("paged manager"));
  });

  it("lists only the calling key's organization", async () => {
    const response = await api().get("/api/v1/api-keys?limit=100").set("Authorization", bearer(manager.secret));
    const listed = response.body.data.map((k: { name: string }) => k.name);
    for (const name of names) expect(listed).not.toContain(name);
  });

  it.each([
    ["limit=0", "/query/limit"],
    ["limit=101", "/query/limit"],
    ["limit=abc", "/query/limit"],
    ["cursor=not-a-cursor", "/query/cursor"],
    [`cursor=${Buffer.from('{"c":"yesterday","i":"key_x"}').toString("base64url")}`, "/query/cursor"],
    [`cursor=${Buffer.from("[1,2]").toString("base64url")}`, "/query/cursor"],
  ])("answers 400 for %s", async (query, pointer) => {
    const response = await api().get(`/api/v1/api-keys?${query}`).set("Authorization", bearer(pagedManager));
    expectProblem(response, "bad-request", 400);
    expect(response.body.errors).toEqual([{ pointer, message: expect.any(String) }]);
  });
});

describe("DELETE /api/v1/api-keys/{keyId}", () => {
  it("revokes a key; it is refused from the very next request", async () => {
    const victim = await createKey(organizationId, ["keys:manage"], "to revoke");
    expect((await api().get("/api/v1/api-keys").set("Authorization", bearer(victim.secret))).status).toBe(200);
    const response = await api().delete(`/api/v1/api-keys/${victim.apiKey.id}`).set("Authorization", bearer(manager.secret));
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ id: victim.apiKey.id, status: "revoked", revokedAt: expect.any(String) });
    const after = await api().get("/api/v1/api-keys").set("Authorization", bearer(victim.secret));
    expectProblem(after, "invalid-api-key", 401);
    expect(after.body.detail).toBe("The API key has been revoked.");
    // Revoking again keeps the first time.
    const again = await api().delete(`/api/v1/api-keys/${victim.apiKey.id}`).set("Authorization", bearer(manager.secret));
    expect(again.status).toBe(200);
    expect(again.body.revokedAt).toBe(response.body.revokedAt);
  });

  it("answers another organization's key exactly like a missing one, and leaves it alone", async () => {
    const otherOrganization = await createOrganization();
    const foreign = await createKey(otherOrganization, ["results:read"], "foreign");
    const del = (id: string) => api().delete(`/api/v1/api-keys/${id}`).set("Authorization", bearer(manager.secret));
    const foreignAnswer = await del(foreign.apiKey.id);
    const missingAnswer = await del("key_0000000000000000");
    const malformedAnswer = await del("not-a-key-id");
    for (const answer of [foreignAnswer, missingAnswer, malformedAnswer]) expectProblem(answer, "not-found", 404);
    const strip = (body: Record<string, unknown>) => ({ ...body, instance: undefined });
    expect(strip(foreignAnswer.body)).toEqual(strip(missingAnswer.body));
    expect(strip(malformedAnswer.body)).toEqual(strip(missingAnswer.body));
    const [row] = await getDb().select({ revokedAt: apiKeys.revokedAt }).from(apiKeys).where(eq(apiKeys.id, foreign.apiKey.id));
    expect(row!.revokedAt).toBeNull();
  });
});

describe("last used", () => {
  it("is written on first use and then at most once a minute", async () => {
    const key = await createKey(organizationId, ["keys:manage"], "last used");
    const read = async () => (await getDb().select({ lastUsedAt: apiKeys.lastUsedAt }).from(apiKeys).where(eq(apiKeys.id, key.apiKey.id)))[0]!.lastUsedAt;
    expect(await read()).toBeNull();
    await api().get("/api/v1/api-keys").set("Authorization", bearer(key.secret)).expect(200);
    const first = await read();
    expect(first).toBeInstanceOf(Date);
    for (let i = 0; i < 3; i++) await api().get("/api/v1/api-keys").set("Authorization", bearer(key.secret)).expect(200);
    expect((await read())!.getTime()).toBe(first!.getTime());
    // Two minutes later (moved back in the database), the next request records the use again.
    const twoMinutesAgo = new Date(Date.now() - 120_000);
    await getDb().update(apiKeys).set({ lastUsedAt: twoMinutesAgo }).where(eq(apiKeys.id, key.apiKey.id));
    await api().get("/api/v1/api-keys").set("Authorization", bearer(key.secret)).expect(200);
    expect((await read())!.getTime()).toBeGreaterThan(twoMinutesAgo.getTime() + 60_000);
  });
});

describe("rate limits", () => {
  let redis: Redis;
  const touched: string[] = [];

  beforeAll(() => {
    redis = new Redis(getEnv().REDIS_URL, { maxRetriesPerRequest: 1 });
  });

  afterAll(async () => {
    if (touched.length) await redis.del(...touched);
    await redis.quit();
  });

  // Fills the counters of this window and the next, so a window boundary mid-test changes nothing.
  async function fill(who: { apiKeyId: string; organizationId: string }, which: "keyCounter" | "organizationCounter", count: number) {
    for (const at of [Date.now(), Date.now() + 60_000]) {
      const counter = getRateLimitCounters(getEnv().REDIS_PREFIX, who, at)[which];
      touched.push(counter);
      await redis.set(counter, String(count), "PX", 180_000);
    }
  }

  it("answers 429 with Retry-After once a key is over its limit, and counts each request", async () => {
    const key = await createKey(organizationId, ["keys:manage"], "rate limited");
    const who = { apiKeyId: key.apiKey.id, organizationId };
    const ok = await api().get("/api/v1/api-keys").set("Authorization", bearer(key.secret));
    expect(ok.status).toBe(200);
    expect(Number(ok.headers["ratelimit-limit"])).toBe(getRateLimits().perKeyPerMinute);
    expect(Number(ok.headers["ratelimit-remaining"])).toBeLessThan(getRateLimits().perKeyPerMinute);
    await fill(who, "keyCounter", getRateLimits().perKeyPerMinute);
    const limited = await api().get("/api/v1/api-keys").set("Authorization", bearer(key.secret));
    expectProblem(limited, "rate-limited", 429);
    const retryAfter = Number(limited.headers["retry-after"]);
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(60);
    expect(limited.body.detail).toContain("This API key");
    // The organization's other keys are not held back by one key's limit.
    expect((await api().get("/api/v1/api-keys").set("Authorization", bearer(manager.secret))).status).toBe(200);
  });

  it("limits the organization's keys together", async () => {
    const crowded = await createOrganization();
    const first = await createKey(crowded, ["keys:manage"], "first");
    const second = await createKey(crowded, ["keys:manage"], "second");
    await fill({ apiKeyId: first.apiKey.id, organizationId: crowded }, "organizationCounter", getRateLimits().perOrganizationPerMinute);
    for (const key of [first, second]) {
      const limited = await api().get("/api/v1/api-keys").set("Authorization", bearer(key.secret));
      expectProblem(limited, "rate-limited", 429);
      expect(limited.body.detail).toContain("organization");
      expect(Number(limited.headers["retry-after"])).toBeGreaterThanOrEqual(1);
    }
  });
});

describe("GET /api/v1/openapi.json", () => {
  it("is public JSON, OpenAPI 3.1", async () => {
    const response = await api().get("/api/v1/openapi.json");
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toContain("application/json");
    expect(response.body.openapi).toMatch(/^3\.1\./);
    expect(Object.keys(response.body.paths)).toContain("/api/v1/api-keys/{keyId}");
  });
});
