// Keys that must not work: revoked, expired, made by a revoked key, made by a removed person (when
// the admin chose so), and keys with more than their maker may grant.
import { eq } from "drizzle-orm";
import request from "supertest";
import { describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { apiKeys } from "@/db/schema";
import { demoOrganizations } from "@/db/seed-data";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { hashApiKey } from "@/lib/server/api-keys/key-format";
import { revokeApiKey } from "@/lib/server/api-keys/revoke-api-key";
import { removeMember } from "@/lib/server/people/manage-members";
import { APP_URL, callAction, findAction, signIn } from "@/tests/helpers/app";
import { createTestMember } from "@/tests/helpers/people";

const organizationId = demoOrganizations.engineering.id;

const listKeys = (secret: string) => request(APP_URL).get("/api/v1/api-keys").set("authorization", `Bearer ${secret}`);

async function makeKey(scopes: string[], expiresInDays: number | null = null) {
  const { apiKey, secret } = await createApiKey({ organizationId, name: `hostile ${Date.now()}`, scopes, expiresInDays, createdBy: { commandLine: true } });
  return { id: apiKey.id, secret };
}

async function makeChild(parentSecret: string, body: Record<string, unknown>) {
  const response = await request(APP_URL).post("/api/v1/api-keys").set("authorization", `Bearer ${parentSecret}`).send({ name: `child ${Date.now()}`, ...body });
  expect(response.status).toBe(201);
  return { id: response.body.apiKey.id as string, secret: response.body.key as string, expiresAt: response.body.apiKey.expiresAt as string | null };
}

describe("revoked and expired keys", () => {
  it("a revoked key is refused with 401 and says so", async () => {
    const key = await makeKey(["keys:manage"]);
    expect((await listKeys(key.secret)).status).toBe(200);
    await revokeApiKey({ organizationId, keyId: key.id });
    const refused = await listKeys(key.secret);
    expect(refused.status).toBe(401);
    expect(refused.body).toMatchObject({ type: "https://sagline.dev/problems/invalid-api-key", detail: "The API key has been revoked." });
  });

  it("an expired key is refused with 401 and says so", async () => {
    const key = await makeKey(["keys:manage"], 1);
    await getDb().update(apiKeys).set({ expiresAt: new Date(Date.now() - 1_000) }).where(eq(apiKeys.secretHash, hashApiKey(key.secret)));
    const refused = await listKeys(key.secret);
    expect(refused.status).toBe(401);
    expect(refused.body).toMatchObject({ type: "https://sagline.dev/problems/invalid-api-key", detail: "The API key has expired." });
  });
});

describe("keys made by keys", () => {
  it("expire no later than their parent, whatever they ask for", async () => {
    const parent = await makeKey(["keys:manage", "results:read"], 2);
    const [parentRow] = await getDb().select({ expiresAt: apiKeys.expiresAt }).from(apiKeys).where(eq(apiKeys.id, parent.id));
    const forever = await makeChild(parent.secret, { scopes: ["results:read"] });
    const longer = await makeChild(parent.secret, { scopes: ["results:read"], expiresInDays: 365 });
    const shorter = await makeChild(parent.secret, { scopes: ["results:read"], expiresInDays: 1 });
    expect(forever.expiresAt).toBe(parentRow!.expiresAt!.toISOString());
    expect(longer.expiresAt).toBe(parentRow!.expiresAt!.toISOString());
    expect(new Date(shorter.expiresAt!).getTime()).toBeLessThan(parentRow!.expiresAt!.getTime());
  });

  it("are revoked with their parent, down every generation", async () => {
    const parent = await makeKey(["keys:manage", "results:read"]);
    const child = await makeChild(parent.secret, { scopes: ["keys:manage", "results:read"] });
    const grandchild = await makeChild(child.secret, { scopes: ["keys:manage"] });
    expect((await listKeys(grandchild.secret)).status).toBe(200);
    await revokeApiKey({ organizationId, keyId: parent.id });
    for (const key of [parent, child, grandchild]) {
      const refused = await listKeys(key.secret);
      expect(refused.status).toBe(401);
      expect(refused.body.detail).toBe("The API key has been revoked.");
    }
  });

  it("cannot be made by a key revoked while the request runs (the parent's lock decides)", async () => {
    const parent = await makeKey(["keys:manage"]);
    const attempts = Array.from({ length: 10 }, () =>
      request(APP_URL).post("/api/v1/api-keys").set("authorization", `Bearer ${parent.secret}`).send({ name: "racing child", scopes: ["keys:manage"] }),
    );
    const [answers] = await Promise.all([Promise.all(attempts), revokeApiKey({ organizationId, keyId: parent.id })]);
    for (const created of answers.filter((a) => a.status === 201)) {
      expect((await listKeys(created.body.key)).status).toBe(401);
    }
  });
});

describe("keys of a removed person", () => {
  async function memberWithKeys() {
    const person = await createTestMember("admin");
    const { apiKey, secret } = await createApiKey({ organizationId, name: "made by a person", scopes: ["keys:manage"], createdBy: { userId: person.id, role: "admin" } });
    const child = await makeChild(secret, { scopes: ["keys:manage"] });
    return { person, key: { id: apiKey.id, secret }, child };
  }

  it("stop working, with the keys made from them, when the admin chose to revoke them", async () => {
    const { person, key, child } = await memberWithKeys();
    const result = await removeMember({ organizationId, membershipId: person.membershipId, creatorKeys: "revoke" });
    expect(result.revokedKeys).toBe(1);
    expect((await listKeys(key.secret)).status).toBe(401);
    expect((await listKeys(child.secret)).status).toBe(401);
  });

  it("keep working when the admin chose to keep them", async () => {
    const { person, key, child } = await memberWithKeys();
    await removeMember({ organizationId, membershipId: person.membershipId, creatorKeys: "keep" });
    expect((await listKeys(key.secret)).status).toBe(200);
    expect((await listKeys(child.secret)).status).toBe(200);
  });

  it("the console refuses a removal that makes no choice", async () => {
    const { person } = await memberWithKeys();
    const { agent } = await signIn(...(await adminCredentials()));
    const answer = await callAction(agent, findAction("people/removeMember"), { membershipId: person.membershipId });
    expect(answer.result).toMatchObject({ ok: false, code: "invalid_input" });
    expect(answer.result?.fieldErrors?.creatorKeys).toBe("Choose whether the API keys this person made keep working.");
  });
});

async function adminCredentials(): Promise<[string, string]> {
  const admin = await createTestMember("admin");
  return [admin.email, admin.password];
}

describe("scopes a role lacks", () => {
  it("an integrator cannot mint schedules:write, in the console or below it", async () => {
    const integrator = await createTestMember("integrator");
    await expect(
      createApiKey({ organizationId, name: "too much", scopes: ["schedules:write"], createdBy: { userId: integrator.id, role: "integrator" } }),
    ).rejects.toMatchObject({ code: "forbidden" });
    const { agent } = await signIn(integrator.email, integrator.password);
    const answer = await callAction(agent, findAction("keys/createApiKey"), { name: "too much", "scope:schedules:write": "on", "scope:results:read": "on" });
    expect(answer.result).toMatchObject({ ok: false, code: "forbidden" });
    const page = await agent.get("/integrations/keys");
    expect(page.status).toBe(200);
    expect(page.text).not.toContain('name="scope:schedules:write"');
    expect(page.text).toContain('name="scope:results:read"');
  });

  it("an integrator may mint the scopes its role covers", async () => {
    const integrator = await createTestMember("integrator");
    const { agent } = await signIn(integrator.email, integrator.password);
    const answer = await callAction(agent, findAction("keys/createApiKey"), { name: "fits the role", "scope:results:read": "on", "scope:webhooks:manage": "on" });
    expect(answer.result).toMatchObject({ ok: true });
  });
});

describe("an engineer's own keys", () => {
  it("opens the key page with only the scopes an engineer may grant, and makes a review:write key", async () => {
    const engineer = await createTestMember("engineer");
    const { agent } = await signIn(engineer.email, engineer.password);
    const page = await agent.get("/integrations/keys");
    expect(page.status).toBe(200);
    for (const scope of ["schedules:write", "results:read", "criteria:manage", "review:write"]) expect(page.text).toContain(`name="scope:${scope}"`);
    for (const scope of ["webhooks:manage", "keys:manage"]) expect(page.text).not.toContain(`name="scope:${scope}"`);
    // Webhook endpoints stay with integrators and administrators.
    expect((await agent.get("/integrations/webhooks")).status).toBe(403);

    const made = await callAction(agent, findAction("keys/createApiKey"), { name: "firm review tool", "scope:review:write": "on", "scope:criteria:manage": "on" });
    expect(made.result).toMatchObject({ ok: true });
    const refused = await callAction(agent, findAction("keys/createApiKey"), { name: "too much", "scope:results:read": "on", "scope:webhooks:manage": "on" });
    expect(refused.result).toMatchObject({ ok: false, code: "forbidden" });
    const [row] = await getDb().select().from(apiKeys).where(eq(apiKeys.createdByUserId, engineer.id));
    expect(row?.scopes).toEqual(["criteria:manage", "review:write"]);
  });

  it("lists and revokes only the keys the engineer made; another person's key reads as missing and keeps working", async () => {
    const engineer = await createTestMember("engineer");
    const integrator = await createTestMember("integrator");
    const theirs = await createApiKey({ organizationId, name: `integrator's key ${Date.now()}`, scopes: ["results:read"], createdBy: { userId: integrator.id, role: "integrator" } });
    const mine = await createApiKey({ organizationId, name: `engineer's key ${Date.now()}`, scopes: ["results:read"], createdBy: { userId: engineer.id, role: "engineer" } });
    const { agent } = await signIn(engineer.email, engineer.password);

    const page = await agent.get("/integrations/keys");
    expect(page.text).toContain(mine.apiKey.name);
    expect(page.text).not.toContain(theirs.apiKey.name);

    const other = await callAction(agent, findAction("keys/revokeApiKey"), { keyId: theirs.apiKey.id });
    expect(other.result).toMatchObject({ ok: false, code: "not_found" });
    const [still] = await getDb().select().from(apiKeys).where(eq(apiKeys.id, theirs.apiKey.id));
    expect(still?.revokedAt).toBeNull();
    expect((await request(APP_URL).get("/api/v1/schedules").set("authorization", `Bearer ${theirs.secret}`)).status).toBe(200);

    const own = await callAction(agent, findAction("keys/revokeApiKey"), { keyId: mine.apiKey.id });
    expect(own.result).toMatchObject({ ok: true });
    expect((await request(APP_URL).get("/api/v1/schedules").set("authorization", `Bearer ${mine.secret}`)).status).toBe(401);
  });
});
