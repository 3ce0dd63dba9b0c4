// Real headless Chromium (Debian's package) driven by playwright-core, one fresh profile per launch.
import { chromium, type BrowserContext, type Page } from "playwright-core";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export async function launchBrowser(): Promise<BrowserContext> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), "facula-chromium-"));
  return chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium",
    args: ARGS,
    viewport: { width: 1280, height: 860 },
  });
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  // Until the island hydrates, a click would submit the bare HTML form (and put the password in the URL).
  await page.waitForFunction(() => document.querySelectorAll("astro-island[ssr]").length === 0);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}
