// Owns chasing unacknowledged alerts. With R = the office's alertReminderMinutes (default 30):
// a reminder goes to the contact R minutes after the alert was raised, and a notice to every
// active duty officer 2R minutes after it (R after the reminder). Acknowledged alerts, and alerts
// whose window has ended, are never chased. Each step happens once (a column and an outbox key).
import { and, eq, isNull, lte, or, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { alerts, bulletins, contacts, users } from "@/db/schema";
import { fromStoredContent } from "@/server/bulletins/content-json";
import { readConfig, requireAuthSecret } from "@/server/config";
import { getOfficeSettings } from "@/server/settings/settings.db";
import { createAlertMailComposer, type AlertMailComposer } from "./alert-mail";
import { escalate, remind, type DutyOfficer } from "./escalation-steps";
import { insertOutboxRows, type OutboxInsert } from "./outbox.db";

export interface EscalationResult {
  reminded: number;
  escalated: number;
}

type ChaseRow = Awaited<ReturnType<typeof selectChaseable>>[number];

export function escalationSchedule(
  raisedAt: Date,
  reminderMinutes: number,
): { remindAt: Date; escalateAt: Date } {
  const step = reminderMinutes * 60_000;
  return {
    remindAt: new Date(raisedAt.getTime() + step),
    escalateAt: new Date(raisedAt.getTime() + 2 * step),
  };
}

async function selectChaseable(tx: Tx, now: Date, reminderMinutes: number) {
  return tx
    .select({
      alert: alerts,
      contactName: contacts.name,
      contactEmail: contacts.email,
      unsubscribedAt: contacts.unsubscribedAt,
      content: bulletins.content,
    })
    .from(alerts)
    .innerJoin(contacts, eq(contacts.id, alerts.contactId))
    .innerJoin(bulletins, eq(bulletins.id, alerts.bulletinId))
    .where(
      and(
        isNull(alerts.acknowledgedAt),
        or(isNull(alerts.remindedAt), isNull(alerts.escalatedAt)),
        lte(alerts.raisedAt, new Date(now.getTime() - reminderMinutes * 60_000)),
        sql`${bulletins.issueTime} + make_interval(hours => ${alerts.windowHours}) > ${now.toISOString()}::timestamptz`,
      ),
    )
    .orderBy(alerts.id);
}

function composerFor(
  cache: Map<number, AlertMailComposer>,
  due: ChaseRow,
  baseUrl: string,
): AlertMailComposer {
  let composer = cache.get(due.alert.bulletinId);
  if (!composer) {
    const b = fromStoredContent(due.content);
    composer = createAlertMailComposer(
      {
        id: due.alert.bulletinId,
        officeName: b.officeName,
        version: b.version,
        issueTime: b.issueTime,
        fullDisk: b.fullDisk,
      },
      baseUrl,
    );
    cache.set(due.alert.bulletinId, composer);
  }
  return composer;
}

export async function runEscalationPass(now: Date = new Date()): Promise<EscalationResult> {
  const { alertReminderMinutes } = await getOfficeSettings();
  const secret = requireAuthSecret();
  const baseUrl = readConfig().publicBaseUrl;
  return getDb().transaction(async (tx) => {
    const due = await selectChaseable(tx, now, alertReminderMinutes);
    if (due.length === 0) return { reminded: 0, escalated: 0 };
    const officers: DutyOfficer[] = await tx
      .select({ id: users.id, name: users.name, email: users.email })
      .from(users)
      .where(and(eq(users.role, "duty_officer"), eq(users.isActive, true)));
    const composers = new Map<number, AlertMailComposer>();
    const rows: OutboxInsert[] = [];
    const result: EscalationResult = { reminded: 0, escalated: 0 };
    for (const d of due) {
      const { remindAt, escalateAt } = escalationSchedule(d.alert.raisedAt, alertReminderMinutes);
      const ctx = { tx, now, secret, composer: composerFor(composers, d, baseUrl) };
      // No reminder to a contact who unsubscribed; the desk is still told the alert is open.
      if (!d.alert.remindedAt && remindAt <= now && !d.unsubscribedAt) {
        const reminder = await remind(ctx, d);
        if (reminder) {
          rows.push(reminder);
          result.reminded += 1;
        }
      }
      if (!d.alert.escalatedAt && escalateAt <= now) {
        const notices = await escalate(ctx, d, officers);
        if (notices) {
          rows.push(...notices);
          result.escalated += 1;
        }
      }
    }
    await insertOutboxRows(tx, rows);
    return result;
  });
}
