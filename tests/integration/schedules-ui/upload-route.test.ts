// POST /api/schedules/upload: the dashboard's cookie-session CSV upload, over real HTTP.
import { request as httpRequest } from "node:http";

import { beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { anonymous, signInAs, type Agent } from "@/tests/helpers/app";

import { BEAM_HEADER, beamRow, toCsv, uploadCsv, waitForSchedule } from "./upload-helpers";

let submitter: Agent;
beforeAll(async () => {
  submitter = await signInAs("submitter");
});

async function countSchedules(): Promise<number> {
  const [row] = await getSql()`select count(*)::int as n from schedules`;
  return row!.n as number;
}

describe("a good CSV", () => {
  it("answers 202 with the schedule id, and the workers check every member", async () => {
    // Simply supported, uniform load: deflection = 5 w L^4 / (384 E I) (AISC Manual Table 3-23 case 1, from memory);
    // E = 210,000 MPa for S355 (EN 1993-1-1 3.2.6); allowed = L/360 under live (IBC 2021 Table 1604.3, from memory).
    // 50 x 50: I = 50 * 50^3 / 12 = 520,833 mm^4; 5 * 5 N/mm * 4000^4 / (384 * 210000 * 520833) = 152.38 mm;
    // allowed 4000 / 360 = 11.11 mm; utilization 152.38 / 11.11 = 13.71 (fails).
    // 200 x 600: I = 3.6e9 mm^4; deflection 0.0220 mm; utilization 0.0020 (passes).
    const csv = toCsv([BEAM_HEADER, beamRow("UP-F1", 50, 50), beamRow("UP-P1", 200, 600)]);
    const response = await uploadCsv(submitter, csv, { name: "Upload route good CSV", reference: "T-UP-1" });
    expect(response.status).toBe(202);
    expect(response.body).toMatchObject({ id: expect.stringMatching(/^sch_[0-9a-z]+$/), status: "queued", memberCount: 2 });
    const done = await waitForSchedule(submitter, response.body.id);
    expect(done).toMatchObject({ status: "completed", progress: { members: 2, checked: 2 }, counts: { pass: 1, fail: 1, error: 0 } });

    const [stored] = await getSql()`select name, reference, source, submitted_by_user_id from schedules where id = ${response.body.id}`;
    expect(stored).toMatchObject({ name: "Upload route good CSV", reference: "T-UP-1", source: "upload", submitted_by_user_id: "usr_demosubmitter" });
    const outcomes = await getSql()`select mark, pass, utilization from member_outcomes where schedule_id = ${response.body.id} order by mark`;
    expect(outcomes.map((o) => [o.mark, o.pass])).toEqual([["UP-F1", false], ["UP-P1", true]]);
    expect(outcomes[0]!.utilization).toBeCloseTo(13.714, 2);
    expect(outcomes[1]!.utilization).toBeCloseTo(0.00198, 4);
  });

  it("takes a semicolon file when the delimiter says so, and US units for bare headers", async () => {
    // 4 ft span, 0.2 klf: the same beams, only to prove the units reached intake (US defaults: ft, in, klf).
    const csv = "mark;category;quantity;material;section;b;h;span_1;supports;live_uniform\r\nUS-1;floor_beam;1;steel-a992;rectangle;4;12;8;pinned roller;0.2\r\n";
    const response = await uploadCsv(submitter, csv, { delimiter: "semicolon", units: "US" });
    expect(response.status).toBe(202);
    const [stored] = await getSql()`select header from schedules where id = ${response.body.id}`;
    expect((stored!.header as { units: unknown }).units).toEqual({ system: "US" });
  });

  it("reads a body above the proxy's 10 MB copy limit in full (the upload route is outside the proxy)", async () => {
    const csv = toCsv([BEAM_HEADER, beamRow("BIG-1", 100, 300)]);
    const padding = "p".repeat(12 * 1024 * 1024);
    const response = await submitter
      .post("/api/schedules/upload")
      .set("Origin", process.env.APP_URL!)
      .field("padding", padding)
      .field("name", "Large body")
      .field("profile", "ibc-2021-floor")
      .field("units", "SI")
      .attach("file", Buffer.from(csv), { filename: "big.csv", contentType: "text/csv" });
    expect(response.status).toBe(202);
  });
});

describe("a bad CSV", () => {
  it("answers 422 naming row, line and column for every bad row, and stores nothing", async () => {
    const before = await countSchedules();
    // Row 2's notes hold a quoted line break, so row 3 starts on line 4.
    const csv = toCsv([
      [...BEAM_HEADER, "notes"],
      [...beamRow("B1", 100, 300), "two\nlines"],
      ["B2", "floor_beam", "two", "steel-s355", "rectangle", "100", "300", "5,5", "pinned roller", "5", ""],
    ]);
    const response = await uploadCsv(submitter, csv);
    expect(response.status).toBe(422);
    expect(response.headers["content-type"]).toContain("application/problem+json");
    expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/invalid-input", status: 422, errorCount: 2 });
    expect(response.body.errors).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ row: 3, line: 4, column: "quantity", code: "invalid_number" }),
        expect.objectContaining({ row: 3, line: 4, column: "span_1 [m]", code: "invalid_number", message: expect.stringContaining("5.5") }),
      ]),
    );
    expect(await countSchedules()).toBe(before);
  });

  it("re-addresses intake problems to the row and column they came from", async () => {
    const csv = toCsv([BEAM_HEADER, beamRow("S1", 100, 300), [...beamRow("S2", 100, 300).slice(0, 8), "pinned", "5"]]);
    const response = await uploadCsv(submitter, csv);
    expect(response.status).toBe(422);
    expect(response.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ row: 3, line: 3, column: "supports", message: expect.stringContaining("support") })]));
    expect(response.body.errors.every((e: { row: number }) => e.row === 3)).toBe(true);
  });

  it("names a missing parameter", async () => {
    const response = await uploadCsv(submitter, toCsv([BEAM_HEADER, beamRow("M1", 100, 300)]), { profile: undefined });
    expect(response.status).toBe(400);
    expect(response.body.errors).toEqual([expect.objectContaining({ pointer: "/query/profile" })]);
  });

  it("refuses a body declared over 64 MB with 413 problem+json, before reading it", async () => {
    // Raw HTTP: the headers promise 64 MB + 1 and only a few bytes follow; the answer must come anyway.
    const session = await submitter.get("/api/auth/session");
    const cookie = (session as unknown as { req: { getHeader(name: string): unknown } }).req.getHeader("cookie");
    expect(String(cookie)).toContain("session-token");
    const { status, body } = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      const req = httpRequest(`${process.env.APP_URL}/api/schedules/upload`, {
        method: "POST",
        headers: {
          origin: process.env.APP_URL!,
          cookie: String(cookie ?? ""),
          "content-type": "multipart/form-data; boundary=sagline-test",
          "content-length": String(64 * 1024 * 1024 + 1),
        },
      });
      req.on("response", (res) => {
        let text = "";
        res.on("data", (chunk) => (text += chunk));
        res.on("end", () => {
          resolve({ status: res.statusCode ?? 0, body: text });
          req.destroy();
        });
      });
      req.on("error", reject);
      req.write("--sagline-test\r\n");
    });
    expect(status).toBe(413);
    expect(JSON.parse(body)).toMatchObject({ type: "https://sagline.dev/problems/too-large", status: 413, limitBytes: 64 * 1024 * 1024 });
  });

  it("refuses a body that is not multipart", async () => {
    const response = await submitter.post("/api/schedules/upload").set("Origin", process.env.APP_URL!).set("content-type", "text/csv").send("mark\r\n");
    expect(response.status).toBe(415);
    expect(response.headers["content-type"]).toContain("application/problem+json");
  });
});

describe("who may upload", () => {
  const csv = toCsv([BEAM_HEADER, beamRow("W1", 100, 300)]);

  for (const role of ["viewer", "integrator"] as const) {
    it(`refuses the ${role} role with 403`, async () => {
      const response = await uploadCsv(await signInAs(role), csv);
      expect(response.status).toBe(403);
      expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/forbidden", status: 403 });
    });
  }

  for (const role of ["engineer", "admin"] as const) {
    it(`accepts the ${role} role`, async () => {
      const response = await uploadCsv(await signInAs(role), csv);
      expect(response.status).toBe(202);
    });
  }

  it("answers 401 without a session", async () => {
    const response = await uploadCsv(anonymous(), csv);
    expect(response.status).toBe(401);
    expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/unauthenticated", status: 401 });
  });

  for (const origin of ["http://evil.example", "null", null]) {
    it(`refuses a cookie upload from origin ${String(origin)} with 403`, async () => {
      const before = await countSchedules();
      const response = await uploadCsv(submitter, csv, {}, origin);
      expect(response.status).toBe(403);
      expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/bad-origin", status: 403 });
      expect(await countSchedules()).toBe(before);
    });
  }
});
