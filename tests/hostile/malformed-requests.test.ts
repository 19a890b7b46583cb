// RELIABILITY figure 7: a malformed-request corpus against the public API. No 5xx; every error
// is problem+json; no stack trace, SQL or secret in any body. A hand-written corpus, plus cases
// generated for every operation of the served OpenAPI document (malformed-cases.ts), so a new
// route is covered as soon as the document lists it.
import http from "node:http";

import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { demoOrganizations } from "@/db/seed-data";
import { apiKeyScopes } from "@/lib/server/api-keys/scopes";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";
import { assertSafeProblem } from "@/tests/hostile/problem-checks";
import { buildOperationCases, listOperations, type OpenApiDocument } from "@/tests/hostile/malformed-cases";

let key: string;
let openApi: OpenApiDocument;
beforeAll(async () => {
  // Every scope, in an organization of its own use here, so no scope or rate limit hides a case.
  key = await createTestKey([...apiKeyScopes], demoOrganizations.fabricator.id);
  openApi = (await request(APP_URL).get("/api/v1/openapi.json")).body as OpenApiDocument;
});

type Case = { label: string; method: "get" | "post"; path: string; type?: string; body?: string | Buffer };
const doc = (members: unknown[], extra: Record<string, unknown> = {}) => JSON.stringify({ ...createScheduleDoc(members), ...extra });

const corpus: Case[] = [
  { label: "truncated JSON", method: "post", path: "/api/v1/schedules", type: "application/json", body: '{"format":' },
  { label: "JSON array", method: "post", path: "/api/v1/schedules", type: "application/json", body: "[]" },
  { label: "JSON null", method: "post", path: "/api/v1/schedules", type: "application/json", body: "null" },
  { label: "wrong types", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([{ ...createBeam("T-1"), spans: "six", quantity: "many", loads: {} }]) },
  { label: "unknown fields", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([{ ...createBeam("U-1"), colour: "red" }], { extra: true }) },
  { label: "no members", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([]) },
  { label: "a NUL in a mark", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([createBeam("N\u0000UL")]) },
  { label: "a 100,000-character mark", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([createBeam("M".repeat(100_000))]) },
  { label: "a script tag and formula in a mark", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([createBeam("<script>alert(1)</script>"), { ...createBeam("=cmd|' /C calc'!A0"), spans: [-1] }]) },
  { label: "numbers as huge exponents", method: "post", path: "/api/v1/schedules", type: "application/json", body: doc([{ ...createBeam("E-1"), spans: [1e308 * 10] }]).replace("null", "1e999") },
  { label: "invalid UTF-8", method: "post", path: "/api/v1/schedules", type: "application/json", body: Buffer.from([0x7b, 0xff, 0xfe, 0x7d]) },
  { label: "CSV with an unterminated quote", method: "post", path: "/api/v1/schedules?profile=ibc-2021-floor", type: "text/csv", body: 'mark,category\r\n"A,floor_beam\r\n' },
  { label: "CSV with duplicate headers", method: "post", path: "/api/v1/schedules?profile=ibc-2021-floor", type: "text/csv", body: "mark,mark\r\nA,B\r\n" },
  { label: "CSV with an unknown delimiter", method: "post", path: "/api/v1/schedules?profile=ibc-2021-floor&delimiter=pipe", type: "text/csv", body: "mark|category\r\n" },
  { label: "CSV with an unknown preset", method: "post", path: "/api/v1/schedules?profile=%3Cscript%3E", type: "text/csv", body: "mark\r\nA\r\n" },
  { label: "multipart without a file", method: "post", path: "/api/v1/schedules", type: "multipart/form-data; boundary=x", body: "--x\r\nContent-Disposition: form-data; name=\"name\"\r\n\r\nA\r\n--x--\r\n" },
  { label: "a broken multipart body", method: "post", path: "/api/v1/schedules", type: "multipart/form-data; boundary=x", body: "garbage" },
  { label: "a forged cursor", method: "get", path: "/api/v1/schedules?cursor=eyJjcmVhdGVkQXQiOiJub3BlIn0" },
  { label: "a SQL-looking cursor", method: "get", path: "/api/v1/schedules?cursor=%27%3B%20drop%20table%20schedules%3B--" },
  { label: "a negative limit", method: "get", path: "/api/v1/schedules?limit=-5" },
  { label: "a hostile schedule id", method: "get", path: "/api/v1/schedules/%27%20or%201%3D1--" },
  { label: "a hostile mark", method: "get", path: "/api/v1/schedules/sch_abc/members/%3Cscript%3E" },
  { label: "an unknown status filter", method: "get", path: "/api/v1/schedules/sch_abc/results?status=maybe" },
  { label: "an unknown format", method: "get", path: "/api/v1/schedules/sch_abc/results?format=xlsx" },
  // Signed download links take no key; whatever the token, the answer is a problem, never a 5xx.
  { label: "a forged download token", method: "get", path: "/api/v1/result-downloads/eyJwIjoieCJ9.AAAA" },
  { label: "a 5,000-character download token", method: "get", path: `/api/v1/result-downloads/${"x".repeat(5000)}` },
  { label: "a NUL in a download token", method: "get", path: "/api/v1/result-downloads/a%00.b" },
  { label: "a v1 schedule", method: "post", path: "/api/v1/schedules", type: "application/json", body: JSON.stringify({ format: "sagline.schedule/v1", limits: { preset: "ibc-2021-floor" } }) },
];

/** Declares a body over the 64 MB cap and sends only its start: the answer must not wait for the rest. */
function postDeclaredOversize(): Promise<{ status: number; type: string; body: string }> {
  return new Promise((resolve, reject) => {
    const url = new URL("/api/v1/schedules", APP_URL);
    const req = http.request(url, { method: "POST", headers: { authorization: `Bearer ${key}`, "content-type": "application/json", "content-length": String(70 * 1024 * 1024) } }, (res) => {
      let body = "";
      res.on("data", (c) => (body += c));
      res.on("end", () => {
        resolve({ status: res.statusCode ?? 0, type: String(res.headers["content-type"]), body });
        req.destroy();
      });
    });
    req.on("error", reject);
    req.write("{".padEnd(64 * 1024, " "));
  });
}

describe("malformed requests", () => {
  it("a body declared over the limit: 413 problem+json at once", async () => {
    const response = await postDeclaredOversize();
    expect(response.status).toBe(413);
    expect(response.type).toContain("application/problem+json");
    expect(JSON.parse(response.body)).toMatchObject({ type: "https://sagline.dev/problems/too-large", status: 413 });
  });

  it.each(corpus.map((c) => [c.label, c] as const))("%s: a 4xx problem, nothing leaked", async (_label, c) => {
    let req = request(APP_URL)[c.method](c.path).set("authorization", `Bearer ${key}`);
    if (c.type) req = req.set("content-type", c.type);
    const response = c.body === undefined ? await req : await req.send(c.body);
    assertSafeProblem(response, [key]);
  });

  it("generates cases for every operation the OpenAPI document lists", () => {
    const operations = listOperations(openApi);
    expect(operations.length).toBeGreaterThanOrEqual(15);
    expect(operations.map((o) => `${o.method} ${o.path}`)).toContain("POST /api/v1/schedules");
    for (const operation of operations) expect(buildOperationCases(operation).length, `${operation.method} ${operation.path}`).toBeGreaterThan(0);
  });

  it("every generated case: a 4xx problem, nothing leaked, never 5xx", async () => {
    const failures: string[] = [];
    for (const operation of listOperations(openApi)) {
      for (const c of buildOperationCases(operation)) {
        let req = request(APP_URL)[c.method](c.path).set("authorization", `Bearer ${key}`);
        for (const [name, value] of Object.entries(c.headers ?? {})) req = req.set(name, value);
        const where = `${operation.method} ${operation.path} (${c.label})`;
        let response: request.Response;
        try {
          response = c.body === undefined ? await req : await req.send(c.body);
        } catch (error) {
          failures.push(`${where}: no answer: ${(error as Error).message.slice(0, 200)}`);
          continue;
        }
        try {
          assertSafeProblem(response, [key]);
          expect(response.status, "a rate limit would hide the case").not.toBe(429);
        } catch (error) {
          failures.push(`${where}: ${response.status} ${response.text.slice(0, 200)} ${(error as Error).message.slice(0, 200)}`);
        }
      }
    }
    expect(failures).toEqual([]);
  });
});
