// Owns reading one alert with its contact and bulletin, and recording its acknowledgement once.
import { and, eq, isNull } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { alerts, bulletins, contacts, organisations } from "@/db/schema";
import { alertReference } from "./alert-mail";

export interface AlertView {
  id: number;
  reference: string;
  bulletinId: number;
  bulletinVersion: number;
  forecastDay: string;
  issueTime: Date | null;
  contactId: number;
  contactName: string;
  organisationName: string;
  level: string;
  windowHours: number;
  probability: number;
  thresholdProbability: number;
  raisedAt: Date;
  windowEndsAt: Date | null;
  acknowledgedAt: Date | null;
  acknowledgedVia: string | null;
  remindedAt: Date | null;
  escalatedAt: Date | null;
}

export const alertViewColumns = {
  alert: alerts,
  bulletinVersion: bulletins.version,
  forecastDay: bulletins.forecastDay,
  issueTime: bulletins.issueTime,
  contactName: contacts.name,
  organisationName: organisations.name,
};

type AlertViewRow = {
  alert: typeof alerts.$inferSelect;
  bulletinVersion: number;
  forecastDay: string;
  issueTime: Date | null;
  contactName: string;
  organisationName: string;
};

export function toAlertView(row: AlertViewRow): AlertView {
  const a = row.alert;
  return {
    id: a.id,
    reference: alertReference(a.id),
    bulletinId: a.bulletinId,
    bulletinVersion: row.bulletinVersion,
    forecastDay: row.forecastDay,
    issueTime: row.issueTime,
    contactId: a.contactId,
    contactName: row.contactName,
    organisationName: row.organisationName,
    level: a.level,
    windowHours: a.windowHours,
    probability: a.probability,
    thresholdProbability: a.thresholdProbability,
    raisedAt: a.raisedAt,
    windowEndsAt: row.issueTime
      ? new Date(row.issueTime.getTime() + a.windowHours * 3600_000)
      : null,
    acknowledgedAt: a.acknowledgedAt,
    acknowledgedVia: a.acknowledgedVia,
    remindedAt: a.remindedAt,
    escalatedAt: a.escalatedAt,
  };
}

export function selectAlertViews(db: Db | Tx = getDb()) {
  return db
    .select(alertViewColumns)
    .from(alerts)
    .innerJoin(bulletins, eq(bulletins.id, alerts.bulletinId))
    .innerJoin(contacts, eq(contacts.id, alerts.contactId))
    .innerJoin(organisations, eq(organisations.id, contacts.organisationId));
}

export async function findAlertView(id: number, db: Db | Tx = getDb()): Promise<AlertView | null> {
  const [row] = await selectAlertViews(db).where(eq(alerts.id, id));
  return row ? toAlertView(row) : null;
}

/** Sets the acknowledgement only if none is recorded; false when someone was first. */
export async function markAcknowledged(
  tx: Db | Tx,
  alertId: number,
  at: Date,
  via: string,
): Promise<boolean> {
  const rows = await tx
    .update(alerts)
    .set({ acknowledgedAt: at, acknowledgedVia: via })
    .where(and(eq(alerts.id, alertId), isNull(alerts.acknowledgedAt)))
    .returning({ id: alerts.id });
  return rows.length === 1;
}
