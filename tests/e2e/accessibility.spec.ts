// An automated accessibility scan (axe-core, WCAG 2.1 A and AA) of the main screens in Debian's
// chromium, as the administrator who may open all of them. Serious and critical violations fail.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL, demoUser } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { findSeriousViolations } from "@/tests/helpers/axe";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";

let browser: Browser;
let page: Page;
let scheduleId: string;

beforeAll(async () => {
  const key = await createTestKey();
  // one failing beam (30 kN/m of live load over 8 m) and one that passes, so every part of the results screens is drawn
  const doc = createScheduleDoc([createBeam("AX-F1", 8, 30), createBeam("AX-P1", 3, 2)], "Accessibility scan, invented schedule");
  const created = await fetch(`${APP_URL}/api/v1/schedules`, { method: "POST", headers: { authorization: `Bearer ${key}`, "content-type": "application/json" }, body: JSON.stringify(doc) });
  expect(created.status).toBe(202);
  scheduleId = ((await created.json()) as { id: string }).id;
  await waitForSchedule(key, scheduleId);
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  const { email, password } = demoUser("admin");
  await signInThroughForm(page, email, password);
});

afterAll(async () => {
  await browser?.close();
});

const screens: [string, () => string][] = [
  ["schedules list", () => "/schedules"],
  ["schedule results", () => `/schedules/${scheduleId}`],
  ["member", () => `/schedules/${scheduleId}/members/AX-F1`],
  ["review", () => "/review"],
  ["integrations", () => "/integrations"],
  ["API keys", () => "/integrations/keys"],
  ["webhooks", () => "/integrations/webhooks"],
  ["people", () => "/people"],
  ["settings", () => "/settings"],
  ["upload", () => "/schedules/new"],
];

describe("accessibility scan of the main screens", () => {
  for (const [name, path] of screens) {
    it(`finds no serious or critical violation on ${name}`, async () => {
      const response = await page.goto(`${APP_URL}${path()}`);
      expect(response?.status(), name).toBe(200);
      await page.locator("main").waitFor();
      expect(await findSeriousViolations(page), name).toEqual([]);
    });
  }
});
