// GET /api/v1/schedules/{id}/results and the dashboard's live route against the running server:
// sorting, filters, mark search, keyset links both ways, page numbers, the CSV columns, and exact
// 400 problems for crafted cursors and unknown values.
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { SAFETY_CAUTION } from "@/lib/safety";
import { encodeResultCursor } from "@/lib/server/schedules/result-query";
import { createTestKey } from "@/tests/helpers/api-keys";
import { APP_URL, signInAs, type Agent } from "@/tests/helpers/app";
import { createFixtureMembers, insertResultsFixture, sortFixture, type FixtureMember } from "@/tests/helpers/results-fixture";

let key: string;
let foreignKey: string;
let members: FixtureMember[];
let scheduleId: string;
let viewer: Agent;

beforeAll(async () => {
  key = await createTestKey(["results:read"]);
  foreignKey = await createTestKey(["results:read"], demoOrganizations.fabricator.id);
  members = createFixtureMembers(130);
  scheduleId = await insertResultsFixture(members);
  viewer = await signInAs("viewer");
});

const get = (path: string) => request(APP_URL).get(path).set("authorization", `Bearer ${key}`);
const results = (query = "") => `/api/v1/schedules/${scheduleId}/results${query}`;
const b64 = (value: unknown) => Buffer.from(JSON.stringify(value)).toString("base64url");

describe("sorting and keyset links", () => {
  it("follows links.next through every member by utilization, then links.previous back", async () => {
    const expected = sortFixture(members, "utilization").map((m) => m.mark);
    const seen: string[][] = [];
    let path: string | null = results("?sort=utilization&limit=40");
    let body: { data: { mark: string }[]; page: { number: number; count: number; total: number }; links: { next: string | null; previous: string | null } } | undefined;
    while (path) {
      const response = await get(path);
      expect(response.status).toBe(200);
      body = response.body;
      seen.push(body!.data.map((r) => r.mark));
      expect(body!.page).toEqual({ number: seen.length, count: 4, total: 130 });
      path = body!.links.next;
    }
    expect(seen.flat()).toEqual(expected);
    const back = await get(body!.links.previous!);
    expect(back.body.data.map((r: { mark: string }) => r.mark)).toEqual(seen[2]);
    expect(back.body.page.number).toBe(3);
  });

  it("jumps to a page by number", async () => {
    const response = await get(results("?sort=mark&limit=20&page=3"));
    expect(response.body.data.map((r: { mark: string }) => r.mark)).toEqual(sortFixture(members, "mark").slice(40, 60).map((m) => m.mark));
    expect(response.body.page).toEqual({ number: 3, count: 7, total: 130 });
  });

  it("searches by mark prefix, case-insensitively, with filters", async () => {
    const response = await get(results("?mark=b-00&status=fail"));
    const expected = members.filter((m) => m.mark.toLowerCase().startsWith("b-00") && !m.pass && !m.error).map((m) => m.mark);
    expect(expected.length).toBeGreaterThan(0);
    expect(response.body.data.map((r: { mark: string }) => r.mark)).toEqual(expected);
    expect(response.body.page.total).toBe(expected.length);
  });

  it("answers awaiting review from the review table", async () => {
    const response = await get(results("?review=awaiting&limit=200"));
    expect(response.body.data.map((r: { mark: string }) => r.mark)).toEqual(members.filter((m) => !m.pass && m.awaitingReview).map((m) => m.mark));
    expect(response.body.data.every((r: { review: { state: string } }) => r.review.state === "awaiting_review")).toBe(true);
  });
});

describe("the CSV", () => {
  it("carries deflection, allowed and l/N columns with units, and ends with the caution", async () => {
    const response = await get(results("?format=csv&status=error")).buffer(true);
    expect(response.status).toBe(200);
    const lines = response.text.trimEnd().split("\r\n");
    expect(lines[0]).toBe("mark,category,status,governing_check,utilization,factor_of_safety,limit_ratio,achieved_ratio,notes,deflection_mm,allowed_deflection_mm,section,material,quantity,spans_mm,review_state");
    expect(lines.slice(1, -1).map((l) => l.split(",")[0])).toEqual(members.filter((m) => m.error).map((m) => m.mark));
    expect(lines.at(-1)).toBe(`"# ${SAFETY_CAUTION}"`);
  });
});

describe("refusals", () => {
  const badRequest = (detail: string, pointer: string, message: string) => ({
    type: "https://sagline.dev/problems/bad-request",
    title: "Malformed request",
    status: 400,
    detail,
    instance: `/api/v1/schedules/${scheduleId}/results`,
    errors: [{ pointer, message }],
  });
  const cursorMessage = "is not a cursor Sagline issued; use links.next or start again without it";

  it.each([
    ["not base64url", "%%%"],
    ["an array", b64([1])],
    ["an unknown field", b64({ s: "mark", k: "a", i: 0, b: 0, p: 2, sql: "drop" })],
    ["a NUL in the mark", b64({ s: "mark", k: "\u0000", i: 0, b: 0, p: 2 })],
    ["an index past int4", b64({ after: 2 ** 40 })],
    ["a string where a number goes", b64({ s: "utilization", k: "1; select 1", i: 0, b: 0, p: 2 })],
  ])("answers 400 for a crafted cursor: %s", async (_name, cursor) => {
    const response = await get(results(`?sort=${cursor.startsWith("%") ? "schedule" : "mark"}&cursor=${encodeURIComponent(cursor)}`));
    expect(response.status).toBe(400);
    expect(response.headers["content-type"]).toContain("application/problem+json");
    expect(response.body).toEqual(badRequest(`Query parameter not accepted: cursor ${cursorMessage}.`, "/query/cursor", cursorMessage));
  });

  it("answers 400 for a cursor of another ordering", async () => {
    const cursor = encodeResultCursor({ sort: "mark", key: "b", index: 1, back: false, page: 2 });
    const response = await get(results(`?sort=utilization&cursor=${cursor}`));
    expect(response.body).toEqual(badRequest("Query parameter not accepted: cursor belongs to the mark ordering, not utilization.", "/query/cursor", "belongs to the mark ordering, not utilization"));
  });

  it.each([
    ["sort=weight", "/query/sort"],
    ["status=maybe", "/query/status"],
    ["category=girder", "/query/category"],
    ["utilizationAbove=lots", "/query/utilizationAbove"],
    [`mark=${"m".repeat(65)}`, "/query/mark"],
    ["page=0", "/query/page"],
  ])("answers 400 naming the parameter for %s", async (query, pointer) => {
    const response = await get(results(`?${query}`));
    expect(response.status).toBe(400);
    expect(response.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual([pointer]);
  });

  it("answers 404 for another organization's schedule", async () => {
    const response = await request(APP_URL).get(results()).set("authorization", `Bearer ${foreignKey}`);
    expect(response.status).toBe(404);
  });
});

describe("the dashboard's live route", () => {
  it("serves the page's view to a session and refuses crafted cursors", async () => {
    const response = await viewer.get(`/api/schedules/${scheduleId}/results?status=fail&sort=utilization`);
    expect(response.status).toBe(200);
    expect(response.body.schedule).toMatchObject({ status: "completed", members: 130 });
    expect(response.body.rows.map((r: { mark: string }) => r.mark)).toEqual(sortFixture(members.filter((m) => !m.pass && !m.error), "utilization").slice(0, 50).map((m) => m.mark));
    expect((await viewer.get(`/api/schedules/${scheduleId}/results?cursor=${b64({ after: "x" })}`)).status).toBe(400);
  });

  it("answers 401 without a session", async () => {
    expect((await request(APP_URL).get(`/api/schedules/${scheduleId}/results`)).status).toBe(401);
  });
});

describe("the printable record", () => {
  it("lists the members that did not pass with their decisions as text, and the caution", async () => {
    const failed = members.find((m) => !m.pass && !m.error && !m.awaitingReview)!;
    await getSql()`
      insert into member_dispositions (organization_id, schedule_id, member_index, mark, kind, justification, decided_by_name)
      values (${demoOrganizations.engineering.id}, ${scheduleId}, ${failed.memberIndex}, ${failed.mark}, 'member_to_be_revised', '<b>deepen</b> the section (invented)', 'Invented Engineer')`;
    const response = await viewer.get(`/schedules/${scheduleId}/record`);
    expect(response.status).toBe(200);
    expect(response.text).toContain(SAFETY_CAUTION);
    for (const m of members.filter((x) => !x.pass)) expect(response.text).toContain(`>${m.mark}<`);
    expect(response.text).not.toContain(`>${members.find((x) => x.pass)!.mark}<`);
    expect(response.text).toContain("&lt;b&gt;deepen&lt;/b&gt; the section (invented)");
    expect(response.text).toContain("Invented Engineer");
    expect(response.text).toContain("Awaiting review");
    expect((await request(APP_URL).get(`/schedules/${scheduleId}/record`).redirects(0)).status).toBe(307);
  });
});
