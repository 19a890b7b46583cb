// A CSV exported by a real spreadsheet program (LibreOffice Calc, headless, from Debian's packages)
// is accepted as it comes: quoted cells, a quoted comma, doubled quotes and a newline inside a cell.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { waitForSchedule } from "@/tests/helpers/schedules";

function exportCsv(separatorCode: number): string {
  const out = mkdtempSync(join(tmpdir(), "sagline-lo-"));
  // Filter options: field separator, text delimiter ("), character set 76 = UTF-8, first line 1.
  execFileSync("soffice", ["--headless", `-env:UserInstallation=file://${out}/profile`, "--convert-to", `csv:Text - txt - csv (StarCalc):${separatorCode},34,76,1`, "--outdir", out, "tests/fixtures/lumenbrook-depot-level-3.fods"], { stdio: "ignore", timeout: 90_000 });
  const file = readdirSync(out).find((f) => f.endsWith(".csv"));
  return readFileSync(join(out, file!), "utf8");
}

let key: string;
beforeAll(async () => {
  key = await createTestKey();
});

describe("a CSV exported by LibreOffice Calc", () => {
  it.each([
    ["comma", 44, "comma"],
    ["semicolon", 59, "semicolon"],
  ])("is accepted with the %s separator", { timeout: 120_000 }, async (_label, code, delimiter) => {
    const csv = exportCsv(code);
    expect(csv).toContain('"Stair trimmer\nsee sketch SK-12"');
    const response = await request(APP_URL)
      .post(`/api/v1/schedules?profile=ibc-2021-floor&name=Lumenbrook%20Yard%20L3&delimiter=${delimiter}`)
      .set("authorization", `Bearer ${key}`)
      .set("content-type", "text/csv")
      .send(csv);
    expect(response.status, JSON.stringify(response.body)).toBe(202);
    expect(response.body.memberCount).toBe(3);
    const done = await waitForSchedule(key, response.body.id);
    expect(done.status).toBe("completed");
  });
});
