// POST and GET /api/v1/schedules against the running server, the real worker, PostgreSQL and Redis.
import { beforeAll, describe, expect, it } from "vitest";
import request from "supertest";

import { demoOrganizations } from "@/db/seed-data";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";

let key: string;
let otherKey: string;
beforeAll(async () => {
  key = await createTestKey();
  otherKey = await createTestKey(["schedules:write", "results:read"], demoOrganizations.fabricator.id);
});

const api = () => request(APP_URL);
const problem = (code: string) => `https://sagline.dev/problems/${code}`;

describe("POST /api/v1/schedules", () => {
  it("accepts a JSON schedule with 202, checks it on the workers and serves the pass/fail table", async () => {
    // Hand check with 5wL^4/(384EI) (AISC Manual Table 3-23 case 1, from memory) and the plate
    // formula I = [bf d^3 - (bf - tw)(d - 2tf)^3]/12 = 8.0e7 mm^4, E = 210,000 MPa (EN 1993-1-1):
    // live 7.5 kN/m on 9 m deflects about 38 mm > 9000/360 = 25 mm (fail); on 4 m about 1.5 mm (pass).
    const doc = createScheduleDoc([createBeam("B-01", 4), createBeam("B-02", 9), createBeam("=HYPERLINK(\"x\")", 4)]);
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(doc);
    expect(response.status).toBe(202);
    expect(response.body).toMatchObject({ id: expect.stringMatching(/^sch_[0-9a-z]+$/), status: "queued", memberCount: 3 });
    expect(response.headers.location).toBe(`/api/v1/schedules/${response.body.id}`);

    const done = await waitForSchedule(key, response.body.id);
    expect(done).toMatchObject({ status: "completed", progress: { members: 3, checked: 3, fraction: 1 }, counts: { pass: 2, fail: 1, error: 0 } });

    const results = await api().get(`/api/v1/schedules/${response.body.id}/results`).set("authorization", `Bearer ${key}`);
    expect(results.status).toBe(200);
    expect(results.body.data.map((r: { mark: string; status: string }) => [r.mark, r.status])).toEqual([
      ["B-01", "pass"],
      ["B-02", "fail"],
      ['=HYPERLINK("x")', "pass"],
    ]);
    const failing = await api().get(`/api/v1/schedules/${response.body.id}/results?status=fail`).set("authorization", `Bearer ${key}`);
    expect(failing.body.data.map((r: { mark: string }) => r.mark)).toEqual(["B-02"]);

    const csv = await api().get(`/api/v1/schedules/${response.body.id}/results`).set("authorization", `Bearer ${key}`).set("accept", "text/csv");
    expect(csv.headers["content-type"]).toContain("text/csv");
    expect(csv.text.split("\r\n")[0]).toBe("mark,category,status,governing_check,utilization,factor_of_safety,limit_ratio,achieved_ratio,notes,deflection_mm,allowed_deflection_mm,section,material,quantity,spans_mm,review_state");
    // Formula injection: the cell starts with a quote so a spreadsheet shows it as text.
    expect(csv.text).toContain(`"'=HYPERLINK(""x"")",floor_beam,pass`);

    const member = await api().get(`/api/v1/schedules/${response.body.id}/members/B-02`).set("authorization", `Bearer ${key}`);
    expect(member.status).toBe(200);
    expect(member.body).toMatchObject({ mark: "B-02", status: "fail" });
    expect(member.body.checks.length).toBeGreaterThanOrEqual(2);
    expect(member.body.shape.length).toBeGreaterThan(10);
    // minimum I: the live check governs (7.5 x 360 > 10.5 x 240), so I = 5 w L^4 / (384 E L/360)
    // (AISC Manual Table 3-23 case 1, from memory) = 1.2204e8 mm^4; no springs, so the search
    // lands within 1e-9 above it
    const expectedMinIMm4 = (5 * 7.5 * 9000 ** 4) / (384 * 210_000 * (9000 / 360));
    expect(Math.abs(member.body.suggestion.minIMm4 / expectedMinIMm4 - 1)).toBeLessThan(1e-6);
  });

  it("names the first frequency as governing on every surface when a member fails on frequency alone", async () => {
    // S355 plate I, I = 8.0e7 mm^4 (as above), 4 m simply supported, dead 3 kN/m, live 1 kN/m:
    // live 5wL^4/(384EI) = 0.20 mm, far inside l/360 = 11.1 mm (AISC Manual Table 3-23 case 1,
    // from memory); f1 = (pi / (2 L^2)) sqrt(EI / m) with m = (3 + 0.1 x 1) kN/m / g is about
    // 24.6 Hz (Roark's Formulas Table 16.1 case 1, from memory), below the 40 Hz asked here.
    const iMm4 = (150 * 300 ** 3 - (150 - 7.1) * (300 - 21.4) ** 3) / 12;
    const liveMm = (5 * 1 * 4000 ** 4) / (384 * 210000 * iMm4);
    const f1Hz = (Math.PI / (2 * 4 ** 2)) * Math.sqrt((210000 * iMm4 * 1e-6) / (3100 / 9.80665));
    const doc = { ...createScheduleDoc([createBeam("F-01", 4, 1)]), profile: { preset: "ibc-2021-floor-vibration", overrides: { frequency: { min: 40 } } } };
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(doc);
    expect(response.status).toBe(202);
    expect(await waitForSchedule(key, response.body.id)).toMatchObject({ status: "completed", counts: { pass: 0, fail: 1 } });

    const results = await api().get(`/api/v1/schedules/${response.body.id}/results`).set("authorization", `Bearer ${key}`);
    expect(results.body.data).toEqual([expect.objectContaining({ mark: "F-01", status: "fail", governingCheck: "frequency", limitRatio: null, achievedRatio: null })]);
    expect(results.body.data[0].utilization).toBeCloseTo(40 / f1Hz, 2);
    const csv = await api().get(`/api/v1/schedules/${response.body.id}/results`).set("authorization", `Bearer ${key}`).set("accept", "text/csv");
    expect(csv.text.split("\r\n")[1]).toMatch(/^F-01,floor_beam,fail,frequency,[\d.]+,[\d.]+,,,/);

    const member = await api().get(`/api/v1/schedules/${response.body.id}/members/F-01`).set("authorization", `Bearer ${key}`);
    expect(member.body).toMatchObject({ governingCheck: "frequency", status: "fail" });
    const live = member.body.checks.find((c: { check: string }) => c.check === "live, span 1");
    expect(live).toMatchObject({ pass: true, limitRatio: 360 });
    expect(live.achievedRatio).toBeCloseTo(4000 / liveMm, 6);
  });

  it("flags concrete checked with its gross section on the results rows, the CSV export and the member answer", async () => {
    const concrete = { ...createBeam("G-01", 6), material: "concrete-fc30", section: { shape: "rectangle", b: 300, h: 500 } };
    const reinforced = { ...concrete, mark: "R-01", reinforcement: { tensionSteel: 1473, effectiveDepth: 440 } };
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc([concrete, reinforced]));
    expect(response.status).toBe(202);
    expect((await waitForSchedule(key, response.body.id)).status).toBe("completed");
    const results = await api().get(`/api/v1/schedules/${response.body.id}/results`).set("authorization", `Bearer ${key}`);
    expect(results.body.data[0].notes).toContain("gross section: cracking not included");
    expect(results.body.data[1].notes.join("\n")).toMatch(/^cracked section: I_e per ACI 318-19 Table 24\.2\.3\.5/m);
    const csv = await api().get(`/api/v1/schedules/${response.body.id}/results`).set("authorization", `Bearer ${key}`).set("accept", "text/csv");
    expect(csv.text.split("\r\n")[1]).toMatch(/gross section: cracking not included/);
    const member = await api().get(`/api/v1/schedules/${response.body.id}/members/G-01`).set("authorization", `Bearer ${key}`);
    expect(member.body.notes).toContain("gross section: cracking not included");
  });

  it("answers a continuous member with the spans its variable load was patterned on", async () => {
    // Two equal spans, live on both as given: each span is judged with only itself loaded
    // (ASCE 7-16 4.3.3 partial loading, from memory); the fixed tank load stays everywhere.
    const base = createBeam("C-01", 5);
    const loads: Record<string, unknown>[] = [...base.loads, { case: "live", type: "point", at: 2.5, P: 4, fixed: true }];
    const beam = { ...base, spans: [5, 5], supports: ["pinned", "roller", "roller"], loads };
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc([beam]));
    expect(response.status).toBe(202);
    expect((await waitForSchedule(key, response.body.id)).status).toBe("completed");
    const member = await api().get(`/api/v1/schedules/${response.body.id}/members/C-01`).set("authorization", `Bearer ${key}`);
    expect(member.status).toBe(200);
    const live = member.body.checks.filter((c: { combination: string }) => c.combination === "live");
    expect(live.map((c: { spanIndex: number; loadedSpans: unknown }) => [c.spanIndex, c.loadedSpans])).toEqual([
      [0, { live: [0] }],
      [1, { live: [1] }],
    ]);
  });

  it("accepts the same schedule as CSV with units in the headers", async () => {
    const csv = "mark,category,quantity,material,section,bf [mm],tf [mm],d [mm],tw [mm],span_1 [m],supports,dead_uniform [kN/m],live_uniform [kN/m]\r\nC-1,floor_beam,2,steel-s355,i_plate,150,10.7,300,7.1,4,pinned roller,3,7.5\r\n";
    const response = await api().post("/api/v1/schedules?profile=ibc-2021-floor&name=CSV%20test").set("authorization", `Bearer ${key}`).set("content-type", "text/csv").send(csv);
    expect(response.status).toBe(202);
    expect((await waitForSchedule(key, response.body.id)).status).toBe("completed");
  });

  it.each([
    ["bad JSON", "application/json", "{ not json", 400, "bad-request"],
    ["an unsupported media type", "application/xml", "<schedule/>", 415, "unsupported-media-type"],
  ])("answers %s with problem+json", async (_label, type, body, status, code) => {
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).set("content-type", type).send(body);
    expect(response.status).toBe(status);
    expect(response.headers["content-type"]).toContain("application/problem+json");
    expect(response.body).toMatchObject({ type: problem(code), status, instance: "/api/v1/schedules" });
  });

  it("refuses a schedule with any invalid member, listing every error with its pointer, and stores nothing", async () => {
    const bad = createScheduleDoc([createBeam("OK-1"), { ...createBeam("BAD-1"), spans: [0] }, { ...createBeam("BAD-2"), supports: ["pinned"] }]);
    const before = await api().get("/api/v1/schedules?limit=100").set("authorization", `Bearer ${key}`);
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(bad);
    expect(response.status).toBe(422);
    expect(response.body).toMatchObject({ type: problem("invalid-input"), title: "Invalid input", status: 422 });
    const pointers = response.body.errors.map((e: { pointer: string }) => e.pointer);
    expect(pointers.some((p: string) => p.startsWith("/members/1/spans/0"))).toBe(true);
    expect(pointers.some((p: string) => p.startsWith("/members/2/supports"))).toBe(true);
    expect(response.body.errorCount).toBe(response.body.errors.length);
    const after = await api().get("/api/v1/schedules?limit=100").set("authorization", `Bearer ${key}`);
    expect(after.body.data.length).toBe(before.body.data.length);
  });

  it("refuses a 1e308 mm span on its own pointer with the reason, not as a singular matrix (range: lib/engine/input-bounds.ts)", async () => {
    const bad = createScheduleDoc([{ ...createBeam("HUGE-1"), spans: [{ value: 1e308, unit: "mm" }] }]);
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(bad);
    expect(response.status).toBe(422);
    expect(response.body.errors).toEqual([{ pointer: "/members/0/spans/0", message: expect.stringMatching(/^must be at most 1,000,000 mm: /) }]);
  });

  it("refuses the same out-of-range span in CSV on its row and column", async () => {
    const csv = "mark,category,quantity,material,section,bf [mm],tf [mm],d [mm],tw [mm],span_1 [mm],supports,dead_uniform [kN/m],live_uniform [kN/m]\r\nC-1,floor_beam,1,steel-s355,i_plate,150,10.7,300,7.1,1e308,pinned roller,3,7.5\r\n";
    const response = await api().post("/api/v1/schedules?profile=ibc-2021-floor").set("authorization", `Bearer ${key}`).set("content-type", "text/csv").send(csv);
    expect(response.status).toBe(422);
    expect(response.body.errors).toHaveLength(1);
    expect(response.body.errors[0]).toMatchObject({ row: 2, column: "span_1 [mm]", message: expect.stringMatching(/at most 1,000,000 mm/) });
  });

  it("reports CSV row errors with row, line, column and code", async () => {
    const csv = 'mark,category,quantity,material,section,bf [mm],tf [mm],d [mm],tw [mm],span_1 [m],supports,dead_uniform [kN/m],live_uniform [kN/m],notes\r\nC-1,floor_beam,1,steel-s355,i_plate,150,10.7,300,7.1,4,pinned roller,3,7.5,"two\r\nlines"\r\nC-2,floor_beam,1,steel-s355,i_plate,150,10.7,300,7.1,abc,pinned roller,3,7.5,\r\n';
    const response = await api().post("/api/v1/schedules?profile=ibc-2021-floor").set("authorization", `Bearer ${key}`).set("content-type", "text/csv").send(csv);
    expect(response.status).toBe(422);
    const error = response.body.errors.find((e: { column: string }) => e.column.startsWith("span_1"));
    // The quoted newline in row 2 puts row 3 on line 4.
    expect(error).toMatchObject({ row: 3, line: 4, column: "span_1 [m]" });
    expect(typeof error.code).toBe("string");
  });

  it("refuses a CSV without its limit profile naming the parameter", async () => {
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).set("content-type", "text/csv").send("mark\r\nx\r\n");
    expect(response.status).toBe(400);
    expect(response.body.errors).toContainEqual({ pointer: "/query/profile", message: expect.stringContaining("limit profile") });
  });

  it("refuses the retired limits parameter and a delimiter given as a character, naming each", async () => {
    const response = await api().post("/api/v1/schedules?limits=ibc-2021-floor&delimiter=%3B").set("authorization", `Bearer ${key}`).set("content-type", "text/csv").send("mark\r\nx\r\n");
    expect(response.status).toBe(400);
    expect(response.body.errors).toEqual([
      { pointer: "/query/delimiter", message: 'must be "comma", "semicolon" or "tab"' },
      { pointer: "/query/limits", message: expect.stringContaining("profile=") },
    ]);
  });

  it("refuses a sagline.schedule/v1 document with a problem that says what changed, storing nothing", async () => {
    const v1 = { ...createScheduleDoc([createBeam("V1-1", 4)]), format: "sagline.schedule/v1", limits: { preset: "ibc-2021-floor" } };
    const response = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(v1);
    expect(response.status).toBe(422);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.body).toMatchObject({
      type: "https://sagline.dev/problems/schedule-format-retired",
      title: "Schedule format retired",
      status: 422,
      currentFormat: "sagline.schedule/v2",
      errors: [{ pointer: "/format", message: expect.stringMatching(/"limits" block is now "profile".*OUTER width and depth/) }],
    });
    expect(response.body.detail).toContain("CHANGELOG.md");
  });
});

describe("reading schedules", () => {
  it("answers another organization's schedule exactly like a missing one", async () => {
    const created = await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc([createBeam("X-1")]));
    const foreign = await api().get(`/api/v1/schedules/${created.body.id}`).set("authorization", `Bearer ${otherKey}`);
    const missing = await api().get("/api/v1/schedules/sch_doesnotexist0000").set("authorization", `Bearer ${otherKey}`);
    expect(foreign.status).toBe(404);
    expect({ ...foreign.body, instance: undefined }).toEqual({ ...missing.body, instance: undefined });
    for (const path of ["results", "members/X-1"]) {
      const r = await api().get(`/api/v1/schedules/${created.body.id}/${path}`).set("authorization", `Bearer ${otherKey}`);
      expect(r.status, path).toBe(404);
    }
  });

  it("paginates the list with a Link header and refuses a forged cursor", async () => {
    for (let i = 0; i < 3; i += 1) await api().post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc([createBeam(`P-${i}`)]));
    const first = await api().get("/api/v1/schedules?limit=2").set("authorization", `Bearer ${key}`);
    expect(first.body.data).toHaveLength(2);
    expect(first.headers.link).toMatch(/^<\/api\/v1\/schedules\?limit=2&cursor=[A-Za-z0-9_-]+>; rel="next"$/);
    const nextPath = /<([^>]+)>/.exec(String(first.headers.link))![1]!;
    const second = await api().get(nextPath).set("authorization", `Bearer ${key}`);
    expect(second.body.data[0].id).not.toBe(first.body.data[1].id);
    const forged = await api().get("/api/v1/schedules?cursor=not-a-cursor").set("authorization", `Bearer ${key}`);
    expect(forged.status).toBe(400);
    expect(forged.body.errors).toEqual([{ pointer: "/query/cursor", message: "use the cursor from a Link header or links.next" }]);
  });
});
