// Owns the two chasing steps of an unacknowledged alert, each recorded once on the alert row and
// audited: the reminder e-mail to the contact and the notice to every active duty officer.
import { and, eq, isNull } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { alerts } from "@/db/schema";
import { recordAudit } from "@/server/audit/audit.db";
import { fromStoredContent } from "@/server/bulletins/content-json";
import type { AlertFacts, AlertMailComposer } from "./alert-mail";
import { ackExpiry, signAckToken, signUnsubscribeToken, unsubscribeExpiry } from "./link-tokens";
import { outboxKeys, type OutboxInsert } from "./outbox.db";

export interface DueAlert {
  alert: AlertFacts & { bulletinId: number; contactId: number };
  contactName: string;
  contactEmail: string;
  content: unknown;
}

export type DutyOfficer = { id: number; name: string; email: string };

export interface PassContext {
  tx: Tx;
  now: Date;
  secret: string;
  composer: AlertMailComposer;
}

/** Records the step once: false when another pass recorded it first. */
async function markStep(
  tx: Tx,
  alertId: number,
  step: "remindedAt" | "escalatedAt",
  now: Date,
): Promise<boolean> {
  const column = step === "remindedAt" ? alerts.remindedAt : alerts.escalatedAt;
  const rows = await tx
    .update(alerts)
    .set({ [step]: now })
    .where(and(eq(alerts.id, alertId), isNull(column)))
    .returning({ id: alerts.id });
  return rows.length === 1;
}

export async function remind(ctx: PassContext, d: DueAlert): Promise<OutboxInsert | null> {
  const { alert } = d;
  if (!(await markStep(ctx.tx, alert.id, "remindedAt", ctx.now))) return null;
  const issueTime = fromStoredContent(d.content).issueTime;
  const mail = await ctx.composer.compose("alert-reminder", alert, {
    name: d.contactName,
    ackToken: signAckToken(
      ctx.secret,
      { alertId: alert.id, contactId: alert.contactId },
      ackExpiry(issueTime, alert.windowHours),
    ),
    unsubscribeToken: signUnsubscribeToken(
      ctx.secret,
      { contactId: alert.contactId },
      unsubscribeExpiry(ctx.now),
    ),
  });
  const audit = { contactId: alert.contactId, email: d.contactEmail };
  await recordAudit(
    {
      actor: null,
      action: "alert.reminded",
      targetType: "alert",
      targetId: alert.id,
      details: audit,
    },
    ctx.tx,
  );
  const key = outboxKeys.reminder(alert.id);
  return {
    kind: "alert-reminder",
    bulletinId: alert.bulletinId,
    alertId: alert.id,
    contactId: alert.contactId,
    toEmail: d.contactEmail,
    ...mail,
    idempotencyKey: key,
    createdAt: ctx.now,
    nextAttemptAt: ctx.now,
  };
}

export async function escalate(
  ctx: PassContext,
  d: DueAlert,
  officers: DutyOfficer[],
): Promise<OutboxInsert[] | null> {
  const { alert } = d;
  if (!(await markStep(ctx.tx, alert.id, "escalatedAt", ctx.now))) return null;
  const rows: OutboxInsert[] = [];
  for (const officer of officers) {
    const mail = await ctx.composer.compose("alert-escalation", alert, {
      name: officer.name,
      subscriberName: d.contactName,
    });
    const key = outboxKeys.escalation(alert.id, officer.id);
    rows.push({
      kind: "alert-escalation",
      bulletinId: alert.bulletinId,
      alertId: alert.id,
      toEmail: officer.email,
      ...mail,
      idempotencyKey: key,
      createdAt: ctx.now,
      nextAttemptAt: ctx.now,
    });
  }
  const audit = { contactId: alert.contactId, dutyOfficers: officers.map((o) => o.email) };
  await recordAudit(
    {
      actor: null,
      action: "alert.escalated",
      targetType: "alert",
      targetId: alert.id,
      details: audit,
    },
    ctx.tx,
  );
  return rows;
}
