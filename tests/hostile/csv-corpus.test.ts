// Issue 10, the CSV corpus against the running service (RELIABILITY figures 6, 7 and 11): line
// ends, BOM, delimiters, quoted newlines, header mistakes, encodings that are not UTF-8, empty
// files and the three stall inputs. Every refusal is a 4xx problem naming row, line and column.
import { readFileSync } from "node:fs";

import Papa from "papaparse";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { assertSafeProblem } from "@/tests/hostile/problem-checks";

const example = readFileSync(new URL("../../examples/lumenbrook-depot-hall-b-joists.csv", import.meta.url), "utf8");
const rows = Papa.parse<string[]>(example.trim(), { delimiter: "," }).data;
const header = rows[0]!;
const memberCount = rows.length - 1;
const write = (table: string[][], delimiter = ",", newline = "\r\n") => Papa.unparse(table, { delimiter, newline }) + newline;

let key: string;
beforeAll(async () => {
  key = await createTestKey();
});

function post(body: string | Buffer, query = "", type = "text/csv") {
  return request(APP_URL)
    .post(`/api/v1/schedules?profile=en1995-timber-floor&name=Invented%20corpus${query}`)
    .set("authorization", `Bearer ${key}`)
    .set("content-type", type)
    .send(body);
}

describe("CSV files that are accepted", () => {
  it.each([
    ["CRLF", write(rows), ""],
    ["LF", write(rows, ",", "\n"), ""],
    ["lone CR", write(rows, ",", "\r"), ""],
    ["a UTF-8 BOM", `\uFEFF${write(rows)}`, ""],
    ["semicolons", write(rows, ";"), "&delimiter=semicolon"],
    ["tabs", write(rows, "\t"), "&delimiter=tab"],
    ["a quoted newline and quotes in notes", write([header, ...rows.slice(1).map((r, i) => (i === 0 ? [...r.slice(0, -1), 'two\r\nlines, "quoted"'] : r))]), ""],
  ])("%s", async (_label, body, query) => {
    const response = await post(body, query);
    expect(response.status, response.text.slice(0, 400)).toBe(202);
    expect(response.body.memberCount).toBe(memberCount);
  });
});

function expectRowError(response: request.Response, match: Record<string, unknown>) {
  assertSafeProblem(response, [key]);
  expect(response.status).toBe(422);
  expect(response.body.errors[0], response.text.slice(0, 400)).toMatchObject(match);
}

describe("CSV files that are refused, with the row, line and column", () => {
  it("a duplicate header", async () => {
    expectRowError(await post(write([[...header, "mark"], ...rows.slice(1).map((r) => [...r, "X"])])), { row: 1, code: "duplicate_header" });
  });

  it("a missing required header", async () => {
    const without = (r: string[]) => r.filter((_, i) => header[i] !== "supports");
    expectRowError(await post(write(rows.map(without))), { row: 1, code: "missing_column" });
  });

  it("an empty file and a header-only file", async () => {
    expectRowError(await post(""), { code: "empty_file" });
    expectRowError(await post(write([header])), { code: "no_rows" });
  });

  it("a semicolon file sent as comma-delimited", async () => {
    expectRowError(await post(write(rows, ";")), { row: 1, code: "wrong_delimiter" });
  });

  it('text after a closing quote ("ab"c)', async () => {
    const body = write(rows.slice(0, 2)) + `"J9"x,${rows[1]!.slice(1).join(",")}\r\n`;
    expectRowError(await post(body), { row: 3, line: 3, code: "invalid_quote" });
  });

  it("a bad row after a quoted newline: row and line differ", async () => {
    const table = [header, [...rows[1]!.slice(0, -1), "one\ntwo"], rows[2]!.map((v, i) => (header[i] === "span_1 [m]" ? "-3" : v))];
    const response = await post(write(table));
    expect(response.status).toBe(422);
    expect(response.body.errors[0]).toMatchObject({ row: 3, line: 4, column: "span_1 [m]" });
  });
});

describe("files that are not UTF-8 text are refused with a clear message", () => {
  it.each([
    ["Windows-1252", Buffer.from(write(rows).replace("Level 2", "Niveau é 2"), "latin1"), /not UTF-8 text.*Windows-1252.*CSV UTF-8/],
    ["UTF-16 with a byte-order mark", Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(write(rows), "utf16le")]), /UTF-16.*CSV UTF-8/],
    ["UTF-16 big-endian", Buffer.concat([Buffer.from([0xfe, 0xff]), Buffer.from(write(rows), "utf16le").swap16()]), /UTF-16/],
    ["UTF-16 without a byte-order mark", Buffer.from(write(rows), "utf16le"), /NUL.*UTF-16/],
  ])("%s", async (_label, body, message) => {
    const response = await post(body);
    assertSafeProblem(response, [key]);
    expect(response.status).toBe(400);
    expect(response.body.detail).toMatch(message);
  });
});

describe("the stall inputs are refused quickly and the service stays up", () => {
  it("a header cell of a, 4,000 spaces and b", async () => {
    const body = write([[...header.slice(0, -1), `a${" ".repeat(4000)}b`], ...rows.slice(1)]);
    expectRowError(await post(body), { row: 1, code: "header_too_long" });
  });

  it("17 MB of blank lines (ran the web process out of memory before)", async () => {
    const body = Buffer.concat([Buffer.from(write(rows)), Buffer.alloc(17 * 1024 * 1024, 0x0a)]);
    expectRowError(await post(body), { code: "too_many_rows" });
    expect((await request(APP_URL).get("/api/health")).status).toBe(200);
  });

  it("100,000 invalid JSON members: 1,000 listed, every one counted", async () => {
    const doc = { format: "sagline.schedule/v2", name: "Invented stall", units: { system: "SI" }, profile: { preset: "ibc-2021-floor" }, members: Array.from({ length: 100_000 }, () => ({})) };
    const response = await post(JSON.stringify(doc), "", "application/json");
    assertSafeProblem(response, [key]);
    expect(response.status).toBe(422);
    expect(response.body.errors).toHaveLength(1000);
    expect(response.body.errorCount).toBeGreaterThanOrEqual(100_000);
    expect((await request(APP_URL).get("/api/health")).status).toBe(200);
  });

  it("an ordinary schedule is still accepted afterwards", async () => {
    expect((await post(write(rows))).status).toBe(202);
  });
});
