import { inArray, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { contacts, outbox } from "@/db/schema";
import { getMailer } from "@/server/delivery/transactional";
import { planBatches } from "@/server/dissemination/batching";
import { composeMessage } from "@/server/dissemination/compose-message";
import { claimBatch, LEASE_MS, selectDueRows } from "@/server/dissemination/delivery-claim.db";
import { runDeliveryPass } from "@/server/dissemination/delivery-pass";
import { startDeliveryWorker } from "@/server/dissemination/worker";
import type { MailMessage } from "@/server/email/send";
import {
  closeTestDatabase,
  useFakeMail,
  useTestDatabase,
  type FakeMail,
} from "../../support/test-db";
import {
  countMessagesPerRecipient,
  countOutbox,
  gridWith,
  insertContact,
  insertOrganisation,
  issueBulletin,
} from "./fixture";

const NOW = new Date("2026-05-04T00:30:00Z");
const BATCH_BYTES = 150_000;
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

/**
 * What a crash mid-delivery leaves behind: the first batches claimed and accepted by the provider,
 * but the process died before writing "sent", so the rows stay 'sending' under their lease.
 */
async function crashAfterSending(
  batchCount: number,
): Promise<{ ids: number[]; messages: MailMessage[] }> {
  const db = getDb();
  const due = await selectDueRows(db, NOW, 1000);
  const items = [];
  for (const row of due) {
    const composed = await composeMessage(db, row, process.env.AUTH_SECRET!);
    if (composed.ok)
      items.push({
        id: row.id,
        bytes: composed.bytes,
        batchMarker: null,
        message: composed.message,
      });
  }
  const batches = planBatches(items, 100, BATCH_BYTES).slice(0, batchCount);
  const messages: MailMessage[] = [];
  for (const batch of batches) {
    await claimBatch(
      db,
      batch.items.map((i) => i.id),
      batch.marker,
      NOW,
    );
    const results = await getMailer().sendBatch(batch.items.map((i) => i.message));
    expect(results.every((r) => r.ok)).toBe(true);
    messages.push(...batch.items.map((i) => i.message));
  }
  return { ids: batches.flatMap((b) => b.items.map((i) => i.id)), messages };
}

describe("a restart in the middle of a delivery", () => {
  it("resumes after the lease without sending anyone the same message twice", async () => {
    const organisationId = await insertOrganisation();
    const people = await Promise.all(
      Array.from({ length: 60 }, () => insertContact({ organisationId })),
    );
    const { bulletin } = await issueBulletin(gridWith({}), null, NOW);

    const crashed = await crashAfterSending(2);
    expect(crashed.ids.length).toBeGreaterThan(1);
    expect(fake.messages()).toHaveLength(crashed.ids.length);
    const stuck = await getDb().select().from(outbox).where(inArray(outbox.id, crashed.ids));
    expect(stuck.every((r) => r.status === "sending" && r.attempts === 1)).toBe(true);

    // The new process's first pass, inside the lease: the rest go out, the stuck rows wait.
    const early = await runDeliveryPass(new Date(NOW.getTime() + 60_000), {
      maxBatchBytes: BATCH_BYTES,
    });
    expect(early).toMatchObject({ resumed: 0, failed: 0, sent: 60 - crashed.ids.length });
    expect((await countOutbox(bulletin.id)).sending).toBe(crashed.ids.length);

    // Past the lease the stuck rows are resumed and resent as the same batches: the provider
    // recognises each batch by its idempotency key and delivers nothing new.
    const late = await runDeliveryPass(new Date(NOW.getTime() + LEASE_MS + 1000), {
      maxBatchBytes: BATCH_BYTES,
    });
    expect(late).toMatchObject({
      resumed: crashed.ids.length,
      sent: crashed.ids.length,
      failed: 0,
    });
    expect(await countOutbox(bulletin.id)).toEqual({ sent: 60 });
    const perRecipient = countMessagesPerRecipient(fake);
    for (const person of people) expect(perRecipient.get(person.email)).toBe(1);
    expect(fake.messages()).toHaveLength(60);

    // The check above can fail: the same messages regrouped into a different batch carry a
    // different batch key, and the provider then delivers them again.
    const [first, second] = crashed.messages;
    await getMailer().sendBatch([second!, first!]);
    expect(countMessagesPerRecipient(fake).get(first!.to)).toBe(2);
  });

  it("a worker started afresh resumes deliveries left 'sending' at once, without waiting for the lease", async () => {
    fake.reset();
    // Only this test's contacts are on the list.
    await getDb()
      .update(contacts)
      .set({ unsubscribedAt: NOW })
      .where(isNull(contacts.unsubscribedAt));
    const organisationId = await insertOrganisation();
    const people = await Promise.all(
      Array.from({ length: 40 }, () => insertContact({ organisationId })),
    );
    const { bulletin } = await issueBulletin(gridWith({}), null, NOW);
    const crashed = await crashAfterSending(1);
    expect((await countOutbox(bulletin.id)).sending).toBe(crashed.ids.length);

    const worker = startDeliveryWorker({
      intervalMs: 50,
      delivery: { maxBatchBytes: BATCH_BYTES },
    });
    try {
      for (let i = 0; i < 200 && (await countOutbox(bulletin.id)).sent !== 40; i++)
        await new Promise((r) => setTimeout(r, 50));
    } finally {
      await worker.stop();
    }
    expect(await countOutbox(bulletin.id)).toEqual({ sent: 40 });
    const perRecipient = countMessagesPerRecipient(fake);
    for (const person of people) expect(perRecipient.get(person.email)).toBe(1);
  });
});
