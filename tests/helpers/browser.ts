import { chromium, type Browser, type Page } from "playwright-core";

import { APP_URL } from "./app";

/** Debian's chromium, kept off the closed network (see the project notes). */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-quic"],
  });
}

export async function signInThroughForm(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${APP_URL}/sign-in`);
  const form = page.getByRole("form", { name: "Sign in" });
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("Password").fill(password);
  await form.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => url.pathname === "/schedules");
}
