import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { alerts, auditEvents, contacts, outbox } from "@/db/schema";
import { acknowledgeByLink, inspectAckLink } from "@/server/dissemination/acknowledge";
import { ackExpiry, signAckToken } from "@/server/dissemination/link-tokens";
import { inspectUnsubscribeLink, unsubscribeByLink } from "@/server/dissemination/unsubscribe";
import {
  closeTestDatabase,
  useFakeMail,
  useTestDatabase,
  type FakeMail,
} from "../../support/test-db";
import {
  drainDeliveries,
  gridWith,
  insertContact,
  insertOrganisation,
  issueBulletin,
  linkToken,
  readOutboxFor,
} from "./fixture";

const NOW = new Date("2026-05-04T00:30:00Z");
const HOUR = 3600_000;
const at = (hours: number) => new Date(NOW.getTime() + hours * HOUR);
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

function mailTo(email: string, subjectPart: string) {
  const mail = fake
    .messages()
    .find((m) => [m.to].flat().includes(email) && m.subject.includes(subjectPart));
  if (!mail) throw new Error(`no "${subjectPart}" mail to ${email}`);
  return mail;
}

/** Flips one character of the signature, as a hand-edited or mangled link would. */
function tamper(token: string): string {
  const last = token.at(-1) === "A" ? "B" : "A";
  return `${token.slice(0, -1)}${last}`;
}

async function auditCount(action: string, targetId: number): Promise<number> {
  const rows = await getDb()
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.action, action), eq(auditEvents.targetId, String(targetId))));
  return rows.length;
}

describe("acknowledgement links", () => {
  it("acknowledge once; tampered, expired, foreign and reused links are refused with a reason", async () => {
    const organisationId = await insertOrganisation();
    const dana = await insertContact({
      organisationId,
      name: "Dana W",
      thresholds: [["M+", 24, 0.4]],
    });
    const rui = await insertContact({
      organisationId,
      name: "Rui C",
      thresholds: [["M+", 24, 0.3]],
    });
    const { queued } = await issueBulletin(gridWith({ "M+.24h": 0.45 }), null, NOW);
    expect(queued.alerts).toBe(2);
    await drainDeliveries(NOW, 60_000);
    const token = linkToken(mailTo(dana.email, "Flare-risk alert").text, "/ack");
    const [danaAlert] = await getDb().select().from(alerts).where(eq(alerts.contactId, dana.id));
    const [ruiAlert] = await getDb().select().from(alerts).where(eq(alerts.contactId, rui.id));

    const view = await inspectAckLink(token, at(1));
    expect(view).toMatchObject({
      ok: true,
      alert: {
        id: danaAlert!.id,
        level: "M+",
        windowHours: 24,
        probability: 0.45,
        thresholdProbability: 0.4,
        contactName: "Dana W",
      },
    });

    expect(await inspectAckLink(tamper(token), at(1))).toMatchObject({
      ok: false,
      status: 400,
      message: expect.stringContaining("not valid"),
    });
    expect(await inspectAckLink("nonsense", at(1))).toMatchObject({
      ok: false,
      status: 400,
      message: expect.stringContaining("incomplete"),
    });
    expect(await acknowledgeByLink(token, danaAlert!.id, at(24))).toMatchObject({
      ok: false,
      status: 410,
      message: expect.stringContaining("window has ended"),
    });
    // Dana's link pressed on a page showing Rui's alert, and a link naming Rui's alert for Dana.
    expect(await acknowledgeByLink(token, ruiAlert!.id, at(1))).toMatchObject({
      ok: false,
      status: 403,
      reason: "not-this-alert",
    });
    const forged = signAckToken(
      process.env.AUTH_SECRET!,
      { alertId: ruiAlert!.id, contactId: dana.id },
      ackExpiry(NOW, 24),
    );
    expect(await acknowledgeByLink(forged, ruiAlert!.id, at(1))).toMatchObject({
      ok: false,
      status: 403,
    });
    const [untouched] = await getDb().select().from(alerts).where(eq(alerts.id, ruiAlert!.id));
    expect(untouched?.acknowledgedAt).toBeNull();

    const done = await acknowledgeByLink(token, danaAlert!.id, at(1));
    expect(done).toMatchObject({
      ok: true,
      alert: { acknowledgedAt: at(1), acknowledgedVia: "link" },
    });
    const reused = await acknowledgeByLink(token, danaAlert!.id, at(2));
    expect(reused).toMatchObject({
      ok: false,
      status: 409,
      message: "This alert was already acknowledged at 2026-05-04 01:30 UTC. Nothing more to do.",
    });
    const [after] = await getDb().select().from(alerts).where(eq(alerts.id, danaAlert!.id));
    expect(after?.acknowledgedAt).toEqual(at(1));
    expect(await auditCount("alert.acknowledged", danaAlert!.id)).toBe(1);
    expect(await auditCount("alert.acknowledged", ruiAlert!.id)).toBe(0);
  });
});

describe("unsubscribe links", () => {
  it("take effect at once, cancel queued e-mails, and refuse tampered, expired and reused links", async () => {
    const organisationId = await insertOrganisation();
    const mina = await insertContact({ organisationId, thresholds: [["X", 24, 0.05]] });
    const other = await insertContact({ organisationId });
    const first = await issueBulletin(gridWith({}), null, NOW);
    await drainDeliveries(NOW, 60_000);
    const token = linkToken(mailTo(mina.email, "flare-risk bulletin").text, "/unsubscribe");
    // A second bulletin is queued but not yet sent when Mina unsubscribes.
    const second = await issueBulletin(gridWith({}), first.bulletin, at(1));

    expect(await inspectUnsubscribeLink(tamper(token), at(1))).toMatchObject({
      ok: false,
      status: 400,
      message: expect.stringContaining("not valid"),
    });
    expect(await unsubscribeByLink(token, at(61 * 24))).toMatchObject({
      ok: false,
      status: 410,
      message: expect.stringContaining("expired"),
    });
    expect(await inspectUnsubscribeLink(token, at(1))).toMatchObject({
      ok: true,
      contact: { contactId: mina.id, unsubscribedAt: null },
    });

    const done = await unsubscribeByLink(token, at(2));
    expect(done).toMatchObject({ ok: true, cancelled: 1, contact: { unsubscribedAt: at(2) } });
    const minaRows = (await readOutboxFor(mina.id)).filter(
      (r) => r.bulletinId === second.bulletin.id,
    );
    expect(minaRows.map((r) => r.status)).toEqual(["failed"]);
    const otherRows = (await readOutboxFor(other.id)).filter(
      (r) => r.bulletinId === second.bulletin.id,
    );
    expect(otherRows.map((r) => r.status)).toEqual(["queued"]);

    expect(await unsubscribeByLink(token, at(3))).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringContaining("already unsubscribed at 2026-05-04 02:30 UTC"),
    });
    expect(await auditCount("contact.unsubscribed", mina.id)).toBe(1);

    // From now on nothing is queued for Mina, not even an alert her threshold would raise.
    const third = await issueBulletin(gridWith({ "X.24h": 0.2 }), second.bulletin, at(30));
    expect(
      (await readOutboxFor(mina.id)).filter((r) => r.bulletinId === third.bulletin.id),
    ).toEqual([]);
    expect(
      (await readOutboxFor(other.id)).filter((r) => r.bulletinId === third.bulletin.id),
    ).toHaveLength(1);
    const [row] = await getDb().select().from(contacts).where(eq(contacts.id, mina.id));
    expect(row?.unsubscribedAt).toEqual(at(2));
    expect(
      await getDb()
        .select()
        .from(outbox)
        .where(and(eq(outbox.contactId, mina.id), eq(outbox.kind, "alert"))),
    ).toEqual([]);
  });
});
