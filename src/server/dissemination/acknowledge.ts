// Owns acknowledging alerts: by the signed link (no sign-in), by a subscriber in the portal, or
// by a duty officer who reached the contact another way. Each acknowledgement is audited once.
import { getDb } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import { formatUtc } from "@/lib/ui/format";
import { recordAudit } from "@/server/audit/audit.db";
import { requireAuthSecret } from "@/server/config";
import { AppError } from "@/server/http/errors";
import { findAlertView, markAcknowledged, type AlertView } from "./alerts.db";
import { refuseAck, type LinkRefusal } from "./link-failures";
import { isClaimForAlert, readAckToken } from "./link-tokens";
import { findOwnContact } from "./own-contact";

export type AckLinkView = { ok: true; alert: AlertView } | (LinkRefusal & { alert?: AlertView });

/** Checks a link without changing anything (the page shown before the button is pressed). */
export async function inspectAckLink(
  token: string,
  now: Date = new Date(),
  expectedAlertId?: number,
): Promise<AckLinkView> {
  const check = readAckToken(requireAuthSecret(), token, now);
  if (!check.ok) return refuseAck(check.reason);
  if (expectedAlertId !== undefined && expectedAlertId !== check.payload.alertId)
    return refuseAck("not-this-alert");
  const alert = await findAlertView(check.payload.alertId);
  if (!alert) return refuseAck("unknown");
  if (!isClaimForAlert(check.payload, alert)) return refuseAck("not-this-alert");
  if (alert.acknowledgedAt) return { ...refuseAck("used", formatUtc(alert.acknowledgedAt)), alert };
  return { ok: true, alert };
}

/** The "Acknowledge" button: `expectedAlertId` is the alert the page showed. */
export async function acknowledgeByLink(
  token: string,
  expectedAlertId: number | undefined,
  now: Date = new Date(),
): Promise<AckLinkView> {
  const view = await inspectAckLink(token, now, expectedAlertId);
  if (!view.ok) return view;
  const alert = view.alert;
  const isFirst = await getDb().transaction(async (tx) => {
    if (!(await markAcknowledged(tx, alert.id, now, "link"))) return false;
    await recordAudit(
      {
        actor: null,
        action: "alert.acknowledged",
        targetType: "alert",
        targetId: alert.id,
        details: { via: "link", contactId: alert.contactId },
      },
      tx,
    );
    return true;
  });
  const fresh = (await findAlertView(alert.id)) ?? alert;
  if (!isFirst)
    return {
      ...refuseAck("used", fresh.acknowledgedAt ? formatUtc(fresh.acknowledgedAt) : undefined),
      alert: fresh,
    };
  return { ok: true, alert: fresh };
}

async function acknowledgeAs(
  alert: AlertView,
  actor: CurrentUser,
  via: string,
  details: Record<string, unknown>,
  now: Date,
): Promise<AlertView> {
  if (alert.acknowledgedAt)
    throw new AppError(
      "CONFLICT",
      `This alert was already acknowledged at ${formatUtc(alert.acknowledgedAt)}.`,
    );
  const isFirst = await getDb().transaction(async (tx) => {
    if (!(await markAcknowledged(tx, alert.id, now, via))) return false;
    await recordAudit(
      {
        actor: { id: actor.id, email: actor.email },
        action: "alert.acknowledged",
        targetType: "alert",
        targetId: alert.id,
        details: { via, contactId: alert.contactId, ...details },
      },
      tx,
    );
    return true;
  });
  if (!isFirst) throw new AppError("CONFLICT", "This alert was acknowledged a moment ago.");
  return (await findAlertView(alert.id)) ?? alert;
}

/** A signed-in subscriber acknowledges one of their own alerts; anyone else's is refused. */
export async function acknowledgeOwnAlert(
  user: CurrentUser,
  alertId: number,
  now: Date = new Date(),
): Promise<AlertView> {
  const contact = await findOwnContact(user);
  const alert = await findAlertView(alertId);
  if (!alert) throw new AppError("NOT_FOUND", "No such alert.");
  if (!contact || alert.contactId !== contact.id)
    throw new AppError("FORBIDDEN", "This alert was sent to someone else.");
  return acknowledgeAs(alert, user, "portal", {}, now);
}

/** A duty officer records an acknowledgement taken by phone or radio, with a note saying how. */
export async function acknowledgeForContact(
  actor: CurrentUser,
  alertId: number,
  note: string,
  now: Date = new Date(),
): Promise<AlertView> {
  const alert = await findAlertView(alertId);
  if (!alert) throw new AppError("NOT_FOUND", "No such alert.");
  return acknowledgeAs(alert, actor, "desk", { note }, now);
}
