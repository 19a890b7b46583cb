// In a real browser: an engineer opens a schedule the workers are still checking, filters the
// failures, sees only failing rows (a hostile mark among them shown as text), and watches the
// count of failures grow as the next chunk's results are stored, without reloading the page.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL, demoUser } from "@/tests/helpers/app";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { appendFixtureChunk, createFixtureMembers, insertResultsFixture } from "@/tests/helpers/results-fixture";

const HOSTILE_MARK = `<img src=x onerror="window.__hostile=1">`;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("filtering a running schedule's failures", () => {
  it("shows only failures and updates their count live as results arrive", async () => {
    const all = createFixtureMembers(200);
    // A failing member whose mark is markup: it must render as text.
    all[10] = { ...all[10]!, mark: HOSTILE_MARK, utilization: 1.6, pass: false, error: false, awaitingReview: true };
    const first = all.slice(0, 100);
    const second = all.slice(100);
    const failing = (list: typeof all) => list.filter((m) => !m.pass && !m.error).length;
    const scheduleId = await insertResultsFixture(first, { memberCount: 200, name: "Lumenbrook Depot, Hall B, level 2 (invented)" });

    const page = await browser.newPage();
    const { email, password } = demoUser("engineer");
    await signInThroughForm(page, email, password);
    await page.goto(`${APP_URL}/schedules/${scheduleId}`);
    expect(await page.title()).toContain("Lumenbrook Depot, Hall B, level 2 (invented)");

    const filters = page.getByRole("form", { name: "Filter results" });
    await filters.getByLabel("Outcome").selectOption("fail");
    await filters.getByRole("button", { name: "Apply" }).click();
    await page.waitForURL((url) => url.searchParams.get("status") === "fail");

    const count = page.getByTestId("match-count");
    await expect.poll(() => count.textContent(), { timeout: 30_000 }).toBe(`${failing(first)} matching`);
    const statuses = await page.locator("tbody tr").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-status")));
    expect(statuses.length).toBeGreaterThan(0);
    expect(new Set(statuses)).toEqual(new Set(["fail"]));
    await expect(page.getByRole("link", { name: HOSTILE_MARK }).count()).resolves.toBe(1);
    await expect(page.locator("table img").count()).resolves.toBe(0);
    await expect(page.evaluate(() => (window as unknown as { __hostile?: number }).__hostile)).resolves.toBeUndefined();

    // The workers store the next chunk: the page polls and the count follows, no reload.
    const navigations: string[] = [];
    page.on("framenavigated", (frame) => {
      if (frame === page.mainFrame()) navigations.push(frame.url());
    });
    await appendFixtureChunk(scheduleId, 1, second);
    await expect.poll(() => count.textContent(), { timeout: 30_000 }).toBe(`${failing(all)} matching`);
    await expect.poll(() => page.getByTestId("live-counts").textContent(), { timeout: 30_000 }).toContain("200 of 200 checked");
    expect(navigations).toEqual([]);
    await page.close();
  });
});
