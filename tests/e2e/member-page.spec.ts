// In a real browser: an engineer opens a failing member, reads its diagrams (supports by kind, the
// overhang tip left free, an allowed-deflection line per span, the maxima), runs a what-if with a
// stiffer section that passes, and finds the record unchanged, on the page and through the API.
// Each page has a browser context of its own (axe-core needs one). Screenshots of the page at 1400 px and in print media go to SAGLINE_SCREENSHOT_DIR when set.
import { mkdirSync } from "node:fs";
import { join } from "node:path";

import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL, demoUser } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { findSeriousViolations } from "@/tests/helpers/axe";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";

let browser: Browser;
let key: string;
let scheduleId: string;
const mark = "LB-F7";
const screenshotDir = process.env.SAGLINE_SCREENSHOT_DIR;

// 6 m plate girder (bf 150, tf 10.7, d 300, tw 7.1 mm, I about 6.5e7 mm^4) in S355 with a 1.5 m
// overhang, 30 kN/m live: the back span's live deflection is far past l/360 = 16.7 mm (IBC 2021
// Table 1604.3, from memory), so the member fails; an I of 5e9 mm^4 is some 75 times stiffer and
// passes every check (deflection scales with 1/I: AISC Manual Table 3-23, from memory).
function failingMember() {
  return { ...createBeam(mark, 6, 30), overhangs: { right: 1.5 } };
}

async function readMemberApi() {
  const response = await fetch(`${APP_URL}/api/v1/schedules/${scheduleId}/members/${mark}`, { headers: { authorization: `Bearer ${key}` } });
  expect(response.status).toBe(200);
  return (await response.json()) as { status: string; utilization: number; checks: { check: string; deflectionMm: number }[] };
}

beforeAll(async () => {
  key = await createTestKey();
  const doc = createScheduleDoc([failingMember(), createBeam("LB-P1", 3, 2)], "Lumenbrook test hall, invented member schedule");
  const created = await fetch(`${APP_URL}/api/v1/schedules`, { method: "POST", headers: { authorization: `Bearer ${key}`, "content-type": "application/json" }, body: JSON.stringify(doc) });
  expect(created.status).toBe(202);
  scheduleId = ((await created.json()) as { id: string }).id;
  await waitForSchedule(key, scheduleId);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

async function openMember(page: Page) {
  await page.goto(`${APP_URL}/schedules/${scheduleId}`);
  await page.getByRole("link", { name: mark }).click();
  await page.getByRole("heading", { name: `Member ${mark}` }).waitFor();
}

describe("an engineer on a failing member", () => {
  it("reads the diagrams, runs a what-if and finds the record unchanged", async () => {
    const before = await readMemberApi();
    expect(before.status).toBe("fail");

    const page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
    const { email, password } = demoUser("engineer");
    await signInThroughForm(page, email, password);
    await openMember(page);
    await expect(page.title()).resolves.toContain(`Member ${mark} · Lumenbrook test hall`);
    await expect(page.getByRole("complementary", { name: "Safety caution" }).first().isVisible()).resolves.toBe(true);
    await expect(page.getByTestId("member-outcome").innerText()).resolves.toContain("Fail");

    // the diagrams: supports by kind, the free overhang tip not drawn, an allowed line per span
    const sketch = page.getByRole("img", { name: "Member, supports and loads as analysed" });
    await expect(sketch.locator('[data-support-kind="pinned"]').count()).resolves.toBe(1);
    await expect(sketch.locator('[data-support-kind="roller"]').count()).resolves.toBe(1);
    await expect(sketch.locator('[data-support-kind="free"]').count()).resolves.toBe(0);
    await expect(sketch.locator("[data-support-kind]").count()).resolves.toBe(2);
    const panels = page.getByTestId("deflection-panel");
    const panelCount = await panels.count();
    expect(panelCount).toBeGreaterThanOrEqual(2);
    const live = page.getByRole("img", { name: /^Deflected shape, live/ });
    await expect(live.locator("[data-allowed-span]").count()).resolves.toBe(2);
    await expect(live.locator("[data-maximum-span]").count()).resolves.toBe(2);
    await expect(live.locator("desc").textContent()).resolves.toMatch(/span 1: largest [0-9.]+ mm down at [0-9.]+ m, allowed 16\.7 mm, fails/);

    // what was used, and the inputs with their units
    await expect(page.getByRole("region", { name: "What was used" }).innerText()).resolves.toMatch(/210,000 MPa/);
    await expect(page.getByRole("table", { name: /Loads as submitted/ }).innerText()).resolves.toMatch(/Intensity\s*\(kN\/m\)/);

    // no sideways scroll at 1400 px
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    const checksScroll = await page.locator("#checks-heading + div").evaluate((el) => el.scrollWidth - el.clientWidth);
    expect(checksScroll).toBeLessThanOrEqual(0);

    if (screenshotDir) {
      mkdirSync(screenshotDir, { recursive: true });
      await page.screenshot({ path: join(screenshotDir, "member-1400.png"), fullPage: true });
    }

    // the what-if: a much stiffer I passes, shown beside the record and marked as not saved
    const whatIf = page.getByRole("form", { name: "What-if recheck" });
    await whatIf.getByLabel("Section").selectOption("explicit");
    await whatIf.getByLabel(/^I \(mm⁴\)/).fill("5e9");
    await whatIf.getByRole("button", { name: "Recheck this member" }).click();
    const result = page.getByTestId("what-if-result");
    await result.waitFor();
    await expect(result.textContent()).resolves.toContain("Trial only, not saved");
    await expect(page.getByTestId("what-if-verdict").innerText()).resolves.toContain("Pass");
    await expect(page.getByTestId("member-outcome").innerText()).resolves.toContain("Fail");
    expect(await findSeriousViolations(page)).toEqual([]);

    if (screenshotDir) {
      await page.screenshot({ path: join(screenshotDir, "member-what-if-1400.png"), fullPage: true });
      await page.emulateMedia({ media: "print" });
      await page.screenshot({ path: join(screenshotDir, "member-print.png"), fullPage: true });
      await page.emulateMedia({ media: "screen" });
    }

    // the record is unchanged: on a fresh load and through the API
    await page.reload();
    await expect(page.getByTestId("member-outcome").innerText()).resolves.toContain("Fail");
    const after = await readMemberApi();
    expect(after.status).toBe("fail");
    expect(after.utilization).toBe(before.utilization);
    expect(after.checks).toEqual(before.checks);
    await page.close();
  });

  it("refuses a what-if input that is not a positive number, naming the field", async () => {
    const page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
    const { email, password } = demoUser("viewer");
    await signInThroughForm(page, email, password);
    await page.goto(`${APP_URL}/schedules/${scheduleId}/members/${mark}`);
    const whatIf = page.getByRole("form", { name: "What-if recheck" });
    await whatIf.getByLabel("Section").selectOption("rectangle");
    await whatIf.getByLabel(/^Width b/).fill("-20");
    await whatIf.getByLabel(/^Depth h/).fill("400");
    // the browser's own required check is bypassed so the server's answer is seen
    await whatIf.evaluate((form) => form.setAttribute("novalidate", ""));
    await whatIf.getByRole("button", { name: "Recheck this member" }).click();
    await whatIf.getByText("Enter a positive number.").waitFor();
    await expect(page.getByTestId("what-if-result").count()).resolves.toBe(0);
    await page.close();
  });
});
