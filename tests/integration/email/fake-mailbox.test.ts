import { mkdtemp, readFile, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startResendFake } from "../../../scripts/resend-fake.mjs";
import { createMailer } from "@/server/email/send";

const FROM = "Facula <desk@facula.example>";
const mail = (to: string, n: number) => ({
  to,
  subject: `S${n}`,
  html: `<p>${n}</p>`,
  text: `${n}`,
});

let dir = "";
beforeAll(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), "facula-fake-"));
});
afterAll(() => rm(dir, { recursive: true, force: true }));

describe("mailbox kept in a store file", () => {
  it("reloads messages and idempotency keys after a restart", async () => {
    const storeFile = path.join(dir, "nested", "mailbox.jsonl");
    const first = await startResendFake({ storeFile });
    const before = createMailer({ apiKey: "re_k", baseUrl: first.url, from: FROM });
    const sent = await before.send({ ...mail("a@op.example", 1), idempotencyKey: "k-1" });
    await before.send(mail("b@op.example", 2));
    await first.close();
    expect((await readFile(storeFile, "utf8")).trim().split("\n").length).toBeGreaterThan(2);

    const second = await startResendFake({ storeFile });
    try {
      expect(second.messages().map((m) => m.subject)).toEqual(["S2", "S1"]);
      const after = createMailer({ apiKey: "re_k", baseUrl: second.url, from: FROM });
      const replay = await after.send({ ...mail("a@op.example", 1), idempotencyKey: "k-1" });
      expect(replay).toEqual(sent);
      expect(second.messages()).toHaveLength(2);
    } finally {
      await second.close();
    }
  });

  it("starts empty after the mailbox was deleted", async () => {
    const storeFile = path.join(dir, "cleared.jsonl");
    const first = await startResendFake({ storeFile });
    await createMailer({ apiKey: "re_k", baseUrl: first.url, from: FROM }).send(
      mail("a@op.example", 1),
    );
    const deleted = await fetch(`${first.url}/_fake/messages`, { method: "DELETE" });
    expect(await deleted.json()).toEqual({ ok: true, deleted: 1 });
    await first.close();
    const second = await startResendFake({ storeFile });
    expect(second.messages()).toHaveLength(0);
    await second.close();
  });
});

describe("control endpoints", () => {
  it("lists newest first, filters by recipient, pages, and finds one by id", async () => {
    const fake = await startResendFake();
    try {
      const mailer = createMailer({ apiKey: "re_k", baseUrl: fake.url, from: FROM });
      for (let n = 1; n <= 5; n += 1)
        await mailer.send(mail(n % 2 ? "odd@op.example" : "even@op.example", n));
      const list = async (query: string) =>
        (await (await fetch(`${fake.url}/_fake/messages?${query}`)).json()) as {
          total: number;
          messages: Array<{ id: string; subject: string; html: string; text: string }>;
        };
      const all = await list("");
      expect(all.total).toBe(5);
      expect(all.messages.map((m) => m.subject)).toEqual(["S5", "S4", "S3", "S2", "S1"]);
      expect(all.messages[0]).toMatchObject({ html: "<p>5</p>", text: "5" });

      const odd = await list("to=ODD@op.example");
      expect(odd.total).toBe(3);
      expect(odd.messages.map((m) => m.subject)).toEqual(["S5", "S3", "S1"]);

      const page = await list("limit=2&offset=1");
      expect(page.total).toBe(5);
      expect(page.messages.map((m) => m.subject)).toEqual(["S4", "S3"]);

      const one = await fetch(`${fake.url}/_fake/messages/${all.messages[2]?.id}`);
      expect(await one.json()).toMatchObject({ subject: "S3" });
      const missing = await fetch(`${fake.url}/_fake/messages/no-such-id`);
      expect(missing.status).toBe(404);
      expect(await missing.json()).toMatchObject({ statusCode: 404, name: "not_found" });
    } finally {
      await fake.close();
    }
  });

  it("refuses a body over 1 MiB with 413 and stores nothing", async () => {
    const fake = await startResendFake();
    try {
      const post = (html: string) =>
        fetch(`${fake.url}/emails`, {
          method: "POST",
          headers: { Authorization: "Bearer re_k", "Content-Type": "application/json" },
          body: JSON.stringify({ from: FROM, to: "a@op.example", subject: "big", html }),
        });
      const tooBig = await post("x".repeat(1024 * 1024));
      expect(tooBig.status).toBe(413);
      expect(await tooBig.json()).toMatchObject({ statusCode: 413 });
      expect((await post("x".repeat(1000 * 1000))).status).toBe(200);
      expect(fake.messages()).toHaveLength(1);
    } finally {
      await fake.close();
    }
  });
});

describe("checkHealth", () => {
  it("probes the fake's health endpoint", async () => {
    const fake = await startResendFake();
    try {
      const mailer = createMailer({ apiKey: "re_k", baseUrl: `${fake.url}/`, from: FROM });
      await mailer.send(mail("a@op.example", 1));
      const health = await mailer.checkHealth();
      expect(health.ok).toBe(true);
      expect(health.detail).toContain("holds 1 messages");
    } finally {
      await fake.close();
    }
  });

  it("reports the real service as configured without any request", async () => {
    const realFetch = globalThis.fetch;
    let calls = 0;
    globalThis.fetch = (async () => {
      calls += 1;
      throw new Error("no network in a health check");
    }) as typeof fetch;
    try {
      const health = await createMailer({ apiKey: "re_k", from: FROM }).checkHealth();
      expect(health).toEqual({
        ok: true,
        detail: expect.stringContaining("configured (not probed)"),
      });
      expect(calls).toBe(0);
    } finally {
      globalThis.fetch = realFetch;
    }
  });

  it("refuses to build a mailer without a key or a sender", () => {
    expect(() => createMailer({ apiKey: "", from: FROM })).toThrow(/API key/);
    expect(() => createMailer({ apiKey: "re_k", from: "" })).toThrow(/sender/);
  });
});
