// Waits for Astro islands to hydrate before a test types into them, so a click is never
// answered by the browser's own form submission instead of the island's handler.
import type { Page } from "playwright-core";

export async function waitForIslands(page: Page): Promise<void> {
  // Astro removes the `ssr` attribute from an <astro-island> once it has hydrated.
  await page.waitForFunction(() => document.querySelectorAll("astro-island[ssr]").length === 0);
}

/** Signs in through the real form and waits until the browser has left the sign-in page or shown an error. */
export async function signInWithForm(
  page: Page,
  baseUrl: string,
  email: string,
  password: string,
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await waitForIslands(page);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  const outcomes = [
    page.waitForURL((url) => url.pathname !== "/sign-in"),
    page.getByRole("alert").first().waitFor(),
  ];
  for (const outcome of outcomes) outcome.catch(() => undefined); // the loser must not go unhandled
  await Promise.any(outcomes);
}
