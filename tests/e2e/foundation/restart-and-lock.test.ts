import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoAccount } from "../../support/demo-accounts";
import { signInOverHttp, type HttpSession } from "../../support/http-session";
import { removeDataDir } from "../../support/seeded-data-dir";
import { startExpectingFailure, startServer, type RunningServer } from "../../support/server";

const ORGANISATION = { name: "Restart Check Ferry Radio (demo)", sector: "hf-radio" };

let server: RunningServer;
let admin: HttpSession;

beforeAll(async () => {
  // A new, empty directory: this file also covers the first start that seeds the demo office.
  server = await startServer();
  expect(server.output()).toContain("(demo office seeded)");
  const { email, password } = demoAccount("admin");
  admin = (await signInOverHttp(server.baseUrl, email, password)).session;
});
afterAll(async () => {
  await server?.stop();
  removeDataDir(server?.dataDir);
});

const organisationNames = async (session: HttpSession) => {
  const res = await session.fetch("/api/admin/organisations");
  expect(res.status).toBe(200);
  return ((await res.json()) as { organisations: { name: string }[] }).organisations.map(
    (o) => o.name,
  );
};

describe("one server per data directory", () => {
  it("refuses a second server on a directory in use, saying so, and leaves the first running", async () => {
    const lock = JSON.parse(fs.readFileSync(path.join(server.dataDir, "facula.lock"), "utf8")) as {
      pid: number;
    };
    const second = await startExpectingFailure(server.dataDir);
    expect(second.code).toBe(1);
    expect(second.output).toContain(
      `The data directory ${server.dataDir} is in use by another Facula process (pid ${lock.pid}`,
    );
    expect(second.output).not.toContain("Server listening");
    expect((await fetch(`${server.baseUrl}/api/health`)).status).toBe(200);
  });
});

describe("a restart", () => {
  it("keeps what was saved, the demo accounts and the sessions", async () => {
    expect(await organisationNames(admin)).not.toContain(ORGANISATION.name);
    const created = await admin.fetch("/api/admin/organisations", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(ORGANISATION),
    });
    expect(created.status).toBe(201);

    const { dataDir, port } = server;
    await server.stop();
    expect(fs.existsSync(path.join(dataDir, "facula.lock"))).toBe(false);
    expect((await fetch(`${server.baseUrl}/api/health`).catch(() => null))?.status).toBeUndefined();

    server = await startServer({ dataDir, port });
    expect(server.output()).toContain("database ready");
    expect(server.output()).not.toContain("demo office seeded");
    expect(await organisationNames(admin)).toContain(ORGANISATION.name);

    const { email, password } = demoAccount("subscriber");
    const fresh = await signInOverHttp(server.baseUrl, email, password);
    expect(fresh.status).toBe(200);
    const session = await (await fresh.session.fetch("/api/auth/session")).json();
    expect(session).toMatchObject({ user: { email, role: "subscriber" } });
  });
});
