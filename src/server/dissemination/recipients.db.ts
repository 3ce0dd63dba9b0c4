// Owns the reads the issuing transaction needs: subscribed contacts' thresholds, which of their
// alerts are still in force, and the contacts an alert goes to.
import { and, eq, gt, inArray, isNull, sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { alerts, alertThresholds, bulletins, contacts } from "@/db/schema";

export interface Recipient {
  id: number;
  name: string;
  email: string;
  wantsBulletins: boolean;
}

export interface RecipientThreshold {
  id: number;
  contactId: number;
  level: string;
  windowHours: number;
  probability: number;
}

export async function listContactsById(tx: Db | Tx, ids: number[]): Promise<Recipient[]> {
  if (ids.length === 0) return [];
  return tx
    .select({
      id: contacts.id,
      name: contacts.name,
      email: contacts.email,
      wantsBulletins: contacts.wantsBulletins,
    })
    .from(contacts)
    .where(inArray(contacts.id, [...new Set(ids)]));
}

export async function listSubscribedThresholds(tx: Db | Tx): Promise<RecipientThreshold[]> {
  return tx
    .select({
      id: alertThresholds.id,
      contactId: alertThresholds.contactId,
      level: alertThresholds.level,
      windowHours: alertThresholds.windowHours,
      probability: alertThresholds.probability,
    })
    .from(alertThresholds)
    .innerJoin(contacts, eq(contacts.id, alertThresholds.contactId))
    .where(isNull(contacts.unsubscribedAt))
    .orderBy(alertThresholds.id);
}

export function inForceKey(contactId: number, level: string, windowHours: number): string {
  return `${contactId}|${level}|${windowHours}`;
}

/** Keys of (contact, level, window) with an alert whose window has not ended at `at`. */
export async function listAlertsInForce(tx: Db | Tx, at: Date): Promise<Set<string>> {
  const rows = await tx
    .select({ contactId: alerts.contactId, level: alerts.level, windowHours: alerts.windowHours })
    .from(alerts)
    .innerJoin(bulletins, eq(bulletins.id, alerts.bulletinId))
    .where(
      and(
        // No window is longer than 72 h, which bounds the scan.
        gt(bulletins.issueTime, new Date(at.getTime() - 72 * 3600_000)),
        // An alert is in force until its bulletin's issue time plus the window (see crossing.ts).
        gt(sql`${bulletins.issueTime} + make_interval(hours => ${alerts.windowHours})`, at),
      ),
    );
  return new Set(rows.map((r) => inForceKey(r.contactId, r.level, r.windowHours)));
}
