// RELIABILITY figure 8, the tenant half: every API operation with an id in its path, taken from
// the served OpenAPI document, called by one organization with {its own id, another
// organization's id, a missing id}. Another organization's id answers exactly like a missing one
// (404, the same problem body); its own id is found.
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { demoOrganizations } from "@/db/seed-data";
import { createApiKey } from "@/lib/server/api-keys/create-api-key";
import { apiKeyScopes } from "@/lib/server/api-keys/scopes";
import { APP_URL } from "@/tests/helpers/app";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";
import { listOperations, type OpenApiDocument, type Operation } from "@/tests/hostile/malformed-cases";

const PARTNER_URL = `http://127.0.0.1:${process.env.PARTNER_PORT ?? 3795}/hooks/tenant-matrix`;
const MISSING: Record<string, string> = {
  scheduleId: "sch_zzzzzzzzzzzzzzzz",
  keyId: "key_zzzzzzzzzzzzzzzz",
  endpointId: "wh_zzzzzzzzzzzzzzzz",
  mark: "NO-SUCH-MARK",
  profileId: "lp_zzzzzzzzzzzzzzzz",
  materialId: "mat_zzzzzzzzzzzzzzzz",
  catalogueId: "cat_zzzzzzzzzzzzzzzz",
};
// Bodies for the operations that change a resource: each valid for the resource's own organization.
const MATERIAL = { name: "Tenant matrix alloy (invented)", family: "custom", eMpa: 100000, gMpa: null, densityKgPerM3: 7000, creepFactor: 0, source: "invented for this test" };

interface Tenant {
  key: string;
  ids: Record<string, string>;
}

async function createTenant(organizationId: string, mark: string): Promise<Tenant> {
  const { secret: key } = await createApiKey({ organizationId, name: `tenant matrix ${Date.now()}`, scopes: [...apiKeyScopes], createdBy: { commandLine: true } });
  const other = await createApiKey({ organizationId, name: `tenant matrix target ${Date.now()}`, scopes: ["results:read"], createdBy: { commandLine: true } });
  const auth = { authorization: `Bearer ${key}` };
  // The organization's own criteria, each with an id in its path. The schedule below is checked
  // against the profile's version 1, and the profile is then edited, so a recheck has a newer version.
  const profile = await request(APP_URL).post("/api/v1/limit-profiles").set(auth).send({ label: "Tenant matrix floors", source: "copied for this test", basedOnPreset: "ibc-2021-floor" });
  expect(profile.status, profile.text).toBe(201);
  const material = await request(APP_URL).post("/api/v1/materials").set(auth).send(MATERIAL);
  expect(material.status, material.text).toBe(201);
  const catalogue = await request(APP_URL).post("/api/v1/section-catalogues").set(auth).send({ name: `Tenant matrix ${mark} (invented)`, source: "invented", sections: [{ name: "TM 1", iMm4: 1e8, areaMm2: 5000, massKgPerM: 40 }] });
  expect(catalogue.status, catalogue.text).toBe(201);
  // A 12 m beam under 20 kN/m live fails, so the disposition route has a member in review to decide.
  const doc = { ...createScheduleDoc([createBeam(mark, 12, 20)], "Invented tenant matrix"), profile: { id: profile.body.id } };
  const schedule = await request(APP_URL).post("/api/v1/schedules").set(auth).send(doc);
  expect(schedule.status, schedule.text).toBe(202);
  await waitForSchedule(key, schedule.body.id);
  const edited = await request(APP_URL).put(`/api/v1/limit-profiles/${profile.body.id}`).set(auth).send({ label: "Tenant matrix floors, edited", source: "copied for this test" });
  expect(edited.status, edited.text).toBe(200);
  const endpoint = await request(APP_URL).post("/api/v1/webhook-endpoints").set(auth).send({ url: PARTNER_URL, eventTypes: ["schedule.completed"] });
  expect(endpoint.status, endpoint.text).toBe(201);
  return {
    key,
    ids: { scheduleId: schedule.body.id, mark, keyId: other.apiKey.id, endpointId: endpoint.body.endpoint.id, profileId: profile.body.id, materialId: material.body.id, catalogueId: catalogue.body.id },
  };
}

function call(operation: Operation, key: string, ids: Record<string, string>) {
  const path = operation.path.replace(/\{([^}]+)\}/g, (_, name: string) => encodeURIComponent(ids[name] ?? "x"));
  const req = request(APP_URL)[operation.method.toLowerCase() as "get" | "post" | "put" | "patch" | "delete"](path).set("authorization", `Bearer ${key}`);
  if (operation.path.endsWith("/dispositions")) return req.send({ kind: "information_requested", justification: "Invented tenant matrix" });
  if (operation.method === "PUT" && operation.path.startsWith("/api/v1/limit-profiles/")) return req.send({ label: "Tenant matrix floors, again", source: "copied for this test" });
  if (operation.method === "PUT" && operation.path.startsWith("/api/v1/materials/")) return req.send(MATERIAL);
  if (operation.method === "PATCH" && operation.path.startsWith("/api/v1/section-catalogues/")) return req.send({ inUse: false });
  return operation.method === "PATCH" ? req.send({ description: "Invented tenant matrix" }) : req;
}

const problemWithoutInstance = (body: Record<string, unknown>) => Object.fromEntries(Object.entries(body).filter(([k]) => k !== "instance" && k !== "requestId"));

let own: Tenant;
let other: Tenant;
let operations: Operation[];
beforeAll(async () => {
  own = await createTenant(demoOrganizations.engineering.id, "TM-OWN-1");
  other = await createTenant(demoOrganizations.fabricator.id, "TM-OTHER-1");
  const doc = (await request(APP_URL).get("/api/v1/openapi.json")).body as OpenApiDocument;
  // Deletions last, so the own resources are still there for the other operations.
  operations = listOperations(doc)
    .filter((o) => o.pathParams.length > 0)
    .sort((a, b) => Number(a.method === "DELETE") - Number(b.method === "DELETE"));
});

describe("another organization's id answers exactly like a missing one", () => {
  it("covers every operation with an id in its path", () => {
    expect(operations.length).toBeGreaterThanOrEqual(8);
    for (const o of operations) for (const name of o.pathParams) expect(Object.keys(MISSING), `${o.method} ${o.path}`).toContain(name);
  });

  it("every operation x {own, another organization's, missing} id", async () => {
    for (const operation of operations) {
      const label = `${operation.method} ${operation.path}`;
      const theirs = await call(operation, own.key, other.ids);
      const missing = await call(operation, own.key, MISSING);
      expect(theirs.status, `${label} with another organization's id`).toBe(404);
      expect(missing.status, `${label} with a missing id`).toBe(404);
      expect(problemWithoutInstance(theirs.body), label).toEqual(problemWithoutInstance(missing.body));
      const mine = await call(operation, own.key, own.ids);
      expect(mine.status, `${label} with its own id: ${mine.text.slice(0, 200)}`).toBeLessThan(300);
    }
  });
});
