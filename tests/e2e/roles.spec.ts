// In a real browser: each role signs in and sees only its areas; an invitation e-mail captured by
// the SMTP fake is followed to a working account.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { roles } from "@/db/schema";
import { pageAccess } from "@/lib/server/auth/access-table";
import { hasPermission } from "@/lib/server/auth/permissions";
import { APP_URL, demoUser } from "@/tests/helpers/app";
import { launchBrowser, signInThroughForm } from "@/tests/helpers/browser";
import { extractLink, waitForMail } from "@/tests/helpers/mail";

const areas = { Schedules: "/schedules", Review: "/review", Integrations: "/integrations", Settings: "/settings", People: "/people" } as const;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("each role in the browser", () => {
  for (const role of roles) {
    it(`${role} sees exactly the areas the permission table grants`, async () => {
      const page = await browser.newPage();
      const { email, password } = demoUser(role);
      await signInThroughForm(page, email, password);
      const nav = page.getByRole("navigation", { name: "Main" });
      const shown = await nav.getByRole("link").allInnerTexts();
      const allowed = Object.entries(areas)
        .filter(([, path]) => hasPermission(role, pageAccess[path]))
        .map(([label]) => label);
      expect(shown).toEqual(allowed);
      // A page outside the role answers with the 403 page, not its content.
      for (const [label, path] of Object.entries(areas)) {
        if (allowed.includes(label)) continue;
        const response = await page.goto(`${APP_URL}${path}`);
        expect(response?.status(), `${role} ${path}`).toBe(403);
        await expect(page.getByRole("heading", { name: "Not available to your role" }).isVisible()).resolves.toBe(true);
      }
      await page.close();
    });
  }
});

describe("an invitation from the people page", () => {
  it("is e-mailed, followed, and ends in a signed-in account", async () => {
    const page = await browser.newPage();
    const admin = demoUser("admin");
    await signInThroughForm(page, admin.email, admin.password);
    await page.getByRole("link", { name: "People" }).click();
    const invitee = `browser-${Date.now().toString(36)}@test.example`;
    const form = page.getByRole("form", { name: "Invite a person" });
    await form.getByLabel("E-mail").fill(invitee);
    await form.getByLabel("Role").selectOption("submitter");
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect(form.getByRole("status").textContent()).resolves.toContain(`Invitation sent to ${invitee}`);

    const link = extractLink(await waitForMail(invitee, "invited"), "/invitations/");
    const guest = await browser.newPage();
    await guest.goto(link);
    const accept = guest.getByRole("form", { name: "Accept invitation" });
    await accept.getByLabel("Your name").fill("Wren Okonkwo-Hale");
    await accept.getByLabel(/Choose a password/).fill("browser-test-passphrase");
    await accept.getByRole("button", { name: "Accept and join" }).click();
    await guest.waitForURL((url) => url.pathname === "/sign-in");
    await signInThroughForm(guest, invitee, "browser-test-passphrase");
    await expect(guest.getByTestId("who").textContent()).resolves.toContain("Wren Okonkwo-Hale · Submitter");
    await page.close();
    await guest.close();
  });
});
