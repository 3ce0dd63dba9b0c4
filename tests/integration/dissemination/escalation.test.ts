import { and, eq, inArray, isNull } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { alerts, auditEvents, contacts, outbox, settings, users } from "@/db/schema";
import { DEFAULT_OFFICE_SETTINGS } from "@/lib/schemas/settings";
import { acknowledgeByLink } from "@/server/dissemination/acknowledge";
import { runEscalationPass } from "@/server/dissemination/escalation";
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
  insertUser,
  issueBulletin,
  linkToken,
} from "./fixture";

const T0 = new Date("2026-05-04T00:30:00Z");
const at = (minutes: number) => new Date(T0.getTime() + minutes * 60_000);
let fake: FakeMail;
let officers: { email: string }[];

beforeAll(async () => {
  process.env.PUBLIC_BASE_URL = "https://desk.halden-ridge.example";
  fake = await useFakeMail();
  await useTestDatabase();
  officers = [await insertUser("duty_officer"), await insertUser("duty_officer")];
  const retired = await insertUser("duty_officer");
  await getDb().update(users).set({ isActive: false }).where(eq(users.id, retired.id));
});
afterAll(async () => {
  await closeTestDatabase();
  await fake.close();
});
beforeEach(async () => {
  await getDb().update(contacts).set({ unsubscribedAt: T0 }).where(isNull(contacts.unsubscribedAt));
  await getDb().delete(settings);
});

async function chaseMails(alertId: number) {
  return getDb()
    .select()
    .from(outbox)
    .where(
      and(
        eq(outbox.alertId, alertId),
        inArray(outbox.kind, ["alert-reminder", "alert-escalation"]),
      ),
    )
    .orderBy(outbox.id);
}

async function raiseOneAlert(name: string) {
  const organisationId = await insertOrganisation();
  const contact = await insertContact({ organisationId, name, thresholds: [["M+", 24, 0.4]] });
  await issueBulletin(gridWith({ "M+.24h": 0.5 }), null, T0);
  const [alert] = await getDb().select().from(alerts).where(eq(alerts.contactId, contact.id));
  return { contact, alert: alert! };
}

describe("escalation of unacknowledged alerts (reminder after 30 min, duty officers after 60)", () => {
  it("reminds at 30 minutes, not at 29, and escalates at 60, not at 59, once each", async () => {
    const { contact, alert } = await raiseOneAlert("Dana W");
    expect(await runEscalationPass(at(29))).toEqual({ reminded: 0, escalated: 0 });
    expect(await chaseMails(alert.id)).toEqual([]);

    expect(await runEscalationPass(at(30))).toEqual({ reminded: 1, escalated: 0 });
    expect((await chaseMails(alert.id)).map((m) => [m.kind, m.toEmail])).toEqual([
      ["alert-reminder", contact.email],
    ]);
    expect(await runEscalationPass(at(31))).toEqual({ reminded: 0, escalated: 0 });

    expect(await runEscalationPass(at(59))).toEqual({ reminded: 0, escalated: 0 });
    expect(await runEscalationPass(at(60))).toEqual({ reminded: 0, escalated: 1 });
    const chased = await chaseMails(alert.id);
    // Every active duty officer, and not the deactivated one.
    expect(
      chased
        .filter((m) => m.kind === "alert-escalation")
        .map((m) => m.toEmail)
        .sort(),
    ).toEqual(officers.map((o) => o.email).sort());
    expect(await runEscalationPass(at(90))).toEqual({ reminded: 0, escalated: 0 });
    expect(await chaseMails(alert.id)).toHaveLength(chased.length);

    const [row] = await getDb().select().from(alerts).where(eq(alerts.id, alert.id));
    expect(row).toMatchObject({ remindedAt: at(30), escalatedAt: at(60), acknowledgedAt: null });
    const audit = await getDb()
      .select({ action: auditEvents.action })
      .from(auditEvents)
      .where(and(eq(auditEvents.targetType, "alert"), eq(auditEvents.targetId, String(alert.id))));
    expect(audit.map((a) => a.action)).toEqual(["alert.reminded", "alert.escalated"]);

    // The reminder carries a working acknowledgement link; the escalation names the contact.
    await drainDeliveries(at(60), 60_000);
    const reminder = fake
      .messages()
      .find(
        (m) =>
          m.subject.startsWith("Reminder, please acknowledge") &&
          [m.to].flat().includes(contact.email),
      );
    const escalation = fake
      .messages()
      .find(
        (m) =>
          m.subject === "Unacknowledged alert for Dana W: M+ within 24 h at 50% (threshold 40%)",
      );
    expect(escalation?.text).toContain("Dana W has not acknowledged alert AL-");
    expect(
      await acknowledgeByLink(linkToken(reminder?.text ?? "", "/ack"), alert.id, at(61)),
    ).toMatchObject({ ok: true });
  });

  it("chases nobody once the alert is acknowledged", async () => {
    const { contact, alert } = await raiseOneAlert("Rui C");
    await drainDeliveries(T0, 60_000);
    const mail = fake
      .messages()
      .find(
        (m) => m.subject.startsWith("Flare-risk alert") && [m.to].flat().includes(contact.email),
      );
    expect(
      await acknowledgeByLink(linkToken(mail?.text ?? "", "/ack"), alert.id, at(10)),
    ).toMatchObject({ ok: true });
    expect(await runEscalationPass(at(30))).toEqual({ reminded: 0, escalated: 0 });
    expect(await runEscalationPass(at(60))).toEqual({ reminded: 0, escalated: 0 });
    expect(await chaseMails(alert.id)).toEqual([]);
  });

  it("follows the office's reminder setting and stops when the window has ended", async () => {
    await getDb()
      .insert(settings)
      .values({ key: "office", value: { ...DEFAULT_OFFICE_SETTINGS, alertReminderMinutes: 10 } });
    const { alert } = await raiseOneAlert("Mina S");
    expect(await runEscalationPass(at(9))).toEqual({ reminded: 0, escalated: 0 });
    expect(await runEscalationPass(at(10))).toEqual({ reminded: 1, escalated: 0 });
    expect(await runEscalationPass(at(20))).toEqual({ reminded: 0, escalated: 1 });

    const late = await raiseOneAlert("Ola B");
    // A worker that was down for the whole 24 h window chases nothing afterwards.
    expect(await runEscalationPass(at(24 * 60))).toEqual({ reminded: 0, escalated: 0 });
    expect(await chaseMails(late.alert.id)).toEqual([]);
    expect(await chaseMails(alert.id)).toHaveLength(1 + officers.length);
  });
});
