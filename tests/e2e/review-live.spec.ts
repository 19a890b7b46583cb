// In a real browser: an engineer keeps /review open while a schedule is submitted and checked by
// the workers; its failing members appear in the queue without a reload of the page.
import type { Browser } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";
import { closeQueues } from "@/workers/queues";

import { createReviewOrganization } from "../integration/review/support";

let browser: Browser;
let org: Awaited<ReturnType<typeof createReviewOrganization>>;

beforeAll(async () => {
  org = await createReviewOrganization("live queue");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeQueues();
  await org.remove();
});

describe("the review queue while schedules run", () => {
  it("shows the failing members of a schedule that completes while the page is open, without a reload", async () => {
    const page = await (await browser.newContext()).newPage();
    await signInThroughForm(page, org.people.engineer.email, org.people.engineer.password);
    await page.goto(`${APP_URL}/review`);
    await page.getByText("Nothing matching these filters is waiting for review.").waitFor();
    const navigations: string[] = [];
    page.on("framenavigated", (frame) => {
      if (frame === page.mainFrame()) navigations.push(frame.url());
    });
    // A marker on this document: a reload would make a new one without it.
    await page.evaluate(() => ((window as unknown as { __sameDocument?: boolean }).__sameDocument = true));

    // Two failing beams (spans and live loads well past l/360 for this section) and one passing.
    const key = await org.key(["schedules:write", "results:read"]);
    const doc = createScheduleDoc([createBeam("LQ-1", 9, 12), createBeam("LQ-2", 10, 15), createBeam("LQ-3", 3, 2)], "Live queue test, Ardwick Lane annex (invented)");
    const response = await request(APP_URL).post("/api/v1/schedules").set("Authorization", `Bearer ${key}`).send(doc);
    expect(response.status).toBe(202);
    const finished = await waitForSchedule(key, response.body.id as string);
    expect(finished.status).toBe("completed");

    const marks = page.getByRole("table", { name: /Members in review/ }).getByRole("rowheader");
    // The idle refresh runs every 15 s; 60 s leaves room on a loaded machine.
    await expect.poll(() => marks.allInnerTexts(), { timeout: 60_000, interval: 500 }).toEqual(["LQ-2", "LQ-1"]);
    await expect(page.evaluate(() => (window as unknown as { __sameDocument?: boolean }).__sameDocument)).resolves.toBe(true);
    expect(navigations).toEqual([]);
    await page.context().close();
  });
});
