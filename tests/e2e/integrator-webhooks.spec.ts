// In a real browser: an integrator adds an endpoint pointing at the fake partner on loopback (on the
// allowlist npm test sets), reveals its secret, sends a test event and sees it in the delivery log;
// the partner verified it with the independent standardwebhooks package.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { configurePartner, createTestOrganization, PARTNER_URL, readPartner, waitFor } from "@/tests/integration/webhooks/support";

let browser: Browser;
let org: Awaited<ReturnType<typeof createTestOrganization>>;
beforeAll(async () => {
  browser = await launchBrowser();
  org = await createTestOrganization("browser");
});
afterAll(async () => {
  await browser?.close();
  await org?.remove();
});

describe("webhooks in the integrator console", () => {
  it("creates an endpoint, sends a test event and shows it in the delivery log", async () => {
    const page = await browser.newPage();
    await signInThroughForm(page, org.people.integrator.email, org.people.integrator.password);
    await page.goto(`${APP_URL}/integrations/webhooks`);
    await expect(page.getByRole("heading", { name: "Webhooks" }).isVisible()).resolves.toBe(true);

    const receiver = `browser${Date.now().toString(36)}`;
    const url = `${PARTNER_URL}/hooks/${receiver}`;
    const form = page.getByRole("form", { name: "Add an endpoint" });
    await form.getByLabel("URL").fill(url);
    await form.getByLabel("Description").fill("Ostrovel yard scheduler (browser test)");
    await form.getByRole("button", { name: "Add endpoint" }).click();
    await expect(form.getByRole("status").textContent()).resolves.toContain("Endpoint added");

    const card = page.getByRole("listitem", { name: `Endpoint ${url}` });
    await card.getByRole("button", { name: "Reveal secret" }).click();
    const secret = (await card.getByTestId("signing-secret").textContent()) ?? "";
    expect(secret).toMatch(/^whsec_/);
    await configurePartner(receiver, { secrets: [secret] });

    await card.getByRole("button", { name: `Send a test event to ${url}` }).click();
    await expect(card.getByRole("form", { name: `Send a test event to ${url}` }).getByRole("status").textContent()).resolves.toContain("queued");

    await waitFor("the partner to process the test event", async () => (await readPartner(receiver)).processed.length === 1);
    const received = await readPartner(receiver);
    expect(received.deliveries[0]).toMatchObject({ verified: true, answeredStatus: 200 });

    await page.getByRole("link", { name: "Delivery log" }).click();
    await page.waitForURL((u) => u.pathname === "/integrations/webhooks/deliveries");
    const row = page.getByTestId("delivery-row").filter({ hasText: url });
    await waitFor("the delivery log to show success", async () => {
      await page.reload();
      return (await row.count()) === 1 && (await row.textContent())?.includes("succeeded");
    });
    const text = (await row.textContent()) ?? "";
    expect(text).toContain("webhook.test");
    expect(text).toContain(received.deliveries[0]!.webhookId);
    expect(text).toMatch(/#1 · HTTP 200 · \d+ ms/);

    // Filtering by status hides it under "failed".
    const filtered = await page.goto(`${APP_URL}/integrations/webhooks/deliveries?status=failed`);
    // The delivery log itself rendered, so a count of 0 means the filter hid the row.
    expect(filtered?.ok()).toBe(true);
    await page.getByRole("heading", { name: "Webhook deliveries" }).waitFor();
    await expect(page.getByTestId("delivery-row").filter({ hasText: url }).count()).resolves.toBe(0);
    await page.close();
  });
});
