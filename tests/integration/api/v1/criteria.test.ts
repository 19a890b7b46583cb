// /api/v1/limit-profiles, /api/v1/materials and /api/v1/section-catalogues against the running
// server, the real worker, PostgreSQL and Redis: writes need criteria:manage (admins and engineers
// may grant it), reads results:read; import problems name row and column; and a schedule submitted
// through the API with catalogue names and an organization profile gets its suggestion from the worker.
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { listGrantableScopes } from "@/lib/server/api-keys/scopes";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";
import { createCatalogueBeam, createTestOrganization } from "@/tests/integration/criteria/support";

const api = () => request(APP_URL);
const problem = (code: string) => `https://sagline.dev/problems/${code}`;
const HEADER = "name,iMm4,areaMm2,massKgPerM,shearAreaMm2";
const KPG_ROWS = ["KPG 240x120,36709673,3718.5,29.19,1366.5", "KPG 400x180,218764746,8067.8,63.33,3207.8", "KPG 450x190,321404388,9503.5,74.6,3955.5", "KPG 500x200,462073881,11173.5,87.71,4673.5"];

let manager: string;
let reader: string;
let other: string;
beforeAll(async () => {
  const organizationId = await createTestOrganization("API criteria");
  manager = await createTestKey(["criteria:manage", "results:read", "schedules:write"], organizationId);
  reader = await createTestKey(["results:read", "schedules:write"], organizationId);
  other = await createTestKey(["criteria:manage", "results:read"], await createTestOrganization("API criteria, other firm"));
});

describe("who may change criteria through the API", () => {
  it("is a criteria:manage key, which only administrators and engineers can grant", () => {
    const granting = (["admin", "engineer", "integrator", "submitter", "viewer"] as const).filter((role) => listGrantableScopes(role).includes("criteria:manage"));
    expect(granting).toEqual(["admin", "engineer"]);
  });

  it.each([
    ["POST", "/api/v1/limit-profiles"],
    ["POST", "/api/v1/materials"],
    ["POST", "/api/v1/section-catalogues"],
  ])("refuses %s %s without criteria:manage (403) and lets a results:read key list", async (method, path) => {
    const refused = await api()[method === "POST" ? "post" : "put"](path).set("authorization", `Bearer ${reader}`).send({});
    expect(refused.status).toBe(403);
    expect(refused.body).toMatchObject({ type: problem("insufficient-scope"), status: 403 });
    const listed = await api().get(path).set("authorization", `Bearer ${reader}`);
    expect(listed.status).toBe(200);
    expect(listed.body).toEqual({ data: expect.any(Array) });
  });
});

describe("POST /api/v1/section-catalogues", () => {
  it("refuses a CSV with bad rows, naming each row and column, and stores nothing", async () => {
    const csv = [HEADER, KPG_ROWS[0], "KPG 400x180,-5,8067.8,63.33,", "kpg 240 X120,1,1,1,"].join("\n");
    const response = await api().post("/api/v1/section-catalogues?name=Bad%20rows&source=invented").set("authorization", `Bearer ${manager}`).set("content-type", "text/csv").send(csv);
    expect(response.status).toBe(422);
    expect(response.headers["content-type"]).toContain("application/problem+json");
    expect(response.body).toMatchObject({ type: problem("invalid-input"), status: 422, errorCount: 2 });
    expect(response.body.errors).toEqual([
      { row: 3, column: "iMm4", code: "invalid_number", message: 'must be a positive number in mm^4, got "-5"' },
      { row: 4, column: "name", code: "duplicate_name", message: '"kpg 240 X120" is the same name as row 2 (names are compared with case and spaces ignored)' },
    ]);
    const listed = await api().get("/api/v1/section-catalogues").set("authorization", `Bearer ${manager}`);
    expect(listed.body.data).toEqual([]);
  });

  it("refuses JSON sections with their pointers, and a missing CSV name as a bad request", async () => {
    const json = await api().post("/api/v1/section-catalogues").set("authorization", `Bearer ${manager}`).send({ name: "JSON", source: "invented", sections: [{ name: "A", iMm4: 0, areaMm2: 1, massKgPerM: 1 }] });
    expect(json.status).toBe(422);
    expect(json.body.errors).toEqual([{ pointer: "/sections/0/iMm4", row: 1, column: "iMm4", code: "invalid_number", message: "must be a positive number in mm^4, got 0" }]);
    const csv = await api().post("/api/v1/section-catalogues").set("authorization", `Bearer ${manager}`).set("content-type", "text/csv").send([HEADER, KPG_ROWS[0]].join("\n"));
    expect(csv.status).toBe(400);
    expect(csv.body.errors).toEqual([
      { pointer: "/query/name", message: "must be 1 to 100 characters" },
      { pointer: "/query/source", message: "must be 1 to 500 characters: where the properties come from" },
    ]);
  });
});

describe("a schedule through the API with the organization's catalogue and profile", () => {
  it("is checked by the worker against the profile version it names and gets the lightest passing section", async () => {
    const imported = await api()
      .post("/api/v1/section-catalogues?name=KPG%20(invented%2C%20API%20test)&source=invented%20for%20this%20test")
      .set("authorization", `Bearer ${manager}`)
      .set("content-type", "text/csv")
      .send([HEADER, ...KPG_ROWS].join("\n"));
    expect(imported.status).toBe(201);
    expect(imported.body).toMatchObject({ id: expect.stringMatching(/^cat_/), sectionCount: 4, inUse: true });
    const read = await api().get(`/api/v1/section-catalogues/${imported.body.id}`).set("authorization", `Bearer ${reader}`);
    expect(read.body.sections.map((s: { name: string }) => s.name)).toEqual(["KPG 240x120", "KPG 400x180", "KPG 450x190", "KPG 500x200"]);
    expect((await api().get(`/api/v1/section-catalogues/${imported.body.id}`).set("authorization", `Bearer ${other}`)).status).toBe(404);

    const created = await api().post("/api/v1/limit-profiles").set("authorization", `Bearer ${manager}`).send({ label: "Floors, in-house copy", source: "IBC 2021 Table 1604.3, copied", basedOnPreset: "ibc-2021-floor" });
    expect(created.status).toBe(201);
    const changed = await api()
      .put(`/api/v1/limit-profiles/${created.body.id}`)
      .set("authorization", `Bearer ${manager}`)
      .send({ label: "Floors, in-house copy", source: "IBC 2021 Table 1604.3, copied", expectedVersion: 1 });
    expect(changed.body.version).toBe(2);
    const stale = await api().put(`/api/v1/limit-profiles/${created.body.id}`).set("authorization", `Bearer ${manager}`).send({ label: "late", source: "x", expectedVersion: 1 });
    expect(stale.status).toBe(409);
    const bad = await api().put(`/api/v1/limit-profiles/${created.body.id}`).set("authorization", `Bearer ${manager}`).send({ label: "x", source: "x", definition: { cantileverSpanMultiplier: -1 } });
    expect(bad.status).toBe(422);
    expect(bad.body.errors).toContainEqual(expect.objectContaining({ pointer: "/definition/cantileverSpanMultiplier" }));

    // 8 m, live 20 kN/m: I >= 2.29e8 mm^4 for live l/360 (AISC Manual Table 3-23 case 1; E 210,000 MPa,
    // EN 1993-1-1 3.2.6), so KPG 450x190 (3.21e8) is the lightest that passes and KPG 400x180 (2.19e8) fails.
    const doc = { ...createScheduleDoc([createCatalogueBeam("G-1", "KPG 240x120", 8, 20)]), profile: { id: created.body.id } };
    const submitted = await api().post("/api/v1/schedules").set("authorization", `Bearer ${manager}`).send(doc);
    expect(submitted.status).toBe(202);
    expect((await waitForSchedule(manager, submitted.body.id)).status).toBe("completed");
    const member = await api().get(`/api/v1/schedules/${submitted.body.id}/members/G-1`).set("authorization", `Bearer ${manager}`);
    expect(member.body).toMatchObject({ status: "fail", suggestion: { sectionName: "KPG 450x190" } });
    const passing = await api().post("/api/v1/schedules").set("authorization", `Bearer ${manager}`).send({ ...doc, members: [createCatalogueBeam("G-2", "KPG 450x190", 8, 20), createCatalogueBeam("G-3", "kpg 400 X180", 8, 20)] });
    expect((await waitForSchedule(manager, passing.body.id)).status).toBe("completed");
    const results = await api().get(`/api/v1/schedules/${passing.body.id}/results`).set("authorization", `Bearer ${manager}`);
    expect(results.body.data.map((r: { mark: string; status: string }) => [r.mark, r.status])).toEqual([
      ["G-2", "pass"],
      ["G-3", "fail"],
    ]);

    // A new version: the stored results stay; the recheck is a new schedule against version 3.
    const stored = await api().get(`/api/v1/limit-profiles/${created.body.id}`).set("authorization", `Bearer ${reader}`);
    expect(stored.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const definition = structuredClone(stored.body.versions[0].definition) as { combinations: { id: string; limitRatio: number }[] };
    definition.combinations.find((c) => c.id === "live")!.limitRatio = 100;
    await api().put(`/api/v1/limit-profiles/${created.body.id}`).set("authorization", `Bearer ${manager}`).send({ label: "Floors, live l/100", source: "in-house", definition });
    const before = await api().get(`/api/v1/schedules/${submitted.body.id}/members/G-1`).set("authorization", `Bearer ${manager}`);
    expect(before.body).toEqual(member.body);
    // a submitting key without criteria:manage may recheck: it is a submission
    const recheck = await api().post(`/api/v1/schedules/${submitted.body.id}/recheck`).set("authorization", `Bearer ${reader}`);
    expect(recheck.status).toBe(202);
    expect(recheck.body).toMatchObject({ id: expect.stringMatching(/^sch_/), status: "queued", memberCount: 1 });
    const rechecked = await waitForSchedule(manager, recheck.body.id);
    expect(rechecked).toMatchObject({ status: "completed", profile: { id: `${created.body.id}.v3` } });
    // the live row of the new version: 8000 mm / 100 = 80 mm allowed, where version 2 allowed 8000 / 360
    type Check = { combination: string; allowedMm: number; deflectionMm: number };
    const liveOf = (body: { checks: Check[] }) => body.checks.find((c) => c.combination === "live")!;
    const again = await api().get(`/api/v1/schedules/${recheck.body.id}/members/G-1`).set("authorization", `Bearer ${manager}`);
    expect(liveOf(again.body).allowedMm).toBeCloseTo(80, 9);
    expect(liveOf(member.body).allowedMm).toBeCloseTo(8000 / 360, 9);
    expect(liveOf(again.body).deflectionMm).toBeCloseTo(liveOf(member.body).deflectionMm, 9);
    expect((await api().post(`/api/v1/schedules/${recheck.body.id}/recheck`).set("authorization", `Bearer ${manager}`)).status).toBe(409);
  });
});

describe("/api/v1/materials", () => {
  it("adds, reads, changes and removes a material; refuses invalid values with pointers", async () => {
    const body = { name: "Verrel alloy 7 (invented)", family: "custom", eMpa: 100000, gMpa: null, densityKgPerM3: 7000, creepFactor: 0, source: "invented for this test" };
    const created = await api().post("/api/v1/materials").set("authorization", `Bearer ${manager}`).send(body);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ ...body, id: expect.stringMatching(/^mat_/) });
    const duplicate = await api().post("/api/v1/materials").set("authorization", `Bearer ${manager}`).send({ ...body, name: "VERREL alloy 7 (invented)" });
    expect(duplicate.status).toBe(409);
    const invalid = await api().post("/api/v1/materials").set("authorization", `Bearer ${manager}`).send({ ...body, eMpa: -1, family: "concrete" });
    expect(invalid.status).toBe(422);
    expect(invalid.body.errors.map((e: { pointer: string }) => e.pointer).sort()).toEqual(["/eMpa", "/family"]);
    const changed = await api().put(`/api/v1/materials/${created.body.id}`).set("authorization", `Bearer ${manager}`).send({ ...body, eMpa: 120000 });
    expect(changed.body.eMpa).toBe(120000);
    expect((await api().delete(`/api/v1/materials/${created.body.id}`).set("authorization", `Bearer ${other}`)).status).toBe(404);
    expect((await api().delete(`/api/v1/materials/${created.body.id}`).set("authorization", `Bearer ${manager}`)).status).toBe(204);
    expect((await api().get(`/api/v1/materials/${created.body.id}`).set("authorization", `Bearer ${manager}`)).status).toBe(404);
  });
});
