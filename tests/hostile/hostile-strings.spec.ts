// RELIABILITY figure 10 in a real browser: marks and notes holding script, markup, RTL overrides,
// formula prefixes and long non-Latin text render as text in the dashboard (no script runs, no
// element is injected) and leave the CSV export neutralised.
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL, demoUser } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";

const hostileMarks = [
  "<script>window.__pwned='mark'</script>",
  '<img src=x onerror="window.__pwned=1">',
  "\u202Egnp.exe\u202C-B1",
  '=HYPERLINK("http://evil.example","x")',
  "+SUM(A1:A9)",
  "@cmd",
  "-2+3",
  "構造梁-".repeat(10),
];
const hostileNotes = `<svg onload="window.__pwned='notes'"></svg> \u202Edetoor\u202C =cmd|' /C calc'!A0 ${"梁".repeat(1500)}`;

let browser: Browser;
let page: Page;
let scheduleId: string;
const dialogs: string[] = [];

beforeAll(async () => {
  const key = await createTestKey();
  const members = hostileMarks.map((mark) => ({ ...createBeam(mark), notes: hostileNotes }));
  const created = await request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc(members, "Invented hostile strings <b>bold</b>"));
  expect(created.status, created.text).toBe(202);
  scheduleId = created.body.id;
  await waitForSchedule(key, scheduleId);
  browser = await launchBrowser();
  page = await browser.newPage();
  page.on("dialog", (dialog) => {
    dialogs.push(dialog.message());
    void dialog.dismiss();
  });
  const { email, password } = demoUser("viewer");
  await signInThroughForm(page, email, password);
});

afterAll(async () => {
  await browser?.close();
});

async function expectNothingRan() {
  expect(await page.evaluate(() => (window as unknown as { __pwned?: unknown }).__pwned)).toBeUndefined();
  expect(dialogs).toEqual([]);
  expect(await page.locator("main img[src='x'], main svg[onload]").count()).toBe(0);
  expect(await page.locator("main script").count()).toBe(0);
}

describe("hostile marks and notes in the dashboard", () => {
  it("the schedule page shows every mark as text", async () => {
    await page.goto(`${APP_URL}/schedules/${scheduleId}`);
    for (const mark of hostileMarks) expect(await page.getByText(mark, { exact: true }).count(), mark).toBeGreaterThan(0);
    expect(await page.getByText("Invented hostile strings <b>bold</b>").count()).toBeGreaterThan(0);
    await expectNothingRan();
  });

  it("each member page shows the notes as text", async () => {
    for (const mark of hostileMarks.slice(0, 3)) {
      const response = await page.goto(`${APP_URL}/schedules/${scheduleId}/members/${encodeURIComponent(mark)}`);
      expect(response?.status(), mark).toBe(200);
      // The page streams in after its loading state: wait for the record, then read.
      await page.getByTestId("record-summary").waitFor({ timeout: 60_000 });
      expect(await page.getByText(mark, { exact: true }).count(), mark).toBeGreaterThan(0);
      expect(await page.locator("main").innerText()).toContain('<svg onload="window.__pwned=');
      await expectNothingRan();
    }
  });

  it("the CSV export from the dashboard neutralises the formula marks", async () => {
    const response = await page.request.get(`${APP_URL}/schedules/${scheduleId}/results.csv`);
    expect(response.status()).toBe(200);
    const text = await response.text();
    expect(text).toContain(`"'=HYPERLINK(""http://evil.example"",""x"")"`);
    for (const cell of ["'+SUM(A1:A9)", "'@cmd", "'-2+3"]) expect(text).toContain(cell);
    expect(text).not.toMatch(/(^|[\r\n,;\t])[=+\-@]/);
    expect(text).toContain("<script>window.__pwned='mark'</script>");
  });
});
