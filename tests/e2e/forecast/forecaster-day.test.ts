// A forecaster's day in real Chromium: fill a region through the form, watch guidance update,
// set finals with a reason where they leave the guidance, and find it all on the day page.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { launchBrowser, signInThroughForm } from "../../support/browser";
import { signInOverHttp } from "../../support/http-session";
import { startServer, type RunningServer } from "../../support/server";

const DAY = "2026-11-30";
let server: RunningServer;
let browser: BrowserContext;
let page: Page;

beforeAll(async () => {
  server = await startServer({ env: { FACULA_DEMO_ARCHIVE: "off" } });
  browser = await launchBrowser();
  page = await browser.newPage();
  await signInThroughForm(page, server.baseUrl, "ines.marlow@halden-ridge.example", "sunspot-forecast-1");
  await page.waitForURL(`${server.baseUrl}/`);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const blendedRow = () => page.getByTestId("blended-row");

describe("forecaster assesses a region", () => {
  it("fills the form, sees guidance update, and saves finals with a reason", async () => {
    await page.goto(`${server.baseUrl}/days/${DAY}`);
    await page.getByLabel("Region number").fill("HR-0412");
    await page.getByRole("button", { name: "Assess region" }).click();
    await page.waitForURL(/\/assess\?region=HR-0412/);

    await page.getByLabel("Location (heliographic)").fill("N12E34");
    await page.getByLabel("Area (MSH)").fill("240");
    await page.getByLabel("Number of spots").fill("14");
    await page.getByLabel("McIntosh class").fill("Dkc");
    await page.getByLabel("Mount Wilson class").selectOption("beta-gamma-delta");
    await page.getByLabel("Total unsigned flux (Mx)").fill("2.1e22");
    await page.getByLabel("Polarity-inversion-line length (Mm)").fill("45");
    await page.getByLabel("Schrijver log R (log10 Mx)").fill("4.6");
    await page.getByLabel("Mean shear angle (degrees)").fill("38");

    // Guidance appears once the region fields are complete (debounced request to /api/guidance).
    await expect.poll(async () => (await blendedRow().count()) > 0, { timeout: 15_000 }).toBe(true);
    const before = await blendedRow().innerText();
    expect(before).toMatch(/Blended guidance\s+\d+/);

    // A larger flux raises the logistic model's guidance: the blended row must change.
    await page.getByLabel("Total unsigned flux (Mx)").fill("9e22");
    await expect.poll(async () => blendedRow().innerText(), { timeout: 15_000 }).not.toBe(before);

    await page.getByRole("button", { name: "Start from blended guidance" }).click();
    const m24 = page.getByLabel("Final M+ 24h (%)");
    const guided = Number(await m24.inputValue());
    expect(guided).toBeGreaterThan(0);
    // Far above guidance at every M+ window keeps the order rules (24 ≤ 48 ≤ 72 h, X ≤ M+ ≤ C+).
    const high = String(Math.min(95, Math.round(guided) + 30));
    await page.getByLabel("Final C+ 24h (%)").fill("99");
    await page.getByLabel("Final C+ 48h (%)").fill("99");
    await page.getByLabel("Final C+ 72h (%)").fill("99");
    await m24.fill(high);
    await page.getByLabel("Final M+ 48h (%)").fill(String(Math.max(Number(high), Number(await page.getByLabel("Final M+ 48h (%)").inputValue()))));
    await page.getByLabel("Final M+ 72h (%)").fill(String(Math.max(Number(high), Number(await page.getByLabel("Final M+ 72h (%)").inputValue()))));

    // Saving without the reason is refused with the message beside the field.
    const reason = page.getByLabel("Reason for M+ 24h");
    await expect.poll(async () => reason.count()).toBe(1);
    await page.getByRole("button", { name: "Save assessment" }).click();
    await expect.poll(async () => page.getByText("Give a reason: this differs from guidance").first().isVisible(), { timeout: 10_000 }).toBe(true);

    for (const field of await page.getByLabel(/^Reason for /).all()) await field.fill("Delta spot merging in the leader; rapid flux emergence since 18 UTC.");
    await page.getByRole("button", { name: "Save assessment" }).click();
    await page.waitForURL(/\/days\/2026-11-30\?saved=HR-0412/, { timeout: 15_000 });
    await expect.poll(async () => page.getByText("Saved the assessment of HR-0412.").isVisible()).toBe(true);
    const row = page.locator('[data-testid="day-table"] tr[data-region="HR-0412"]');
    expect(await row.innerText()).toContain(high);
  });

  it("stored guidance and finals side by side, with the reason", async () => {
    const { session } = await signInOverHttp(server.baseUrl, "ines.marlow@halden-ridge.example", "sunspot-forecast-1");
    const res = await session.fetch(`/api/assessments?day=${DAY}`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { assessments: Array<{ region: string; finals: Record<string, Record<string, number>>; blended: Record<string, Record<string, number>>; finalReasons: Record<string, string> }> };
    const saved = body.assessments.find((a) => a.region === "HR-0412");
    expect(saved).toBeDefined();
    expect(saved!.finals["M+"]!["24h"]).toBeGreaterThan(saved!.blended["M+"]!["24h"]! + 0.1);
    expect(saved!.finalReasons["M+.24h"]).toContain("Delta spot");
  });

  it("imports a day's regions from a CSV file: a bad row blocks the import, a good file commits", async () => {
    const header = "Region,Location,Area,Spots,McIntosh,Mount Wilson,Flux Mx";
    const bad = `${header}\nHR-0420,S05W61,120,6,Dxx,beta,1e22\nHR-0421,N20E10,60,3,Cao,beta,\n`;
    const good = `${header}\nHR-0420,S05W61,120,6,Dao,beta,1e22\nHR-0421,N20E10,60,3,Cao,beta,\n`;
    await page.goto(`${server.baseUrl}/days/${DAY}/import`);
    await page.locator("#import-file").setInputFiles({ name: "bad.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Check the rows" }).click();
    const importButton = page.getByRole("button", { name: /^Import 2 regions$/ });
    await expect.poll(async () => importButton.count(), { timeout: 20_000 }).toBe(1);
    expect(await importButton.isDisabled()).toBe(true);
    expect(await page.getByText(/Dxx/).count()).toBeGreaterThan(0);

    await page.getByRole("button", { name: "Choose another file" }).or(page.getByRole("button", { name: "Check again" })).first().click();
    await page.goto(`${server.baseUrl}/days/${DAY}/import`);
    await page.locator("#import-file").setInputFiles({ name: "good.csv", mimeType: "text/csv", buffer: Buffer.from(good) });
    await page.getByRole("button", { name: "Check the rows" }).click();
    await expect.poll(async () => importButton.isEnabled().catch(() => false), { timeout: 20_000 }).toBe(true);
    await importButton.click();
    await expect.poll(async () => page.getByText(`Imported 2 regions for ${DAY} UTC`).isVisible(), { timeout: 20_000 }).toBe(true);

    await page.goto(`${server.baseUrl}/days/${DAY}`);
    expect(await page.locator('[data-testid="day-table"] tr[data-region="HR-0420"]').count()).toBe(1);
    expect(await page.locator('[data-testid="day-table"] tr[data-region="HR-0421"]').count()).toBe(1);
    // S05W61 lies beyond 60° from disk centre: the row carries the limb flag.
    expect(await page.locator('tr[data-region="HR-0420"]').innerText()).toContain("limb");
  });

  it("a subscriber may not read assessments (403) and signed-out calls get 401", async () => {
    const { session } = await signInOverHttp(server.baseUrl, "dana.whitlock@northmarch.example", "grid-watch-2026");
    expect((await session.fetch(`/api/assessments?day=${DAY}`)).status).toBe(403);
    expect((await fetch(`${server.baseUrl}/api/assessments?day=${DAY}`)).status).toBe(401);
  });
});
