import { eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { alerts, auditEvents, contacts, outbox } from "@/db/schema";
import { cancelQueuedDeliveries } from "@/server/dissemination/outbox.db";
import { queueIssuedBulletin } from "@/server/dissemination/queue";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import {
  gridWith,
  insertContact,
  insertOrganisation,
  issueBulletin,
  readOutboxFor,
} from "./fixture";

const T0 = new Date("2026-05-04T00:30:00Z");
const hours = (h: number) => new Date(T0.getTime() + h * 3600_000);

beforeAll(async () => {
  process.env.PUBLIC_BASE_URL = "https://desk.halden-ridge.example";
  await useTestDatabase();
});
afterAll(closeTestDatabase);
beforeEach(async () => {
  await getDb().update(contacts).set({ unsubscribedAt: T0 }).where(isNull(contacts.unsubscribedAt));
});

async function alertsOf(contactId: number) {
  return getDb().select().from(alerts).where(eq(alerts.contactId, contactId)).orderBy(alerts.id);
}

describe("queueing an issued bulletin", () => {
  it("queues the bulletin for contacts who want it and alerts for thresholds crossed", async () => {
    const organisationId = await insertOrganisation();
    const wantsAll = await insertContact({ organisationId, thresholds: [["M+", 24, 0.4]] });
    const alertsOnly = await insertContact({
      organisationId,
      wantsBulletins: false,
      thresholds: [["X", 72, 0.1]],
    });
    const below = await insertContact({ organisationId, thresholds: [["M+", 24, 0.6]] });
    const { bulletin, queued } = await issueBulletin(
      gridWith({ "M+.24h": 0.45, "X.72h": 0.1 }),
      null,
      T0,
    );

    expect(queued).toEqual({ deliveries: 2, alerts: 2 });
    expect((await readOutboxFor(wantsAll.id)).map((r) => r.kind).sort()).toEqual([
      "alert",
      "bulletin",
    ]);
    expect((await readOutboxFor(alertsOnly.id)).map((r) => r.kind)).toEqual(["alert"]);
    expect((await readOutboxFor(below.id)).map((r) => r.kind)).toEqual(["bulletin"]);
    expect(await alertsOf(below.id)).toEqual([]);
    expect((await alertsOf(wantsAll.id))[0]).toMatchObject({
      bulletinId: bulletin.id,
      level: "M+",
      windowHours: 24,
      probability: 0.45,
      thresholdProbability: 0.4,
      raisedAt: T0,
    });
    const [alertMail] = (await readOutboxFor(alertsOnly.id)).filter((r) => r.kind === "alert");
    expect(alertMail?.subject).toBe(
      "Flare-risk alert: X within 72 h at 10% (threshold 10%) (Halden Ridge Space Weather Desk (demo))",
    );
    expect(alertMail?.html).toContain("https://desk.halden-ridge.example/ack?token=");
    const audit = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "dissemination.queued"));
    expect(audit.at(-1)?.details).toMatchObject({ deliveries: 2, alerts: 2 });
  });

  it("alerts again only on a rise across the threshold or once the earlier alert's window ended", async () => {
    const organisationId = await insertOrganisation();
    const c = await insertContact({ organisationId, thresholds: [["M+", 24, 0.4]] });
    const first = await issueBulletin(gridWith({ "M+.24h": 0.5 }), null, T0);
    // A correction an hour later, still above: the first alert is in force, so no second one.
    const correction = await issueBulletin(gridWith({ "M+.24h": 0.55 }), first.bulletin, hours(1));
    expect(correction.queued.alerts).toBe(0);
    // Next day, still above, the first alert's 24 h window has ended: a new alert.
    const nextDay = await issueBulletin(
      gridWith({ "M+.24h": 0.5 }),
      correction.bulletin,
      hours(24),
    );
    expect(nextDay.queued.alerts).toBe(1);
    // It falls below, then rises across again within the new alert's window: alert.
    const quiet = await issueBulletin(gridWith({ "M+.24h": 0.2 }), nextDay.bulletin, hours(30));
    expect(quiet.queued.alerts).toBe(0);
    const rise = await issueBulletin(gridWith({ "M+.24h": 0.41 }), quiet.bulletin, hours(36));
    expect(rise.queued.alerts).toBe(1);
    expect((await alertsOf(c.id)).map((a) => a.bulletinId)).toEqual([
      first.bulletin.id,
      nextDay.bulletin.id,
      rise.bulletin.id,
    ]);
  });

  it("writes nothing twice when the same bulletin is queued again", async () => {
    const organisationId = await insertOrganisation();
    const c = await insertContact({ organisationId, thresholds: [["C+", 24, 0.5]] });
    const { bulletin } = await issueBulletin(gridWith({ "C+.24h": 0.9 }), null, T0);
    const before = await readOutboxFor(c.id);
    const again = await getDb().transaction((tx) => queueIssuedBulletin(tx, bulletin, null, T0));
    expect(again).toEqual({ deliveries: 0, alerts: 0 });
    expect(await readOutboxFor(c.id)).toHaveLength(before.length);
    expect(await alertsOf(c.id)).toHaveLength(1);
    const bodies = await getDb()
      .select()
      .from(outbox)
      .where(eq(outbox.idempotencyKey, `bulletin-body:${bulletin.id}`));
    expect(bodies).toHaveLength(1);
  });

  it("queues nothing for unsubscribed contacts and rolls back with the issuing transaction", async () => {
    const organisationId = await insertOrganisation();
    const gone = await insertContact({ organisationId, thresholds: [["C+", 24, 0.1]] });
    await getDb().update(contacts).set({ unsubscribedAt: T0 }).where(eq(contacts.id, gone.id));
    const kept = await insertContact({ organisationId });
    await issueBulletin(gridWith({ "C+.24h": 0.9 }), null, T0);
    expect(await readOutboxFor(gone.id)).toEqual([]);
    expect(await readOutboxFor(kept.id)).toHaveLength(1);

    // Queueing is part of the issuing transaction: when that fails, no delivery or alert stays.
    const { bulletin } = await issueBulletin(gridWith({ "C+.24h": 0.9 }), null, T0, {
      queue: false,
    });
    const failing = getDb().transaction(async (tx) => {
      expect(await queueIssuedBulletin(tx, bulletin, null, T0)).toEqual({
        deliveries: 1,
        alerts: 0,
      });
      throw new Error("issuing failed after queueing");
    });
    await expect(failing).rejects.toThrow("issuing failed");
    expect(await getDb().select().from(outbox).where(eq(outbox.bulletinId, bulletin.id))).toEqual(
      [],
    );
  });

  it("cancels a withdrawn bulletin's queued e-mails, and only that bulletin's", async () => {
    const organisationId = await insertOrganisation();
    const c = await insertContact({ organisationId, thresholds: [["M+", 24, 0.3]] });
    const kept = await issueBulletin(gridWith({}), null, T0);
    const withdrawn = await issueBulletin(gridWith({ "M+.24h": 0.5 }), kept.bulletin, hours(2));
    const cancelled = await getDb().transaction((tx) =>
      cancelQueuedDeliveries(tx, withdrawn.bulletin.id, "the bulletin was withdrawn"),
    );
    expect(cancelled).toBe(2);
    const rows = await readOutboxFor(c.id);
    expect(
      rows
        .filter((r) => r.bulletinId === withdrawn.bulletin.id)
        .map((r) => [r.kind, r.status, r.lastError])
        .sort(),
    ).toEqual([
      ["alert", "failed", "cancelled: the bulletin was withdrawn"],
      ["bulletin", "failed", "cancelled: the bulletin was withdrawn"],
    ]);
    expect(rows.filter((r) => r.bulletinId === kept.bulletin.id).map((r) => r.status)).toEqual([
      "queued",
    ]);
  });
});
