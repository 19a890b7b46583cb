// In a real browser, as an engineer: every criteria screen under /settings passes an axe scan
// (WCAG 2.1 A and AA; serious and critical fail), and a value the server refuses is reported
// beside the field it concerns (aria-invalid, aria-describedby), not only above the form.
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { createLimitProfile } from "@/lib/server/criteria/limit-profiles";
import { importSectionCatalogue } from "@/lib/server/criteria/section-catalogues";
import { APP_URL } from "@/tests/helpers/app";
import { findSeriousViolations } from "@/tests/helpers/axe";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";

import { readDemoCatalogue } from "../integration/criteria/support";
import { createReviewOrganization } from "../integration/review/support";

let browser: Browser;
let page: Page;
let org: Awaited<ReturnType<typeof createReviewOrganization>>;
let profileId: string;
let catalogueId: string;
const CATALOGUE_NAME = "Harrowgate plate girders (invented, test)";

beforeAll(async () => {
  org = await createReviewOrganization("settings");
  profileId = (await createLimitProfile(org.organizationId, { label: "Floors, in-house (invented)", source: "invented for this test", basedOnPreset: "ibc-2021-floor" })).id;
  catalogueId = (await importSectionCatalogue({ organizationId: org.organizationId, name: CATALOGUE_NAME, source: "invented for this test", inUse: false, sections: readDemoCatalogue() })).id;
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  await signInThroughForm(page, org.people.engineer.email, org.people.engineer.password);
});
afterAll(async () => {
  await browser?.close();
  await org.remove();
});

/** The error beside a control: the control is marked invalid and described by an element holding the message. */
async function readErrorBeside(control: Locator): Promise<string> {
  await expect.poll(() => control.getAttribute("aria-invalid"), { timeout: 30_000 }).toBe("true");
  const describedBy = await control.getAttribute("aria-describedby");
  expect(describedBy).toBeTruthy();
  const message = page.locator(`[id="${describedBy}"]`);
  await expect(message.count()).resolves.toBe(1);
  // Beside it: inside the same label as the control.
  await expect(message.evaluate((el, input) => el.closest("label")?.contains(input as Node) ?? false, await control.elementHandle())).resolves.toBe(true);
  return (await message.textContent()) ?? "";
}

describe("the criteria screens for an engineer", () => {
  const screens: [string, () => string][] = [
    ["settings", () => "/settings"],
    ["limit profiles", () => "/settings/limit-profiles"],
    ["a limit profile", () => `/settings/limit-profiles/${profileId}`],
    ["materials", () => "/settings/materials"],
    ["section catalogues", () => "/settings/section-catalogues"],
    ["a section catalogue", () => `/settings/section-catalogues/${catalogueId}`],
  ];
  for (const [name, path] of screens) {
    it(`finds no serious or critical violation on ${name}`, async () => {
      const response = await page.goto(`${APP_URL}${path()}`);
      expect(response?.status(), name).toBe(200);
      await page.locator("main").waitFor();
      expect(await findSeriousViolations(page), name).toEqual([]);
    });
  }

  it("shows a material name the server finds taken beside the name field, and the scan still passes", async () => {
    await page.goto(`${APP_URL}/settings/materials`);
    const add = async (name: string, eMpa: string) => {
      const form = page.getByRole("form", { name: "Add a material" });
      await form.getByLabel("Name").fill(name);
      await form.getByLabel("E [MPa]").fill(eMpa);
      await form.getByLabel("Source of the values").fill("invented for this test");
      await form.getByRole("button", { name: "Add material" }).click();
      return form;
    };
    let form = await add("Invented oak, grade Q", "11000");
    await form.getByRole("status").filter({ hasText: "Material added" }).waitFor();
    // The same name again: only the database's unique index knows, so this is the server's own answer.
    form = await add("invented OAK, grade Q", "11000");
    await expect(readErrorBeside(form.getByLabel("Name"))).resolves.toBe("already in use");
    await expect(form.getByLabel("E [MPa]").getAttribute("aria-invalid")).resolves.toBeNull();
    expect(await findSeriousViolations(page)).toEqual([]);

    // A value the action's own validation refuses lands beside its field too.
    form = await add("Invented larch, grade R", "-5");
    await expect(readErrorBeside(form.getByLabel("E [MPa]"))).resolves.toBe("E must be greater than 0.");
  });

  it("shows a refused profile definition beside its field", async () => {
    await page.goto(`${APP_URL}/settings/limit-profiles`);
    const form = page.getByRole("form", { name: "New limit profile" });
    await form.getByLabel("Label").fill("Roofs, in-house (invented)");
    await form.getByLabel("Source").fill("invented for this test");
    await form.getByLabel(/Definition/).fill('{"combinations": "none"}');
    await form.getByRole("button", { name: "Save profile" }).click();
    await expect(readErrorBeside(form.getByLabel(/Definition/))).resolves.toMatch(/\S/);
    expect(await findSeriousViolations(page)).toEqual([]);
  });

  it("shows a catalogue name the server finds taken beside the name field", async () => {
    await page.goto(`${APP_URL}/settings/section-catalogues`);
    const form = page.getByRole("form", { name: "Import a section catalogue" });
    await form.locator('input[name="name"]').fill(CATALOGUE_NAME.toUpperCase());
    await form.getByLabel("Source of the properties").fill("invented for this test");
    await form.getByLabel("File (CSV or JSON)").setInputFiles({ name: "sections.csv", mimeType: "text/csv", buffer: Buffer.from("name,iMm4,areaMm2,massKgPerM\nQG 100,1000000,1000,8\n") });
    await form.getByRole("button", { name: "Import" }).click();
    await expect(readErrorBeside(form.locator('input[name="name"]'))).resolves.toBe("already in use");
  });
});
