// A verifier in real Chromium: uploads two external forecast series and an observed event list
// through the forms, opens the report and reads the scores and plots; a forecaster reads only.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { launchBrowser, signInThroughForm } from "../../support/browser";
import { startServer, type RunningServer } from "../../support/server";
import { brierOf, DAYS, pA, pB, writeFiles } from "./verifier-files";

let server: RunningServer;
let browser: BrowserContext;
let page: Page;
let files: ReturnType<typeof writeFiles>;

beforeAll(async () => {
  files = writeFiles(fs.mkdtempSync(path.join(os.tmpdir(), "facula-verif-e2e-")));
  server = await startServer();
  browser = await launchBrowser();
  page = await browser.newPage();
  await signInThroughForm(
    page,
    server.baseUrl,
    "priya.lund@halden-ridge.example",
    "verify-skill-2026",
  );
  await page.waitForURL(`${server.baseUrl}/`);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

/** The upload form works once its island has hydrated; its check button is disabled until then. */
async function waitForUploadForm() {
  await expect
    .poll(() => page.getByRole("button", { name: "Check the file" }).isEnabled())
    .toBe(true);
}

async function uploadSeries(name: string, file: string) {
  await waitForUploadForm();
  await page.getByLabel("Series name").fill(name);
  await page
    .getByLabel(/^Provenance/)
    .fill("Invented for the browser test (demo — invented for the scenario)");
  await page.getByLabel("CSV file").setInputFiles(file);
  await page.getByRole("button", { name: "Check the file" }).click();
  await expect
    .poll(() => page.getByTestId("preview-counts").innerText())
    .toMatch(/60 rows: 60 ready/);
  await page.getByRole("button", { name: "Store 60 forecasts" }).click();
  await page.getByText("Stored 60 forecasts.").waitFor();
}

describe("a verifier scores an external series against observed events", () => {
  it("uploads two external series through the form", async () => {
    await page.goto(`${server.baseUrl}/verification/external`);
    await uploadSeries("Partner desk", files.a);
    await uploadSeries("Flat thirty", files.b);
    await page.reload();
    await expect
      .poll(() => page.getByRole("table").last().innerText())
      .toMatch(/Partner desk[\s\S]*Flat thirty|Flat thirty[\s\S]*Partner desk/);
  });

  it("refuses a file with a malformed class, then uploads the event list", async () => {
    await page.goto(`${server.baseUrl}/verification/events`);
    await waitForUploadForm();
    await page.getByLabel("List name").fill("Browser test flares");
    await page.getByLabel(/^True flux/).check();
    const file = page.getByLabel("File (CSV with a header row, or JSON)");
    await file.setInputFiles(files.bad);
    await page.getByRole("button", { name: "Check the file" }).click();
    await expect
      .poll(() => page.getByTestId("preview-counts").innerText())
      .toMatch(/1 rows: 0 ready, 1 with errors/);
    await expect(page.getByText(/"Q1.0" is not a GOES class/).isVisible()).resolves.toBe(true);
    expect(
      await page
        .getByRole("button", { name: /^Store/ })
        .first()
        .isDisabled(),
    ).toBe(true);

    await file.setInputFiles(files.events);
    await page.getByRole("button", { name: "Check the file" }).click();
    await expect
      .poll(() => page.getByTestId("preview-counts").innerText())
      .toMatch(/60 rows: 60 ready/);
    await page.getByRole("button", { name: "Store 60 events" }).click();
    await page.getByText("Stored 60 events.").waitFor();
    await page.getByLabel("Class at least").selectOption("M+");
    await expect
      .poll(() => page.getByRole("navigation", { name: "Pages" }).innerText())
      .toMatch(/of 15/);
  });

  it("opens the report, chooses source and reference, and sees scores, intervals and plots", async () => {
    await page.goto(`${server.baseUrl}/verification`);
    await page
      .getByLabel("Scored source")
      .selectOption({ label: "External: Partner desk (60 records)" });
    await page.getByLabel(/^Reference/).selectOption({ label: "External: Flat thirty" });
    await page.getByLabel("Bootstrap resamples").selectOption("200");
    await page.getByRole("button", { name: "Score" }).click();
    await page.waitForURL(/source=external/);
    await expect
      .poll(() => page.getByTestId("sample-size").innerText())
      .toMatch(/^60 cases, 15 events/);
    const brier = await page.getByTestId("score-brier").innerText();
    expect(brier).toContain(brierOf(pA).toFixed(3));
    // Against the flat 30 % series: BSS = 1 − BS_A / BS_B (Wilks).
    const bssRef = await page.getByTestId("score-bssReference").innerText();
    expect(bssRef).toContain((1 - brierOf(pA) / brierOf(pB)).toFixed(3));
    // The intervals arrive after the progress bar; each score then shows [lower, upper].
    await expect
      .poll(() => page.getByTestId("score-brier").innerText(), { timeout: 60_000 })
      .toMatch(/\[\d\.\d{3}, \d\.\d{3}\]/);
    await expect
      .poll(() => page.getByTestId("skill-difference").innerText())
      .toMatch(/paired bootstrap: \d\.\d{3} \[/);
    expect(await page.getByTestId("cell-hits").innerText()).toBe("15");
    for (const chart of ["reliability", "roc", "timeline", "sweep"]) {
      const curves = page.locator(`[data-chart="${chart}"] .recharts-line-curve`);
      await expect.poll(() => curves.count(), { timeout: 15_000 }).toBeGreaterThan(0);
      const d = await curves.first().getAttribute("d");
      expect(d?.length ?? 0).toBeGreaterThan(20);
    }
    expect(await page.locator("body").innerText()).not.toMatch(/NaN|Infinity/);
  });

  it("exports the pairs as CSV and opens the printable report", async () => {
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: "Export matched pairs (CSV)" }).click();
    const file = await (await download).path();
    const lines = fs.readFileSync(file, "utf8").trim().split(/\r?\n/);
    expect(lines).toHaveLength(DAYS + 1);
    expect(lines[1]).toMatch(
      /^2031-03-01T00:00:00\.000Z,full disk,M\+,24,external:\d+,0\.55,external:\d+,0\.3,1,true$/,
    );
    await page.getByRole("link", { name: "Printable report" }).click();
    await page.waitForURL(/\/verification\/report\?/);
    await expect
      .poll(() => page.getByRole("heading", { level: 1 }).innerText())
      .toMatch(/External: Partner desk: M\+ in 24 h, full disk/);
    await expect
      .poll(() => page.locator('[data-chart="roc"] .recharts-line-curve').count())
      .toBeGreaterThan(0);
  });

  it("shows a forecaster the scores and events read-only", async () => {
    const other = await launchBrowser();
    try {
      const forecaster = await other.newPage();
      await signInThroughForm(
        forecaster,
        server.baseUrl,
        "ines.marlow@halden-ridge.example",
        "sunspot-forecast-1",
      );
      await forecaster.waitForURL(`${server.baseUrl}/`);
      await forecaster.goto(`${server.baseUrl}/verification/events`);
      await expect
        .poll(() => forecaster.getByRole("table", { name: "Observed events" }).innerText())
        .toMatch(/M2\.4/);
      expect(await forecaster.getByRole("heading", { name: "Upload an event list" }).count()).toBe(
        0,
      );
      expect(await forecaster.getByRole("button", { name: "Correct" }).count()).toBe(0);
    } finally {
      await other.close();
    }
  });
});
