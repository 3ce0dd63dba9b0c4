import { eq, isNull, sql } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { contacts, outbox } from "@/db/schema";
import { readUnsubscribeToken } from "@/server/dissemination/link-tokens";
import { retryFailedDeliveries } from "@/server/dissemination/deliveries.db";
import { runDeliveryPass } from "@/server/dissemination/delivery-pass";
import {
  closeTestDatabase,
  useFakeMail,
  useTestDatabase,
  type FakeMail,
} from "../../support/test-db";
import {
  countMessagesPerRecipient,
  countOutbox,
  drainDeliveries,
  gridWith,
  insertContact,
  insertOrganisation,
  insertUser,
  issueBulletin,
  linkToken,
} from "./fixture";

const NOW = new Date("2026-05-04T00:30:00Z");
const HALF_HOUR = 31 * 60_000;
// Small batches so one bulletin needs many requests and the injected failures hit some of them.
const SMALL_BATCHES = { maxBatchBytes: 200_000 };
let fake: FakeMail;

beforeAll(async () => {
  process.env.PUBLIC_BASE_URL = "https://desk.halden-ridge.example";
  fake = await useFakeMail();
  await useTestDatabase();
});
afterAll(async () => {
  await closeTestDatabase();
  await fake.close();
});
// Each test issues to its own contacts only: earlier tests' contacts are taken off the list.
beforeEach(async () => {
  fake.reset();
  await getDb()
    .update(contacts)
    .set({ unsubscribedAt: NOW })
    .where(isNull(contacts.unsubscribedAt));
});

async function contactsOf(n: number) {
  const organisationId = await insertOrganisation();
  return Promise.all(Array.from({ length: n }, () => insertContact({ organisationId })));
}

describe("delivering a bulletin through a provider that fails", () => {
  it("delivers every message exactly once while 30 % of requests answer 500", async () => {
    const people = await contactsOf(240);
    const { bulletin, queued } = await issueBulletin(gridWith({}), null, NOW);
    expect(queued).toEqual({ deliveries: 240, alerts: 0 });
    // Seeded so the run replays exactly; the fake's type leaves `seed` out, the fake accepts it.
    fake.setFailure({ status: 500, rate: 0.3, seed: 20260504 } as Parameters<
      FakeMail["setFailure"]
    >[0]);

    const { passes } = await drainDeliveries(NOW, HALF_HOUR, SMALL_BATCHES);

    const perRecipient = countMessagesPerRecipient(fake);
    for (const person of people) expect(perRecipient.get(person.email)).toBe(1);
    expect(fake.messages()).toHaveLength(240);
    expect(await countOutbox(bulletin.id)).toEqual({ sent: 240 });
    // The failures really happened: some rows needed more than one attempt and more than one pass.
    const retried = await getDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(outbox)
      .where(sql`${outbox.bulletinId} = ${bulletin.id} and ${outbox.attempts} > 1`);
    expect(retried[0]?.n).toBeGreaterThan(0);
    expect(passes).toBeGreaterThan(1);
  });

  it("gives every recipient their own unsubscribe link", async () => {
    const people = await contactsOf(3);
    await issueBulletin(gridWith({}), null, NOW);
    await drainDeliveries(NOW, HALF_HOUR);
    for (const person of people) {
      const mail = fake.messages().find((m) => [m.to].flat().includes(person.email));
      const check = readUnsubscribeToken(
        process.env.AUTH_SECRET!,
        linkToken(mail?.text ?? "", "/unsubscribe"),
        NOW,
      );
      expect(check).toMatchObject({ ok: true, payload: { contactId: person.id } });
      expect(mail?.html).toContain("/unsubscribe?token=");
      expect(mail?.html).not.toContain("FaculaMerge");
    }
  });

  it("marks a refused batch failed at once, sends nothing for it, and retries it on request", async () => {
    const people = await contactsOf(30);
    const { bulletin } = await issueBulletin(gridWith({}), null, NOW);
    fake.setFailure({ status: 422, rate: 1, count: 1 });
    await runDeliveryPass(NOW, { maxBatchBytes: 100_000 });
    const failed = await getDb()
      .select()
      .from(outbox)
      .where(sql`${outbox.bulletinId} = ${bulletin.id} and ${outbox.status} = 'failed'`);
    expect(failed.length).toBeGreaterThan(0);
    expect(failed.every((r) => r.attempts === 1 && r.lastError?.startsWith("422"))).toBe(true);
    expect(fake.messages().length).toBe(30 - failed.length);
    const failedEmails = new Set(failed.map((r) => r.toEmail));
    expect(fake.messages().some((m) => [m.to].flat().some((t) => failedEmails.has(t)))).toBe(false);

    // A later pass leaves failed rows alone; the duty officer's retry puts them back.
    await runDeliveryPass(new Date(NOW.getTime() + HALF_HOUR));
    expect((await countOutbox(bulletin.id)).failed).toBe(failed.length);
    const officer = await insertUser("duty_officer");
    expect(await retryFailedDeliveries({ bulletinId: bulletin.id }, officer, NOW)).toBe(
      failed.length,
    );
    await drainDeliveries(NOW, HALF_HOUR);
    const perRecipient = countMessagesPerRecipient(fake);
    for (const person of people) expect(perRecipient.get(person.email)).toBe(1);
  });

  it("waits before retrying a rate-limited batch", async () => {
    await contactsOf(2);
    const { bulletin } = await issueBulletin(gridWith({}), null, NOW);
    fake.setFailure({ status: 429, rate: 1, count: 1 });
    const pass = await runDeliveryPass(NOW);
    expect(pass).toMatchObject({ sent: 0, retrying: 2, failed: 0 });
    const rows = await getDb().select().from(outbox).where(eq(outbox.bulletinId, bulletin.id));
    const deliveries = rows.filter((r) => r.kind === "bulletin");
    // First retry after 15 s: more than the fake's Retry-After of 1 s.
    expect(deliveries.map((r) => [r.status, r.nextAttemptAt.getTime() - NOW.getTime()])).toEqual([
      ["queued", 15_000],
      ["queued", 15_000],
    ]);
    expect(await runDeliveryPass(new Date(NOW.getTime() + 14_000))).toMatchObject({ claimed: 0 });
    expect(await runDeliveryPass(new Date(NOW.getTime() + 15_000))).toMatchObject({
      claimed: 2,
      sent: 2,
    });
  });
});
