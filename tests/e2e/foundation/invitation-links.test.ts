import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deriveKey, signToken } from "@/server/auth/signed-tokens";
import { demoAccount } from "../../support/demo-accounts";
import { signInOverHttp, type HttpSession } from "../../support/http-session";
import { acceptLinkIn, newestMailTo } from "../../support/mailbox-reader";
import { removeDataDir, seededDataDir } from "../../support/seeded-data-dir";
import { startServer, type RunningServer } from "../../support/server";

// A known secret lets this file sign an expired invitation exactly as the server would.
const AUTH_SECRET = "e2e-invitation-links-secret-0123456789abcdef";

let server: RunningServer;
let admin: HttpSession;

beforeAll(async () => {
  server = await startServer({ dataDir: await seededDataDir("links"), env: { AUTH_SECRET } });
  const { email, password } = demoAccount("admin");
  admin = (await signInOverHttp(server.baseUrl, email, password)).session;
});
afterAll(async () => {
  await server?.stop();
  removeDataDir(server?.dataDir);
});

const postJson = (path: string, body: string) =>
  admin.fetch(path, { method: "POST", headers: { "Content-Type": "application/json" }, body });

describe("invitation links", () => {
  let link: URL;
  const pageOf = async (href: string) => {
    const res = await fetch(href);
    return { status: res.status, html: await res.text() };
  };
  const tokenOf = (u: URL) => u.searchParams.get("token") ?? "";

  beforeAll(async () => {
    const invited = await postJson(
      "/api/admin/users",
      JSON.stringify({
        email: "links@halden-ridge.example",
        name: "Link Tester",
        role: "verifier",
      }),
    );
    expect(invited.status).toBe(201);
    link = acceptLinkIn(await newestMailTo(admin, "links@halden-ridge.example"));
  });

  it("shows the password form for the link as sent", async () => {
    const { status, html } = await pageOf(link.href);
    expect(status).toBe(200);
    expect(html).toContain("Welcome to Facula");
  });

  it("explains a missing, tampered or expired link with a 4xx page", async () => {
    const missing = await pageOf(`${server.baseUrl}/invitations/accept`);
    expect(missing.status).toBe(400);
    expect(missing.html).toContain("This page needs the link from your invitation e-mail.");

    const token = tokenOf(link);
    const tampered = new URL(link);
    tampered.searchParams.set("token", token.slice(0, -1) + (token.endsWith("A") ? "B" : "A"));
    const bad = await pageOf(tampered.href);
    expect(bad.status).toBe(410);
    expect(bad.html).toContain(
      "This invitation link is not valid. Ask your administrator for a new invitation.",
    );

    const claim = (
      JSON.parse(Buffer.from(token.split(".")[0] ?? "", "base64url").toString("utf8")) as {
        d: unknown;
      }
    ).d;
    const stale = new URL(link);
    stale.searchParams.set(
      "token",
      signToken(
        deriveKey(AUTH_SECRET, "invitation"),
        "invitation",
        claim,
        new Date(Date.now() - 60_000),
      ),
    );
    const expired = await pageOf(stale.href);
    expect(expired.status).toBe(410);
    expect(expired.html).toContain(
      "This invitation link has expired. Ask your administrator to send a new one.",
    );
  });

  it("works once, then shows a used link as such and refuses it over the API", async () => {
    const body = {
      token: tokenOf(link),
      password: "faculae-bright-9",
      confirm: "faculae-bright-9",
    };
    const accepted = await postJson("/api/invitations/accept", JSON.stringify(body));
    expect(accepted.status).toBe(200);
    expect(await accepted.json()).toEqual({ email: "links@halden-ridge.example" });
    const used = await pageOf(link.href);
    expect(used.status).toBe(410);
    expect(used.html).toContain(
      "This invitation link has already been used. Sign in with the password you set.",
    );
    const again = await postJson(
      "/api/invitations/accept",
      JSON.stringify({ ...body, password: "faculae-dim-10", confirm: "faculae-dim-10" }),
    );
    expect(again.status).toBe(422);
    expect(await again.json()).toMatchObject({ error: { code: "UNPROCESSABLE_CONTENT" } });
  });
});
