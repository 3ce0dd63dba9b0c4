import type { BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/lib/auth/roles";
import { launchBrowser } from "../../support/browser";
import { demoAccount } from "../../support/demo-accounts";
import { signInOverHttp, type HttpSession } from "../../support/http-session";
import { signInWithForm, waitForIslands } from "../../support/islands";
import { acceptLinkIn, newestMailTo } from "../../support/mailbox-reader";
import { removeDataDir, seededDataDir } from "../../support/seeded-data-dir";
import { startServer, type RunningServer } from "../../support/server";

// What the shell must show; written out here rather than read from the navigation module.
const ROLE_CHIP: Record<Role, string> = {
  forecaster: "Forecaster",
  duty_officer: "Duty officer",
  verifier: "Verifier",
  subscriber: "Subscriber",
  admin: "Administrator",
};
const ADMIN_ONLY = ["People", "Organisations", "Office settings", "Audit trail", "Mailbox (local)"];
const WRONG_CREDENTIALS = "That e-mail address and password do not match an active account.";

let server: RunningServer;
let browser: BrowserContext;
let page: Page;
let admin: HttpSession;

beforeAll(async () => {
  server = await startServer({ dataDir: await seededDataDir("browser") });
  browser = await launchBrowser();
  // Generous waits: a loaded two-core machine can take many seconds to hydrate a page.
  browser.setDefaultTimeout(60_000);
  const { email, password } = demoAccount("admin");
  admin = (await signInOverHttp(server.baseUrl, email, password)).session;
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
  removeDataDir(server?.dataDir);
});
beforeEach(async () => {
  await browser.clearCookies();
  page = browser.pages()[0] ?? (await browser.newPage());
});

const navLabels = () => page.locator('nav[aria-label="Main"] a').allTextContents();
const headerText = () => page.locator("header").innerText();

describe("signing in through the form", () => {
  it.each(ROLES)("%s lands on the overview and sees the navigation of its role", async (role) => {
    const person = demoAccount(role);
    await signInWithForm(page, server.baseUrl, person.email, person.password);
    expect(new URL(page.url()).pathname).toBe("/");
    expect(await headerText()).toContain(person.name);
    expect(await headerText()).toContain(ROLE_CHIP[role]);
    const labels = (await navLabels()).map((l) => l.trim());
    expect(labels[0]).toBe("Overview");
    if (role === "admin") expect(labels).toEqual(expect.arrayContaining(ADMIN_ONLY));
    else expect(labels.filter((l) => ADMIN_ONLY.includes(l))).toEqual([]);
  });

  it("shows the error message for a wrong password and stays signed out", async () => {
    const { email } = demoAccount("verifier");
    await signInWithForm(page, server.baseUrl, email, "not-the-password-1");
    await expect.poll(() => page.getByRole("alert").innerText()).toBe(WRONG_CREDENTIALS);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect((await browser.cookies()).map((c) => c.name)).not.toContain("authjs.session-token");
  });

  it("shows a forecaster the 403 page on the people administration", async () => {
    const { email, password } = demoAccount("forecaster");
    await signInWithForm(page, server.baseUrl, email, password);
    const response = await page.goto(`${server.baseUrl}/admin/users`);
    expect(response?.status()).toBe(403);
    const main = await page.locator("main").innerText();
    expect(main).toContain("This page is not part of your role's work");
    expect(main).toContain("You are signed in as forecaster.");
    expect(main).not.toContain("People and roles");
  });
});

describe("deactivation", () => {
  it("refuses a deactivated person on their next request", async () => {
    const person = demoAccount("forecaster", 1);
    await signInWithForm(page, server.baseUrl, person.email, person.password);
    expect((await page.request.get(`${server.baseUrl}/api/admin/users`)).status()).toBe(403);

    const found = await admin.fetch(`/api/admin/users?q=${encodeURIComponent(person.email)}`);
    const { users } = (await found.json()) as { users: { id: number; email: string }[] };
    const id = users.find((u) => u.email === person.email)?.id;
    const patch = await admin.fetch(`/api/admin/users/${id}`, {
      method: "PATCH",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ isActive: false }),
    });
    expect(patch.status).toBe(204);

    const api = await page.request.get(`${server.baseUrl}/api/admin/users`);
    expect(api.status()).toBe(401);
    expect(await api.json()).toMatchObject({ error: { code: "UNAUTHORIZED" } });
    await page.goto(`${server.baseUrl}/`);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(new URL(page.url()).searchParams.get("reason")).toBe("deactivated");
    await expect
      .poll(() => page.getByRole("status").innerText())
      .toContain("Your account has been deactivated.");

    await signInWithForm(page, server.baseUrl, person.email, person.password);
    await expect.poll(() => page.getByRole("alert").innerText()).toBe(WRONG_CREDENTIALS);
  });
});

describe("an invitation from start to finish", () => {
  it("goes from the People form to an e-mail, a password and a first sign-in", async () => {
    const invitee = {
      name: "Lena Okoro",
      email: "lena.okoro@halden-ridge.example",
      password: "umbra-penumbra-7",
    };
    const boss = demoAccount("admin");
    await signInWithForm(page, server.baseUrl, boss.email, boss.password);
    await page.goto(`${server.baseUrl}/admin/users`);
    await waitForIslands(page);
    const form = page.getByRole("form", { name: "Invite a person" });
    await form.getByLabel("Name").fill(invitee.name);
    await form.getByLabel("E-mail address").fill(invitee.email);
    await form.getByLabel("Role").selectOption({ label: "Duty officer" });
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect
      .poll(() => form.getByRole("status").innerText())
      .toBe(`Invitation sent to ${invitee.email}. The link is valid for 72 hours.`);

    const mail = await newestMailTo(admin, invitee.email);
    expect(mail.subject).toContain(`${boss.name} invited you`);
    const link = acceptLinkIn(mail);
    expect(link.origin).toBe(server.baseUrl);

    await browser.clearCookies();
    await page.goto(link.href);
    await waitForIslands(page);
    expect(await page.locator("main").innerText()).toContain(
      `${invitee.name} (${invitee.email}) · Duty officer`,
    );
    await page.getByLabel("New password").fill(invitee.password);
    await page.getByLabel("Repeat the password").fill(invitee.password);
    await page.getByRole("button", { name: "Set password" }).click();
    await page.waitForURL(
      (url) => url.pathname === "/sign-in" && url.searchParams.has("passwordSet"),
    );
    await expect
      .poll(() => page.getByRole("status").innerText())
      .toBe("Your password is set. Sign in to continue.");

    await signInWithForm(page, server.baseUrl, invitee.email, invitee.password);
    expect(new URL(page.url()).pathname).toBe("/");
    expect(await headerText()).toContain(invitee.name);
    expect(await headerText()).toContain("Duty officer");
    expect((await navLabels()).filter((l) => ADMIN_ONLY.includes(l.trim()))).toEqual([]);

    const again = await page.goto(link.href);
    expect(again?.status()).toBe(410);
    expect(await page.getByRole("alert").innerText()).toBe(
      "This invitation link has already been used. Sign in with the password you set.",
    );
  });
});
