// In a real browser: the integrator creates an API key, sees it once, finds it in the list, revokes
// it after confirming, and the key is refused by the API from then on.
import type { Browser } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL, demoUser } from "@/tests/helpers/app";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("API keys in the console", () => {
  it("are created, shown once, listed, revoked, and then refused by the API", async () => {
    const page = await browser.newPage();
    const integrator = demoUser("integrator");
    await signInThroughForm(page, integrator.email, integrator.password);
    await page.getByRole("link", { name: "Integrations" }).click();
    await page.getByRole("link", { name: "API keys" }).first().click();
    await page.waitForURL((url) => url.pathname === "/integrations/keys");

    const name = `Browser key ${Date.now().toString(36)}`;
    const form = page.getByRole("form", { name: "Create an API key" });
    // Submitting without a name names the field.
    await form.getByRole("button", { name: "Create key" }).click();
    const nameError = form.getByText("Give the key a name, e.g. the system that will use it.");
    await nameError.waitFor();
    await expect(nameError.isVisible()).resolves.toBe(true);

    await form.getByLabel("Name").fill(name);
    // keys:manage lets this test call GET /api/v1/api-keys with the new key.
    await form.getByRole("checkbox", { name: /keys:manage/ }).check();
    await form.getByLabel("Expires after (days, optional)").fill("7");
    await form.getByRole("button", { name: "Create key" }).click();

    const shown = page.getByTestId("new-api-key");
    await shown.waitFor();
    const secret = (await shown.textContent())!.trim();
    expect(secret).toMatch(/^sgl_[0-9A-Za-z]{38}$/);
    await expect(page.getByText("This is the only time it is shown.", { exact: false }).isVisible()).resolves.toBe(true);

    const row = page.getByTestId(`api-key-${secret.slice(0, 12)}`);
    await row.waitFor();
    await expect(row.textContent()).resolves.toContain(name);
    await expect(row.textContent()).resolves.toContain("Active");
    await expect(row.textContent()).resolves.toContain("Priya Fennimore");
    // The list shows the prefix only.
    await expect(page.locator("table").textContent()).resolves.not.toContain(secret);

    const ok = await request(APP_URL).get("/api/v1/api-keys").set("Authorization", `Bearer ${secret}`);
    expect(ok.status).toBe(200);

    // Shown once: after a reload the secret is gone from the page.
    await page.reload();
    await expect(page.content()).resolves.not.toContain(secret);

    const reloadedRow = page.getByTestId(`api-key-${secret.slice(0, 12)}`);
    await reloadedRow.getByText("Revoke…").click();
    const confirm = reloadedRow.getByRole("form", { name: `Confirm revoking ${name}` });
    await confirm.getByRole("button", { name: "Yes, revoke this key" }).click();
    // The page re-renders with the key revoked (and no revoke button left for it).
    await reloadedRow.getByText("Revoked", { exact: true }).waitFor();
    await expect(reloadedRow.getByText("Revoke…").count()).resolves.toBe(0);
    await page.reload();
    await expect(page.getByTestId(`api-key-${secret.slice(0, 12)}`).textContent()).resolves.toContain("Revoked");

    const refused = await request(APP_URL).get("/api/v1/api-keys").set("Authorization", `Bearer ${secret}`);
    expect(refused.status).toBe(401);
    expect(refused.body).toMatchObject({ type: "https://sagline.dev/problems/invalid-api-key", detail: "The API key has been revoked." });
    await page.close();
  });

  it("the API documentation page is public and carries the safety caution", async () => {
    const page = await browser.newPage();
    const response = await page.goto(`${APP_URL}/api-docs`);
    expect(response?.status()).toBe(200);
    await expect(page.getByRole("complementary", { name: "Safety caution" }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole("link", { name: "/api/templates/schedule.csv" }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole("article", { name: "POST /api/v1/schedules", exact: true }).isVisible()).resolves.toBe(true);
    await page.close();
  });
});
