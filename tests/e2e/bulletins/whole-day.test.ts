// The whole day in real Chromium: a forecaster drafts and submits; a duty officer reviews, sees
// the e-mail preview and issues; the local mailbox holds the bulletin for every subscribed
// contact and an alert only where a threshold was crossed; a subscriber follows the
// acknowledgement link; the alert board shows it acknowledged.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { launchBrowser, signInThroughForm } from "../../support/browser";
import { signInOverHttp, type HttpSession } from "../../support/http-session";
import { startServer, type RunningServer } from "../../support/server";

const DAY = "2026-11-29";
let server: RunningServer;
let admin: HttpSession;
const browsers: BrowserContext[] = [];

// Finals of the day's one region, so the full disk equals them (demo thresholds in
// src/server/dissemination/demo-contacts.ts decide who is alerted).
const FINALS = {
  "C+": { "24h": 0.85, "48h": 0.92, "72h": 0.95 },
  "M+": { "24h": 0.45, "48h": 0.6, "72h": 0.7 },
  X: { "24h": 0.03, "48h": 0.06, "72h": 0.09 },
};
// Subscribed contacts of the demo (every-bulletin on); the night dispatcher has it off.
const BULLETIN_RECIPIENTS = [
  "dana.whitlock@northmarch.example",
  "rui.castell@skylark-hf.example",
  "mina.sato@little-auk.example",
  "control-room@northmarch.example",
  "edda.strand@northmarch.example",
  "flight-dynamics@little-auk.example",
];
// M+ 48 h ≥ 30 % (Dana), M+ 24 h ≥ 40 % (Rui), M+ 24 h ≥ 25 % (Mina) are crossed; the control
// room's M+ 24 h ≥ 50 %, Mina's C+ 24 h ≥ 90 % and every X threshold are not.
const ALERTED = ["dana.whitlock@northmarch.example", "rui.castell@skylark-hf.example", "mina.sato@little-auk.example"];

interface Caught { id: string; to: string[] | string; subject: string }
const recipientsOf = (m: Caught) => (Array.isArray(m.to) ? m.to : [m.to]);

async function mailbox(): Promise<Caught[]> {
  const res = await admin.fetch("/api/admin/mailbox?pageSize=200");
  expect(res.status).toBe(200);
  return ((await res.json()) as { messages: Caught[] }).messages;
}

beforeAll(async () => {
  server = await startServer({ env: { FACULA_DEMO_ARCHIVE: "off" } });
  admin = (await signInOverHttp(server.baseUrl, "sam.okafor@halden-ridge.example", "admin-halden-2026")).session;
  const forecaster = (await signInOverHttp(server.baseUrl, "ines.marlow@halden-ridge.example", "sunspot-forecast-1")).session;
  const reasons = Object.fromEntries(
    (["C+", "M+", "X"] as const).flatMap((l) => ["24h", "48h", "72h"].map((w) => [`${l}.${w}`, "Rapid emergence of opposite flux within the leader penumbra."])),
  );
  const created = await forecaster.fetch("/api/assessments", {
    method: "POST",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify({
      forecastDay: DAY, region: "HR-0412", location: "N12E34", areaMsh: 240, spotCount: 14, mcintosh: "Dkc",
      mountWilson: "beta-gamma-delta", unsignedFluxMx: 2.1e22, pilLengthMm: 45, logR: 4.6, meanShearDeg: 38,
      flares24h: { C: 3, M: 1, X: 0 }, finals: FINALS, finalReasons: reasons,
    }),
  });
  expect(created.status).toBe(201);
});

afterAll(async () => {
  for (const b of browsers) await b.close();
  await server?.stop();
});

async function browserAs(email: string, password: string) {
  const ctx = await launchBrowser();
  browsers.push(ctx);
  const page = await ctx.newPage();
  await signInThroughForm(page, server.baseUrl, email, password);
  await page.waitForURL(`${server.baseUrl}/`);
  return page;
}

describe("the whole day", () => {
  let bulletinUrl = "";

  it("a forecaster drafts the bulletin, writes the discussion and submits it", async () => {
    const page = await browserAs("ines.marlow@halden-ridge.example", "sunspot-forecast-1");
    await page.goto(`${server.baseUrl}/days/${DAY}`);
    expect(await page.getByTestId("day-bulletin").innerText()).toContain("No bulletin drafted");
    await page.goto(`${server.baseUrl}/bulletins`);
    await page.getByLabel("Forecast day (UTC)").fill(DAY);
    await page.getByRole("button", { name: "Start bulletin" }).click();
    await page.waitForURL(/\/bulletins\/\d+$/, { timeout: 15_000 });
    bulletinUrl = page.url();
    await page.getByLabel("Edit the discussion").fill("HR-0412 keeps its delta configuration; M-class flares are likely in the next two days.");
    await page.getByRole("button", { name: "Save discussion" }).click();
    const submit = page.getByRole("button", { name: "Submit for review" });
    await expect.poll(async () => submit.isEnabled(), { timeout: 15_000 }).toBe(true);
    await submit.click();
    await expect.poll(async () => page.getByText(/in review/i).first().isVisible(), { timeout: 15_000 }).toBe(true);
  });

  it("a duty officer reviews, sees the e-mail as recipients will, and issues", async () => {
    const page = await browserAs("aurelia.vance@halden-ridge.example", "duty-desk-sign-1");
    await page.goto(bulletinUrl);
    expect(await page.locator("iframe").count()).toBeGreaterThan(0);
    await page.getByRole("button", { name: "Approve and issue…" }).click();
    const approved = page.waitForResponse((r) => r.url().endsWith("/approve") && r.request().method() === "POST", { timeout: 30_000 });
    await page.getByRole("button", { name: "Issue now" }).click();
    expect((await approved).status()).toBe(200);
    await page.goto(`${server.baseUrl}/days/${DAY}`);
    expect(await page.getByTestId("day-bulletin").innerText()).toContain("Bulletin v1: issued");
  });

  it("the mailbox holds the bulletin for every subscribed contact and alerts only where thresholds were crossed", async () => {
    const isBulletin = (m: Caught) => /flare-risk bulletin v1/.test(m.subject);
    const isAlert = (m: Caught) => m.subject.startsWith("Flare-risk alert");
    await expect
      .poll(async () => (await mailbox()).filter(isBulletin).length, { timeout: 60_000, interval: 1000 })
      .toBe(BULLETIN_RECIPIENTS.length);
    await expect.poll(async () => (await mailbox()).filter(isAlert).length, { timeout: 30_000, interval: 1000 }).toBe(ALERTED.length);
    const messages = await mailbox();
    expect(messages.filter(isBulletin).flatMap(recipientsOf).sort()).toEqual([...BULLETIN_RECIPIENTS].sort());
    expect(messages.filter(isAlert).flatMap(recipientsOf).sort()).toEqual([...ALERTED].sort());
    // The night dispatcher turned bulletins off and no threshold of theirs was crossed.
    expect(messages.some((m) => recipientsOf(m).includes("night-dispatch@skylark-hf.example"))).toBe(false);
  });

  it("a subscriber follows the acknowledgement link without signing in, and the board shows it", async () => {
    const alert = (await mailbox()).find((m) => m.subject.startsWith("Flare-risk alert") && recipientsOf(m).includes("dana.whitlock@northmarch.example"));
    expect(alert).toBeDefined();
    const full = (await (await admin.fetch(`/api/admin/mailbox/${alert!.id}`)).json()) as { text: string };
    const link = /https?:\/\/\S+\/ack\?token=[\w.-]+/.exec(full.text)?.[0];
    expect(link).toBeDefined();

    const ctx = await launchBrowser();
    browsers.push(ctx);
    const page = await ctx.newPage();
    const res = await page.goto(link!);
    expect(res?.status()).toBe(200);
    await page.getByRole("button", { name: "Acknowledge" }).click();
    await expect.poll(async () => page.getByText("Alert acknowledged").isVisible(), { timeout: 15_000 }).toBe(true);

    const duty = await browserAs("kofi.adjei@halden-ridge.example", "duty-desk-sign-2");
    await duty.goto(`${server.baseUrl}/alerts`);
    const row = duty.locator("tr", { hasText: "Dana Whitlock" }).first();
    await expect.poll(async () => (await row.innerText()).toLowerCase(), { timeout: 15_000 }).toContain("acknowledged");
    const rui = duty.locator("tr", { hasText: "Rui Castell" }).first();
    expect((await rui.innerText()).toLowerCase()).not.toContain("acknowledged 20");
  });
});
