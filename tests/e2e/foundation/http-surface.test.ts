import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoAccount } from "../../support/demo-accounts";
import { signInOverHttp, type HttpSession } from "../../support/http-session";
import { sendRaw } from "../../support/raw-http";
import { removeDataDir, seededDataDir } from "../../support/seeded-data-dir";
import { startServer, type RunningServer } from "../../support/server";
import { attemptSignIn, setCookieLine } from "../../support/sign-in-attempt";

const MIB = 1024 * 1024;

let server: RunningServer;
let admin: HttpSession;

beforeAll(async () => {
  server = await startServer({ dataDir: await seededDataDir("http") });
  const { email, password } = demoAccount("admin");
  admin = (await signInOverHttp(server.baseUrl, email, password)).session;
});
afterAll(async () => {
  await server?.stop();
  removeDataDir(server?.dataDir);
});

const get = (path: string) => fetch(`${server.baseUrl}${path}`, { redirect: "manual" });
const postJson = (path: string, body: string, session = admin) =>
  session.fetch(path, { method: "POST", headers: { "Content-Type": "application/json" }, body });

describe("health and headers", () => {
  it("reports the database and the e-mail service as reachable", async () => {
    const res = await get("/api/health");
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({
      status: "ok",
      database: { ok: true },
      email: { ok: true, mode: "local-fake" },
    });
  });

  it.each([
    ["a page", "/sign-in", 200],
    ["a JSON answer", "/api/health", 200],
    ["a redirect to sign-in", "/admin/users", 303],
    ["a refusal", "/api/admin/users", 401],
    ["a missing page", "/no-such-page", 404],
  ])("puts the security headers on %s", async (_label, path, status) => {
    const res = await get(path);
    expect(res.status).toBe(status);
    expect(res.headers.get("content-security-policy")).toMatch(
      /(^|;\s*)frame-ancestors 'none'(;|$)/,
    );
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("same-origin");
  });
});

describe("sign-in over HTTP", () => {
  it("sets the session cookie HttpOnly and SameSite, and none for a wrong password", async () => {
    const { email, password } = demoAccount("verifier");
    const wrong = await attemptSignIn(server.baseUrl, email, "wrong-password-1");
    expect(setCookieLine(wrong, "authjs.session-token")).toBeUndefined();
    const right = await attemptSignIn(server.baseUrl, email, password);
    expect(right.status).toBe(200);
    const cookie = setCookieLine(right, "authjs.session-token") ?? "";
    expect(cookie).toMatch(/;\s*HttpOnly(;|$)/i);
    expect(cookie).toMatch(/;\s*SameSite=(Lax|Strict)(;|$)/i);
    expect(cookie).toMatch(/;\s*Path=\/(;|$)/);
  });

  it("answers 429 with Retry-After after 5 wrong passwords for one account, and lets others in", async () => {
    const target = demoAccount("duty_officer", 1);
    for (let i = 0; i < 5; i++) {
      const res = await attemptSignIn(server.baseUrl, target.email, `wrong-password-${i}`);
      expect(res.status).toBe(200);
      expect(((await res.json()) as { url: string }).url).toContain("error=CredentialsSignin");
    }
    const refused = await attemptSignIn(server.baseUrl, target.email, target.password);
    expect(refused.status).toBe(429);
    const retryAfter = Number(refused.headers.get("retry-after"));
    expect(Number.isInteger(retryAfter) && retryAfter > 0 && retryAfter <= 15 * 60).toBe(true);
    expect(await refused.json()).toEqual({
      error: {
        code: "TOO_MANY_REQUESTS",
        message: "Too many failed sign-ins. Try again in 15 minutes.",
      },
    });
    expect(setCookieLine(refused, "authjs.session-token")).toBeUndefined();
    const other = demoAccount("duty_officer", 0);
    expect(
      setCookieLine(
        await attemptSignIn(server.baseUrl, other.email, other.password),
        "authjs.session-token",
      ),
    ).toBeDefined();
  });

  it.each([
    ["/admin/users", "/admin/users"],
    ["//evil.example", "/"],
    ["/%5Cevil.example", "/"],
    ["/%09/evil.example", "/"],
  ])("sends a signed-in visitor of /sign-in?next=%s back to this site only", async (next, path) => {
    const res = await admin.fetch(`/sign-in?next=${next}`);
    expect(res.status).toBe(303);
    // Browsers resolve Location as a URL (WHATWG URL Standard): "\" and tabs are not safe.
    const target = new URL(res.headers.get("location") ?? "", server.baseUrl);
    expect(target.origin).toBe(server.baseUrl);
    expect(target.pathname).toBe(path);
  });

  it("answers an unknown Auth.js action with a client error, not a server error", async () => {
    const res = await get("/api/auth/no-such-action");
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });
});

describe("request bodies", () => {
  const url = () => `${server.baseUrl}/api/admin/users`;
  const headers = (extra: Record<string, string>) => ({
    "Content-Type": "application/json",
    Cookie: admin.cookie,
    Origin: server.baseUrl,
    ...extra,
  });

  it("answers malformed JSON with a 400 JSON error", async () => {
    const res = await postJson("/api/admin/users", '{"email": "a@b.example",');
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: { code: "BAD_REQUEST", message: "The request body is not valid JSON." },
    });
  });

  it("answers a body over 1 MiB with 413 JSON, declared or streamed, and one under it with 400", async () => {
    const big = Buffer.from(
      JSON.stringify({
        email: "big@halden-ridge.example",
        name: "x".repeat(1.5 * MIB),
        role: "verifier",
      }),
    );
    const declared = await sendRaw(url(), {
      method: "POST",
      headers: headers({ "Content-Length": String(big.length) }),
      body: big,
    });
    const streamed = await sendRaw(url(), {
      method: "POST",
      headers: headers({ "Transfer-Encoding": "chunked" }),
      body: big,
    });
    for (const answer of [declared, streamed]) {
      expect(answer.status).toBe(413);
      expect(JSON.parse(answer.body)).toMatchObject({ error: { code: "PAYLOAD_TOO_LARGE" } });
    }
    const under = Buffer.from(
      JSON.stringify({
        email: "big@halden-ridge.example",
        name: "x".repeat(0.9 * MIB),
        role: "verifier",
      }),
    );
    const fits = await sendRaw(url(), {
      method: "POST",
      headers: headers({ "Content-Length": String(under.length) }),
      body: under,
    });
    expect(fits.status).toBe(400);
    expect(JSON.parse(fits.body)).toMatchObject({
      error: { code: "BAD_REQUEST", fields: { name: expect.any(String) } },
    });
    expect((await get("/api/health")).status).toBe(200);
  });

  it("refuses a body over 12 MiB before anything else, even signed out", async () => {
    const huge = Buffer.alloc(13 * MIB, 0x20);
    const answer = await sendRaw(url(), {
      method: "POST",
      headers: { "Content-Type": "application/json", "Content-Length": String(huge.length) },
      body: huge,
    });
    expect(answer.status).toBe(413);
    expect(answer.headers["x-content-type-options"]).toBe("nosniff");
  });
});
