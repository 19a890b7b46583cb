// The glossary (docs/glossary.md, lib/vocabulary.ts) on every surface: the API's JSON Schemas and
// real answers, the CSV export header, the webhook schemas, the CLI's table and --json document,
// and the dashboard's schedule page as a signed-in engineer sees it. A surface that renames an
// idea, or brings back a retired name, fails here.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { RESULT_CSV_HEADER } from "@/lib/server/schedules/represent";
import { FREQUENCY_CHECK_NAME, OUTCOME_LABELS, OUTCOMES, TERMS } from "@/lib/vocabulary";
import { createTestKey } from "@/tests/helpers/api-keys";
import { APP_URL, signInAs } from "@/tests/helpers/app";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type JsonObject = { [key: string]: Json };

/** A check name as the glossary writes it: "live, span 1", "total, left overhang", "frequency". */
const CHECK_NAME = /^(frequency|[a-z][a-z0-9_+.-]*, (span [1-9]\d*|left overhang|right overhang))$/;

// Names the glossary retired; none may come back as a JSON member anywhere in api-schemas/.
const RETIRED_JSON_NAMES = ["limits", "nextCursor", "reason", "passed", "failed", "FoS", "fos", "factor_of_safety", "governing_check"];

function walkFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? walkFiles(path) : [path];
  });
}

const schemaFiles = walkFiles("api-schemas").filter((f) => f.endsWith(".json"));
const readSchema = (file: string) => JSON.parse(readFileSync(file, "utf8")) as JsonObject;

/** Every `properties` object in a schema, with the JSON path to it. */
function collectProperties(node: Json, path: string, out: { path: string; properties: JsonObject }[]) {
  if (Array.isArray(node)) node.forEach((child, i) => collectProperties(child, `${path}[${i}]`, out));
  else if (node !== null && typeof node === "object") {
    for (const [key, value] of Object.entries(node)) {
      if (key === "properties" && value !== null && typeof value === "object" && !Array.isArray(value)) out.push({ path, properties: value });
      collectProperties(value, `${path}/${key}`, out);
    }
  }
  return out;
}

/** The `properties` of the object at a dotted path of properties (`data.rows[]`). */
function propertiesAt(schema: JsonObject, path: string): JsonObject {
  let node: JsonObject = schema;
  for (const step of path.split(".")) {
    const isArray = step.endsWith("[]");
    node = (node.properties as JsonObject)[isArray ? step.slice(0, -2) : step] as JsonObject;
    if (isArray) node = node.items as JsonObject;
  }
  return node.properties as JsonObject;
}

// A member with a left overhang, so the span names are tested where v1 miscounted: the overhang is
// named, and the user's first span stays "span 1". A 4 m beam passes span/360 and a 9 m one fails
// (5wL^4/(384EI), AISC Manual Table 3-23 case 1, from memory).
const overhanging = { ...createBeam("V-OH", 5), overhangs: { left: 2 } };
const doc = createScheduleDoc([createBeam("V-01", 4), createBeam("V-02", 9), overhanging], "Glossary contract, Fenwick Quay");

let key: string;
let scheduleId: string;
beforeAll(async () => {
  key = await createTestKey();
  const accepted = await request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(doc);
  expect(accepted.status).toBe(202);
  scheduleId = accepted.body.id as string;
  await waitForSchedule(key, scheduleId);
});

describe("API and webhook schemas use the glossary's names", () => {
  it("bring back no retired name in any api-schemas file", () => {
    const found = schemaFiles.flatMap((file) =>
      collectProperties(readSchema(file), "", [])
        .flatMap(({ path, properties }) => Object.keys(properties).filter((name) => RETIRED_JSON_NAMES.includes(name)).map((name) => `${file}${path}: ${name}`)),
    );
    expect(found).toEqual([]);
  });

  it("name the outcome status, with the outcome words, on every result row and no pass flag beside it", () => {
    const rows = [
      propertiesAt(readSchema("api-schemas/v1/results-page.schema.json"), "data[]"),
      propertiesAt(readSchema("api-schemas/v1/events/schedule.completed.schema.json"), "data.rows[]"),
    ];
    for (const row of rows) {
      expect((row[TERMS.outcome.json] as JsonObject).enum).toEqual([...OUTCOMES]);
      expect(row).not.toHaveProperty("pass");
      for (const term of [TERMS.governingCheck, TERMS.utilization, TERMS.factorOfSafety, TERMS.limitRatio, TERMS.achievedRatio, TERMS.notes]) expect(row).toHaveProperty(term.json);
    }
    const cliMember = ((readSchema("api-schemas/v1/result.schema.json").$defs as JsonObject).member as JsonObject).properties as JsonObject;
    expect(cliMember).toHaveProperty(TERMS.outcome.json);
    expect(cliMember).not.toHaveProperty("pass");
  });

  it("key counts by the outcome words everywhere", () => {
    const counts = [
      propertiesAt(readSchema("api-schemas/v1/schedule-status.schema.json"), "counts"),
      propertiesAt(readSchema("api-schemas/v1/events/schedule.completed.schema.json"), "data.counts"),
      propertiesAt(readSchema("api-schemas/v1/result.schema.json"), "counts"),
    ];
    for (const c of counts) for (const outcome of OUTCOMES) expect(c).toHaveProperty(outcome);
  });

  it("name the profile, the failure reason and the next page one way", () => {
    expect(readSchema("api-schemas/v1/schedule.schema.json").properties).toHaveProperty(TERMS.profile.json);
    expect(readSchema("api-schemas/v1/schedule-status.schema.json").properties).toHaveProperty(TERMS.profile.json);
    expect(readSchema("api-schemas/v1/schedule-status.schema.json").properties).toHaveProperty(TERMS.failureReason.json);
    expect(propertiesAt(readSchema("api-schemas/v1/events/schedule.failed.schema.json"), "data")).toHaveProperty(TERMS.failureReason.json);
    for (const list of ["api-key-list", "results-page"]) expect(propertiesAt(readSchema(`api-schemas/v1/${list}.schema.json`), "links")).toHaveProperty("next");
  });
});

describe("real answers use the glossary's names", () => {
  it("results (JSON), counts and the member answer", async () => {
    const auth = { authorization: `Bearer ${key}` };
    const status = await request(APP_URL).get(`/api/v1/schedules/${scheduleId}`).set(auth);
    expect(Object.keys(status.body.counts).sort()).toEqual([...OUTCOMES].sort());
    expect(status.body).toHaveProperty(TERMS.profile.json);
    const results = await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/results`).set(auth);
    const rows = results.body.data as Record<string, unknown>[];
    expect(rows.map((r) => r[TERMS.outcome.json])).toEqual(["pass", "fail", expect.stringMatching(/^(pass|fail)$/)]);
    for (const row of rows) expect(String(row[TERMS.governingCheck.json]), String(row.mark)).toMatch(CHECK_NAME);
    const member = await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/members/V-OH`).set(auth);
    const names = (member.body.checks as { check: string }[]).map((c) => c.check);
    expect(names).toEqual(expect.arrayContaining(["live, left overhang", "live, span 1"]));
    expect(names.every((name) => CHECK_NAME.test(name))).toBe(true);
    expect(names.some((name) => name.includes("span 2"))).toBe(false);
    // the filter takes the same words the rows carry
    const failing = await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/results?${TERMS.outcome.query}=fail`).set(auth);
    expect((failing.body.data as { mark: string }[]).map((r) => r.mark)).toContain("V-02");
  });

  it("the CSV export header is the glossary's column names", async () => {
    const csv = await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/results?format=csv`).set("authorization", `Bearer ${key}`);
    const header = csv.text.split("\r\n")[0]!.split(",");
    expect(header).toEqual(RESULT_CSV_HEADER);
    for (const term of [TERMS.outcome, TERMS.governingCheck, TERMS.utilization, TERMS.factorOfSafety, TERMS.limitRatio, TERMS.achievedRatio, TERMS.notes]) expect(header).toContain(term.csv);
    expect(csv.text).toContain('"live, span 1"');
  });
});

describe("the command line uses the glossary's names", () => {
  const dir = mkdtempSync(join(tmpdir(), "sagline-glossary-"));
  const file = join(dir, "schedule.json");
  writeFileSync(file, JSON.stringify(doc));
  const run = (...args: string[]) => spawnSync(process.execPath, ["--import", "tsx", "lib/cli/check.ts", file, ...args], { encoding: "utf8", timeout: 120_000 });

  it("in the table", () => {
    const { stdout } = run();
    const lines = stdout.split("\n");
    const header = lines.find((line) => line.startsWith("mark "))!;
    for (const term of [TERMS.governingCheck, TERMS.utilization, TERMS.factorOfSafety, TERMS.outcome, TERMS.limitRatio, TERMS.achievedRatio]) expect(header).toContain(term.label.toLowerCase());
    expect(stdout).toContain(`${TERMS.profile.label}: `);
    expect(stdout).toMatch(/^V-OH\s+live, (left overhang|span 1)\s/m);
    expect(stdout).toMatch(/^V-02\s.*\sfail$/m);
    expect(stdout).toMatch(/ pass, \d+ fail\./);
    expect(stdout).not.toMatch(/\bFoS\b|\bPASS\b|\bFAIL\b|@\d/);
  });

  it("in the --json document", () => {
    const out = JSON.parse(run("--json").stdout) as { counts: Record<string, number>; members: { status: string; governingCheck: { key: string } | null; checks: { check: string }[] }[] };
    for (const outcome of OUTCOMES) expect(out.counts).toHaveProperty(outcome);
    for (const m of out.members) {
      expect(OUTCOMES).toContain(m.status);
      expect(m.governingCheck?.key ?? FREQUENCY_CHECK_NAME).toMatch(CHECK_NAME);
      for (const c of m.checks) expect(c.check).toMatch(CHECK_NAME);
    }
  });

  it("takes the delimiter by the same name as the API", () => {
    const { stderr, status } = spawnSync(process.execPath, ["--import", "tsx", "lib/cli/check.ts", file, "--delimiter", ";"], { encoding: "utf8", timeout: 120_000 });
    expect(status).toBe(2);
    expect(stderr).toContain("--delimiter must be comma, semicolon or tab");
  });
});

describe("the dashboard uses the glossary's names", () => {
  it("on the schedule page", async () => {
    const engineer = await signInAs("engineer");
    const page = await engineer.get(`/schedules/${scheduleId}`);
    expect(page.status).toBe(200);
    // Text as read: tags dropped, entities of the few characters our names use decoded.
    const text = page.text
      .replace(/<script[\s\S]*?<\/script>/g, " ")
      .replace(/<[^>]+>/g, " ")
      .replaceAll("&#x27;", "'")
      .replaceAll("&amp;", "&")
      .replace(/\s+/g, " ");
    for (const label of [TERMS.profile.label, TERMS.governingCheck.label, TERMS.factorOfSafety.label, TERMS.outcome.label, TERMS.utilization.label]) expect(text, label).toMatch(new RegExp(label, "i"));
    for (const outcome of ["pass", "fail"] as const) expect(text).toContain(OUTCOME_LABELS[outcome]);
    expect(text).toMatch(/\d pass · \d fail · \d error/);
    expect(text).toContain("live, span 1");
    for (const retired of ["Limit preset", "Why the check stopped", "FoS", "live@", " passed ·"]) expect(text, retired).not.toContain(retired);
  });
});
