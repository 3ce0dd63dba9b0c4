import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { startResendFake } from "../../../scripts/resend-fake.mjs";
import type { MailMessage } from "@/server/email/send";
import { createMailer } from "@/server/email/send";

type Fake = Awaited<ReturnType<typeof startResendFake>>;

const FROM = "Facula <desk@facula.example>";
const message = (n: number, extra: Partial<MailMessage> = {}): MailMessage => ({
  to: `subscriber${n}@operator.example`,
  subject: `Test ${n}`,
  html: `<p>Test ${n}</p>`,
  text: `Test ${n}`,
  ...extra,
});

let fake: Fake;
let mailer: ReturnType<typeof createMailer>;

beforeAll(async () => {
  fake = await startResendFake({ port: 0 });
  mailer = createMailer({ apiKey: "re_test_key", baseUrl: fake.url, from: FROM });
});
afterAll(() => fake.close());
beforeEach(() => fake.reset());

describe("sending through the Resend SDK to the fake", () => {
  it("stores a sent message with every field", async () => {
    const result = await mailer.send(message(1, { tags: { kind: "alert", office: "hr-1" } }));
    expect(result.ok).toBe(true);
    const [stored, ...rest] = fake.messages();
    expect(rest).toHaveLength(0);
    expect(stored).toMatchObject({
      id: result.ok ? result.id : "",
      from: FROM,
      to: ["subscriber1@operator.example"],
      subject: "Test 1",
      html: "<p>Test 1</p>",
      text: "Test 1",
      tags: [
        { name: "kind", value: "alert" },
        { name: "office", value: "hr-1" },
      ],
      idempotencyKey: null,
    });
    expect(Date.parse(stored?.receivedAt ?? "")).not.toBeNaN();
  });

  it("stores a message sent twice with one idempotency key once, under one id", async () => {
    const first = await mailer.send(message(2, { idempotencyKey: "delivery-42" }));
    const second = await mailer.send(message(2, { idempotencyKey: "delivery-42" }));
    const other = await mailer.send(message(2, { idempotencyKey: "delivery-43" }));
    expect(first.ok && second.ok && other.ok).toBe(true);
    expect(second).toEqual(first);
    expect(other).not.toEqual(first);
    expect(fake.messages().map((m) => m.idempotencyKey)).toEqual(["delivery-43", "delivery-42"]);
  });

  it("refuses a reused idempotency key with a different body as permanent (409)", async () => {
    await mailer.send(message(3, { idempotencyKey: "delivery-7" }));
    const clash = await mailer.send(message(4, { idempotencyKey: "delivery-7" }));
    expect(clash).toMatchObject({ ok: false, status: 409, retryable: false });
    expect(fake.messages()).toHaveLength(1);
  });

  it("refuses invalid tags as permanent (422), as Resend does", async () => {
    const result = await mailer.send(message(5, { tags: { "bad tag": "x" } }));
    expect(result).toMatchObject({ ok: false, status: 422, retryable: false });
    expect(fake.messages()).toHaveLength(0);
  });

  it("answers 401 without a bearer key", async () => {
    const response = await fetch(`${fake.url}/emails`, {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ from: FROM, to: "a@b.example", subject: "s", text: "t" }),
    });
    expect(response.status).toBe(401);
    expect(await response.json()).toMatchObject({ statusCode: 401, name: "missing_api_key" });
    expect(fake.messages()).toHaveLength(0);
  });
});

describe("injected failures", () => {
  it("maps 429 to retryable, with the fake's Retry-After", async () => {
    fake.setFailure({ status: 429, count: 1 });
    const limited = await mailer.send(message(1));
    expect(limited).toMatchObject({
      ok: false,
      status: 429,
      retryable: true,
      retryAfterSeconds: 1,
    });
    // count 1: the next call goes through.
    expect(await mailer.send(message(1))).toMatchObject({ ok: true });
    expect(fake.messages()).toHaveLength(1);
  });

  it.each([500, 503])("maps %i to retryable", async (status) => {
    fake.setFailure({ status });
    expect(await mailer.send(message(1))).toMatchObject({ ok: false, status, retryable: true });
    expect(fake.messages()).toHaveLength(0);
  });

  it.each([400, 422])("maps %i to permanent", async (status) => {
    fake.setFailure({ status });
    expect(await mailer.send(message(1))).toMatchObject({ ok: false, status, retryable: false });
  });

  it("stops failing on status 0, set through the control endpoint", async () => {
    const set = (body: object) =>
      fetch(`${fake.url}/_fake/failure`, { method: "POST", body: JSON.stringify(body) });
    expect((await set({ status: 503 })).status).toBe(200);
    expect(await mailer.send(message(1))).toMatchObject({ ok: false, status: 503 });
    expect((await set({ status: 0 })).status).toBe(200);
    expect(await mailer.send(message(1))).toMatchObject({ ok: true });
    expect((await set({ status: 200 })).status).toBe(422);
    expect((await set({ status: 500, rate: 1.5 })).status).toBe(422);
  });

  it("fails about the given fraction of calls, the same calls on every run", async () => {
    const runOnce = async () => {
      fake.reset();
      fake.setFailure({ status: 500, rate: 0.3 });
      const outcomes: boolean[] = [];
      for (let i = 0; i < 100; i += 1) outcomes.push((await mailer.send(message(i))).ok);
      return outcomes;
    };
    const first = await runOnce();
    const failures = first.filter((ok) => !ok).length;
    // Binomial(100, 0.3): mean 30, sd 4.6; 20..40 is beyond two sd either side (common practice).
    expect(failures).toBeGreaterThanOrEqual(20);
    expect(failures).toBeLessThanOrEqual(40);
    expect(fake.messages()).toHaveLength(100 - failures);
    expect(await runOnce()).toEqual(first);
  });

  it("maps an unreachable service to retryable with no status", async () => {
    const gone = await startResendFake({ port: 0 });
    const url = gone.url;
    await gone.close();
    const offline = createMailer({ apiKey: "re_test_key", baseUrl: url, from: FROM });
    expect(await offline.send(message(1))).toMatchObject({
      ok: false,
      status: null,
      retryable: true,
    });
    expect(await offline.checkHealth()).toMatchObject({ ok: false });
  });
});

describe("batches", () => {
  it("sends three messages in one request and returns one id each", async () => {
    const results = await mailer.sendBatch([message(1), message(2), message(3)]);
    expect(results.every((r) => r.ok)).toBe(true);
    const ids = results.map((r) => (r.ok ? r.id : ""));
    expect(new Set(ids).size).toBe(3);
    const stored = fake.messages();
    expect(stored.map((m) => m.to[0])).toEqual([
      "subscriber3@operator.example",
      "subscriber2@operator.example",
      "subscriber1@operator.example",
    ]);
    expect(stored.map((m) => m.id).reverse()).toEqual(ids);
  });

  it("applies one failure to every message of the batch", async () => {
    fake.setFailure({ status: 503, count: 1 });
    const results = await mailer.sendBatch([message(1), message(2)]);
    expect(results).toHaveLength(2);
    for (const r of results) expect(r).toMatchObject({ ok: false, status: 503, retryable: true });
    expect(fake.messages()).toHaveLength(0);
  });

  it("replays a keyed batch instead of storing it twice", async () => {
    const keyed = [1, 2].map((n) => message(n, { idempotencyKey: `d-${n}` }));
    const first = await mailer.sendBatch(keyed);
    expect(await mailer.sendBatch(keyed)).toEqual(first);
    expect(fake.messages()).toHaveLength(2);
  });

  it("refuses more than 100 messages, in the mailer and at the fake", async () => {
    const many = Array.from({ length: 101 }, (_, i) => message(i));
    await expect(mailer.sendBatch(many)).rejects.toThrow(RangeError);
    await expect(mailer.sendBatch(many.slice(0, 100))).resolves.toHaveLength(100);
    const response = await fetch(`${fake.url}/emails/batch`, {
      method: "POST",
      headers: { Authorization: "Bearer re_test_key", "Content-Type": "application/json" },
      body: JSON.stringify(many.map((m) => ({ from: FROM, ...m }))),
    });
    expect(response.status).toBe(422);
    expect(fake.messages()).toHaveLength(100);
  });
});
