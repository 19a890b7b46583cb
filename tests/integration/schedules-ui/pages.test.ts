// The schedules pages over HTTP: who sees what, 404 for missing and foreign ids alike, hostile
// marks rendered as text, and the CSV export with formula prefixes neutralised.
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { demoOrganizations } from "@/db/seed-data";
import { SAFETY_CAUTION } from "@/lib/safety";
import { createTestKey } from "@/tests/helpers/api-keys";
import { APP_URL, anonymous, callAction, findAction, signInAs, type Agent } from "@/tests/helpers/app";
import { createBeam, createScheduleDoc, waitForSchedule as waitForApiSchedule } from "@/tests/helpers/schedules";

import { BEAM_HEADER, beamRow, toCsv, uploadCsv, waitForSchedule } from "./upload-helpers";

const HOSTILE_MARKS = {
  script: "<script>alert('x')</script>",
  formula: "=HYPERLINK(\"http://evil.example\",\"open\")",
  plus: "+SUM(A1:A9)",
  at: "@cmd",
  minus: "-2+3",
  // A literal percent escape and a slash: the mark must be decoded exactly once.
  percent: "R/2 at 50%41",
  long: "L".repeat(30) + "-ВЕРХНИЙ-梁-東側-" + "Ω".repeat(18),
};

let submitter: Agent;
let viewer: Agent;
let scheduleId: string;
let foreignId: string;

beforeAll(async () => {
  submitter = await signInAs("submitter");
  viewer = await signInAs("viewer");
  const rows = [BEAM_HEADER, beamRow("PG-F1", 50, 50), beamRow("PG-P1", 200, 600), ...Object.values(HOSTILE_MARKS).map((m) => beamRow(m, 200, 600))];
  const created = await uploadCsv(submitter, toCsv(rows), { name: "Pages test <b>bold</b> schedule", reference: "=REF()" });
  expect(created.status).toBe(202);
  scheduleId = created.body.id;
  await waitForSchedule(submitter, scheduleId);

  // The administrator also belongs to the fabricator: a schedule there is another organization's.
  const admin = await signInAs("admin");
  const switched = await callAction(admin, findAction("(dashboard)/switchOrganization"), { organizationId: demoOrganizations.fabricator.id });
  expect(switched.result?.ok).toBe(true);
  const foreign = await uploadCsv(admin, toCsv([BEAM_HEADER, beamRow("FOREIGN-1", 100, 300)]), { name: "Fabricator's own schedule" });
  expect(foreign.status).toBe(202);
  foreignId = foreign.body.id;
});

describe("the schedules list", () => {
  it("shows the organization's schedules to a viewer, without the submit button", async () => {
    const response = await viewer.get("/schedules");
    expect(response.status).toBe(200);
    expect(response.text).toContain("Pages test &lt;b&gt;bold&lt;/b&gt; schedule");
    expect(response.text).not.toContain("<b>bold</b>");
    expect(response.text).not.toContain("Fabricator&#x27;s own schedule");
    expect(response.text).not.toContain('href="/schedules/new"');
  });

  it("offers Submit a CSV to a submitter", async () => {
    const response = await submitter.get("/schedules");
    expect(response.text).toContain('href="/schedules/new"');
  });

  it("says so when a page cursor is not one Sagline issued", async () => {
    const response = await viewer.get("/schedules?cursor=not-a-cursor");
    expect(response.status).toBe(200);
    expect(response.text).toContain("not one Sagline issued");
  });
});

describe("the upload page", () => {
  for (const role of ["submitter", "engineer", "admin"] as const) {
    it(`opens for the ${role} role`, async () => {
      const response = await (await signInAs(role)).get("/schedules/new");
      expect(response.status).toBe(200);
      expect(response.text).toContain("Submit a CSV schedule");
    });
  }
  for (const role of ["viewer", "integrator"] as const) {
    it(`is forbidden to the ${role} role`, async () => {
      const response = await (await signInAs(role)).get("/schedules/new");
      expect(response.status).toBe(403);
    });
  }
});

describe("a schedule's results page", () => {
  it("shows the summary and every member with its outcome", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}`);
    expect(response.status).toBe(200);
    expect(response.text).toContain("IBC 2021 Table 1604.3");
    expect(response.text).toMatch(/data-status="fail"[^]*?PG-F1[^]*?Fail/);
    expect(response.text).toMatch(/data-status="pass"[^]*?PG-P1[^]*?Pass/);
  });

  it("filters by outcome", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}?status=fail`);
    expect(response.text).toContain("PG-F1");
    expect(response.text).not.toContain("PG-P1");
  });

  it("says an unknown filter value was not applied", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}?status=maybe`);
    expect(response.status).toBe(200);
    expect(response.text).toContain("Not applied");
    expect(response.text).toContain("PG-P1");
  });

  it("renders hostile marks as text", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}`);
    expect(response.text).not.toContain("<script>alert");
    expect(response.text).toContain("&lt;script&gt;alert(&#x27;x&#x27;)&lt;/script&gt;");
    expect(response.text).toContain(HOSTILE_MARKS.long);
    expect(response.text).toContain("+SUM(A1:A9)");
  });

  it("answers 404 alike for a missing id and another organization's id", async () => {
    const missing = await viewer.get("/schedules/sch_doesnotexist0000");
    const foreign = await viewer.get(`/schedules/${foreignId}`);
    expect(missing.status).toBe(404);
    expect(foreign.status).toBe(404);
    expect(foreign.text).not.toContain("Fabricator");
    // The ids differ; so may the streamed flight chunks, which split the same payload wherever
    // the server happened to flush (one wrapper is 43 characters): drop the wrappers before comparing.
    const strip = (html: string) => html.replace(/sch_[0-9a-z]+/g, "ID").replace(/<script>self\.__next_f\.push\(\[1,"|"\]\)<\/script>/g, "");
    expect(strip(foreign.text).length).toBe(strip(missing.text).length);
  });

  it("sends a visitor without a session to sign in, keeping the address", async () => {
    const response = await anonymous().get(`/schedules/${scheduleId}`).redirects(0);
    expect(response.status).toBe(307);
    expect(response.headers.location).toContain(encodeURIComponent(`/schedules/${scheduleId}`));
  });
});

describe("a member's page", () => {
  it("shows every check, the suggestion and the deflected shape", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}/members/PG-F1`);
    expect(response.status).toBe(200);
    expect(response.text).toContain("Member PG-F1");
    expect(response.text).toContain("Minimum second moment of area");
    expect(response.text).toContain("mm, + down");
    expect(response.text).toContain("Position from the left end (m)");
    // what was used: the section's I and the material's E, in the schedule's units
    expect(response.text).toContain("What was used");
    expect(response.text).toMatch(/data-support-kind="pinned"/);
    expect(response.text).toMatch(/<svg[^>]*role="img"/);
    // The checks table lists both combinations of the preset (IBC 2021 Table 1604.3: live, dead + live).
    expect(response.text).toContain("dead+live");
    // limit l/N beside the achieved l/N (the live row's limit is l/360, IBC 2021 Table 1604.3, from memory)
    expect(response.text).toContain("l/N achieved");
    expect(response.text).toContain("l/360");
  });

  it("names the first frequency as governing when a member fails on it alone", async () => {
    // 4 m S355 plate I with dead 3 kN/m, live 1 kN/m: every deflection passes (live about 0.2 mm
    // against l/360 = 11.1 mm, AISC Manual Table 3-23 case 1, from memory); f1 is about 25 Hz
    // ((pi / (2 L^2)) sqrt(EI / m), Roark's Formulas Table 16.1 case 1, from memory), below 40 Hz.
    const key = await createTestKey();
    const doc = { ...createScheduleDoc([createBeam("FQ-1", 4, 1)]), profile: { preset: "ibc-2021-floor-vibration", overrides: { frequency: { min: 40 } } } };
    const created = await request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(doc);
    expect(created.status).toBe(202);
    await waitForApiSchedule(key, created.body.id);
    const list = await viewer.get(`/schedules/${created.body.id}`);
    expect(list.text).toMatch(/data-status="fail"[^]*?FQ-1[^]*?frequency[^]*?Fail/);
    const member = await viewer.get(`/schedules/${created.body.id}/members/FQ-1`);
    expect(member.text).toMatch(/Governing: (<!-- -->)?frequency/);
    expect(member.text).toContain("The first frequency governs");
  });

  it("opens for a hostile mark and renders it as text", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}/members/${encodeURIComponent(HOSTILE_MARKS.script)}`);
    expect(response.status).toBe(200);
    expect(response.text).not.toContain("<script>alert");
    expect(response.text).toContain("Member &lt;script&gt;");
    const long = await viewer.get(`/schedules/${scheduleId}/members/${encodeURIComponent(HOSTILE_MARKS.long)}`);
    expect(long.status).toBe(200);
    const percent = await viewer.get(`/schedules/${scheduleId}/members/${encodeURIComponent(HOSTILE_MARKS.percent)}`);
    expect(percent.status).toBe(200);
    expect(percent.text).toContain("Member R/2 at 50%41");
  });

  it("answers 404 for a missing mark and another organization's schedule", async () => {
    expect((await viewer.get(`/schedules/${scheduleId}/members/NOPE`)).status).toBe(404);
    expect((await viewer.get(`/schedules/${foreignId}/members/FOREIGN-1`)).status).toBe(404);
  });
});

describe("the progress route", () => {
  it("answers JSON for the organization's schedule and 404 problem+json for a missing or foreign one", async () => {
    const own = await viewer.get(`/api/schedules/${scheduleId}/progress`);
    expect(own.status).toBe(200);
    expect(own.body).toMatchObject({ id: scheduleId, status: "completed", progress: { members: 9, checked: 9 } });
    for (const id of ["sch_doesnotexist0000", foreignId]) {
      const response = await viewer.get(`/api/schedules/${id}/progress`);
      expect(response.status).toBe(404);
      expect(response.headers["content-type"]).toContain("application/problem+json");
      expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/not-found", status: 404, detail: "The schedule was not found." });
    }
  });

  it("answers 401 without a session", async () => {
    expect((await anonymous().get(`/api/schedules/${scheduleId}/progress`)).status).toBe(401);
  });
});

describe("deflection direction", () => {
  it("shows an uplift as up on the results table and the member page, a sag as down", async () => {
    // S355 100 x 200 rectangle, 4 m, live -5 kN/m (upward): 5wL^4/(384EI) = 5 x 5 x 4000^4 /
    // (384 x 210,000 x 6.667e7) = 1.19 mm (AISC Manual Table 3-23 case 1; E per EN 1993-1-1 3.2.6; both from memory).
    const upliftRow = [...beamRow("PG-U1", 100, 200).slice(0, -1), "-5"];
    const created = await uploadCsv(submitter, toCsv([BEAM_HEADER, upliftRow, beamRow("PG-D1", 100, 200)]), { name: "Uplift schedule" });
    expect(created.status).toBe(202);
    await waitForSchedule(submitter, created.body.id);
    const results = await viewer.get(`/schedules/${created.body.id}`);
    expect(results.text).toContain("Deflection (mm)");
    expect(results.text).toMatch(/PG-U1[^]*?1\.19 up[^]*?PG-D1[^]*?1\.19 down/);
    const member = await viewer.get(`/schedules/${created.body.id}/members/PG-U1`);
    expect(member.text).toContain("1.19 mm up");
    expect(member.text).not.toContain("1.19 mm down");
  });
});

describe("the CSV export", () => {
  it("exports every result with formula prefixes neutralised", async () => {
    const response = await viewer.get(`/schedules/${scheduleId}/results.csv`).buffer(true);
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toContain("text/csv");
    const lines = response.text.trim().split("\r\n");
    expect(lines[0]).toBe("mark,category,status,governing_check,utilization,factor_of_safety,limit_ratio,achieved_ratio,notes,deflection_mm,allowed_deflection_mm,section,material,quantity,spans_mm,review_state");
    // nine members, the header, and the caution as the last line
    expect(lines).toHaveLength(11);
    expect(lines.at(-1)).toBe(`"# ${SAFETY_CAUTION}"`);
    // OWASP CSV injection guidance: a leading = + - @ is prefixed with a quote.
    expect(response.text).toContain(`"'=HYPERLINK(""http://evil.example"",""open"")"`);
    expect(response.text).toContain("'+SUM(A1:A9)");
    expect(response.text).toContain("'@cmd");
    expect(response.text).toContain("'-2+3");
    expect(response.text).not.toMatch(/(^|\r\n)[=+\-@]/);
  });

  it("applies the page's filters and refuses an unknown one", async () => {
    const failing = await viewer.get(`/schedules/${scheduleId}/results.csv?status=fail`).buffer(true);
    expect(failing.text.trim().split("\r\n").slice(1, -1).map((l) => l.split(",")[0])).toEqual(["PG-F1"]);
    const unknown = await viewer.get(`/schedules/${scheduleId}/results.csv?status=maybe`);
    expect(unknown.status).toBe(400);
  });

  it("answers 404 for another organization's schedule", async () => {
    expect((await viewer.get(`/schedules/${foreignId}/results.csv`)).status).toBe(404);
  });
});

describe("the CSV template", () => {
  it("downloads without a session", async () => {
    const response = await anonymous().get("/api/templates/schedule.csv").buffer(true);
    expect(response.status).toBe(200);
    expect(response.headers["content-type"]).toContain("text/csv");
    expect(response.text.startsWith("mark,category,quantity,material")).toBe(true);
  });
});

describe("concrete checked with its gross section", () => {
  it("says so on the results table, the member page and the CSV export", async () => {
    const rows = [BEAM_HEADER, ["PG-C1", "floor_beam", "1", "concrete-fc30", "rectangle", "300", "500", "4", "pinned roller", "5"]];
    const created = await uploadCsv(submitter, toCsv(rows), { name: "Pages test concrete" });
    expect(created.status).toBe(202);
    await waitForSchedule(submitter, created.body.id);
    const table = await viewer.get(`/schedules/${created.body.id}`);
    expect(table.text).toMatch(/PG-C1[^]*?gross section: cracking not included/);
    const member = await viewer.get(`/schedules/${created.body.id}/members/PG-C1`);
    expect(member.text).toContain("Assumptions and remarks");
    expect(member.text).toContain("gross section: cracking not included");
    const csv = await viewer.get(`/schedules/${created.body.id}/results.csv`).buffer(true);
    expect(csv.text.trim().split("\r\n")[1]).toMatch(/^PG-C1,.*gross section: cracking not included/);
  });
});
