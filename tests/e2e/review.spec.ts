// In a real browser: an engineer records a justification on a member, a bulk disposition is
// previewed and confirmed, a viewer sees the history but cannot disposition, the digest e-mail
// arrives in the SMTP fake, and the review page passes an accessibility scan.
import { AxeBuilder } from "@axe-core/playwright";
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { waitForMail } from "@/tests/helpers/mail";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";
import { closeQueues } from "@/workers/queues";

import { createReviewOrganization } from "../integration/review/support";

let browser: Browser;
let org: Awaited<ReturnType<typeof createReviewOrganization>>;
let scheduleId: string;
const scheduleName = `Browser review ${Date.now().toString(36)}, invented annex`;

beforeAll(async () => {
  org = await createReviewOrganization("browser");
  const key = await org.key(["schedules:write", "results:read"]);
  // Three failing beams (utilizations well above 1 with these spans and loads), one passing.
  const doc = { ...createScheduleDoc([createBeam("A1", 6, 7.5), createBeam("A2", 9, 12), createBeam("A3", 10, 15), createBeam("A4", 9.5, 14)], scheduleName), reference: "BRW-1" };
  const response = await request(APP_URL).post("/api/v1/schedules").set("Authorization", `Bearer ${key}`).send(doc);
  scheduleId = response.body.id as string;
  await waitForSchedule(key, scheduleId);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeQueues();
  await org.remove();
});

async function signedIn(role: "engineer" | "viewer"): Promise<Page> {
  // A context of its own per person (the accessibility scan needs one, and sessions stay apart).
  const page = await (await browser.newContext()).newPage();
  await signInThroughForm(page, org.people[role].email, org.people[role].password);
  return page;
}

// The page streams behind its loading state, so a read waits for the rows rather than taking the first frame.
describe("review in the browser", () => {
  it("an engineer filters the queue to a schedule, opens a member and records a justification", async () => {
    const page = await signedIn("engineer");
    await page.goto(`${APP_URL}/review`);
    const filters = page.getByRole("form", { name: "Filter the review queue" });
    await filters.locator('select[name="scheduleId"]').selectOption(scheduleId);
    await filters.locator('select[name="sort"]').selectOption("utilization");
    await filters.getByRole("button", { name: "Apply filters" }).click();
    await page.waitForURL((url) => url.searchParams.get("scheduleId") === scheduleId);
    const table = page.getByRole("table", { name: /Members in review/ });
    await expect.poll(() => table.getByRole("rowheader").allInnerTexts(), { timeout: 30_000 }).toEqual(["A3", "A4", "A2"]);
    await expect(page.getByRole("complementary", { name: "Safety caution" }).isVisible()).resolves.toBe(true);

    await table.getByRole("link", { name: "A2" }).click();
    await page.waitForURL((url) => url.pathname.endsWith("/members/A2"));
    const form = page.getByRole("form", { name: "Record a disposition" });
    await form.getByLabel(/Accepted with justification/).check();
    // Too short: refused, with the reason under the field.
    await form.getByLabel("Justification (required)").fill("fine");
    await form.getByRole("button", { name: "Record disposition" }).click();
    await form.getByText(/needs a written justification/).first().waitFor();
    const justification = "Invented site check: a prop under the annex stair halves this span; the propped beam passes.";
    await form.getByLabel("Justification (required)").fill(justification);
    await form.getByRole("button", { name: "Record disposition" }).click();
    await expect(form.getByRole("status").textContent()).resolves.toContain("Recorded: Accepted with justification");
    const history = page.getByRole("list", { name: "Disposition history" });
    await expect(history.textContent()).resolves.toContain(justification);
    await expect(page.getByTestId("review-state").textContent()).resolves.toBe("Accepted with justification");
    await page.context().close();
  });

  it("a bulk disposition previews its count and records only after confirmation", async () => {
    const page = await signedIn("engineer");
    await page.goto(`${APP_URL}/review?scheduleId=${scheduleId}`);
    const preview = page.getByRole("form", { name: "Preview a bulk disposition" });
    await preview.getByLabel(/Member to be revised/).check();
    await preview.getByLabel("Note (optional)").fill("Deepen both sections; resubmit.");
    await preview.getByRole("button", { name: "Preview the count" }).click();
    const confirm = page.getByRole("form", { name: "Confirm the bulk disposition" });
    await expect(confirm.textContent()).resolves.toContain("on 2 members");
    // Nothing is recorded by the preview alone.
    await page.reload();
    await expect.poll(() => page.getByRole("table", { name: /Members in review/ }).getByRole("rowheader").allInnerTexts(), { timeout: 30_000 }).toEqual(["A3", "A4"]);
    await preview.getByLabel(/Member to be revised/).check();
    await preview.getByRole("button", { name: "Preview the count" }).click();
    await confirm.getByRole("button", { name: "Confirm: record on 2 members" }).click();
    await expect(confirm.getByRole("status").textContent()).resolves.toMatch(/Recorded "Member to be revised" on 2 members \(bulk bulk_/);
    await page.goto(`${APP_URL}/review?scheduleId=${scheduleId}`);
    await page.getByText("Nothing matching these filters is waiting for review.").waitFor();
    await page.goto(`${APP_URL}/review?scheduleId=${scheduleId}&state=member_to_be_revised`);
    await expect.poll(() => page.getByRole("table", { name: /Members in review/ }).getByRole("rowheader").allInnerTexts(), { timeout: 30_000 }).toEqual(["A3", "A4"]);
    await page.context().close();
  });

  it("a viewer reads the queue and the history but has no way to disposition", async () => {
    const page = await signedIn("viewer");
    await page.goto(`${APP_URL}/review?state=accepted_with_justification`);
    await page.getByText(/Engineers and administrators record dispositions/).first().waitFor();
    await expect(page.getByRole("heading", { name: "Bulk disposition" }).count()).resolves.toBe(0);
    await expect(page.getByRole("form", { name: "Digest e-mail" }).count()).resolves.toBe(0);
    await page.goto(`${APP_URL}/schedules/${scheduleId}/members/A2`);
    await expect(page.getByRole("list", { name: "Disposition history" }).textContent()).resolves.toContain("Invented site check");
    await expect(page.getByRole("form", { name: "Record a disposition" }).count()).resolves.toBe(0);
    await page.context().close();
  });

  it("the digest e-mail arrives, and the engineer can change how often it comes", async () => {
    const mail = await waitForMail(org.people.engineer.email, "Sagline review digest", 60_000);
    expect(mail.text).toContain(scheduleName);
    expect(mail.text).toContain(`/review?scheduleId=${scheduleId}`);
    const page = await signedIn("engineer");
    await page.goto(`${APP_URL}/review`);
    const form = page.getByRole("form", { name: "Digest e-mail" });
    await form.locator('select[name="frequency"]').selectOption("daily");
    await form.getByRole("button", { name: "Save" }).click();
    await expect(form.getByRole("status").textContent()).resolves.toContain("preference saved");
    await page.reload();
    await expect(page.getByRole("form", { name: "Digest e-mail" }).locator('select[name="frequency"]').inputValue()).resolves.toBe("daily");
    const scan = await new AxeBuilder({ page: page as never }).analyze();
    expect(scan.violations.map((v) => `${v.id}: ${v.nodes.length}`)).toEqual([]);
    await page.context().close();
  });
});
