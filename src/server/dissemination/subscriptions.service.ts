// Owns a signed-in subscriber's own subscription: their bulletin choice, their thresholds and
// their alerts. Every call acts on the caller's own contact; any other contact's data is refused.
import { desc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alerts, contacts } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { SubscriptionPrefsInput, ThresholdInput } from "@/lib/schemas/subscriptions";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import { selectAlertViews, toAlertView, type AlertView } from "./alerts.db";
import { findContactItem, type ContactItem, type ThresholdItem } from "./contacts.db";
import { findOwnContact, type ContactRow } from "./own-contact";
import {
  addThreshold,
  changeThreshold,
  findThreshold,
  removeThreshold,
} from "./thresholds.service";
import { unsubscribeContact } from "./unsubscribe";

export interface OwnSubscription {
  contact: ContactItem;
  openAlerts: AlertView[];
  recentAlerts: AlertView[];
}

async function requireOwnContact(user: CurrentUser): Promise<ContactRow> {
  const contact = await findOwnContact(user);
  if (!contact)
    throw new AppError(
      "FORBIDDEN",
      "Your account is not on the distribution list yet: ask the duty desk to add you.",
    );
  return contact;
}

async function requireOwnThreshold(user: CurrentUser, thresholdId: number): Promise<ContactRow> {
  const contact = await requireOwnContact(user);
  const threshold = await findThreshold(thresholdId);
  if (!threshold) throw new AppError("NOT_FOUND", "No such threshold.");
  if (threshold.contactId !== contact.id)
    throw new AppError(
      "FORBIDDEN",
      "This threshold belongs to another contact: you can change only your own.",
    );
  return contact;
}

export async function getOwnSubscription(
  user: CurrentUser,
  now: Date = new Date(),
): Promise<OwnSubscription | null> {
  const own = await findOwnContact(user);
  if (!own) return null;
  const contact = (await findContactItem(own.id)) as ContactItem;
  const rows = await selectAlertViews()
    .where(eq(alerts.contactId, own.id))
    .orderBy(desc(alerts.raisedAt), desc(alerts.id))
    .limit(30);
  const views = rows.map(toAlertView);
  const isOpen = (a: AlertView) => !a.acknowledgedAt && !!a.windowEndsAt && a.windowEndsAt > now;
  return {
    contact,
    openAlerts: views.filter(isOpen),
    recentAlerts: views.filter((a) => !isOpen(a)),
  };
}

export async function setOwnPreferences(
  user: CurrentUser,
  input: SubscriptionPrefsInput,
  now: Date = new Date(),
): Promise<ContactItem> {
  const contact = await requireOwnContact(user);
  const actor = { id: user.id, email: user.email };
  await getDb().transaction(async (tx) => {
    if (input.wantsBulletins !== undefined && input.wantsBulletins !== contact.wantsBulletins) {
      await tx
        .update(contacts)
        .set({ wantsBulletins: input.wantsBulletins })
        .where(eq(contacts.id, contact.id));
      await recordAudit(
        {
          actor,
          action: "subscription.bulletins_changed",
          targetType: "contact",
          targetId: contact.id,
          details: { via: "portal", wantsBulletins: input.wantsBulletins },
        },
        tx,
      );
    }
    if (input.isSubscribed === false)
      await unsubscribeContact(tx, contact.id, now, actor, "portal");
    if (input.isSubscribed === true && contact.unsubscribedAt) {
      await tx.update(contacts).set({ unsubscribedAt: null }).where(eq(contacts.id, contact.id));
      await recordAudit(
        {
          actor,
          action: "contact.resubscribed",
          targetType: "contact",
          targetId: contact.id,
          details: { via: "portal" },
        },
        tx,
      );
    }
  });
  return (await findContactItem(contact.id)) as ContactItem;
}

export async function addOwnThreshold(
  user: CurrentUser,
  input: ThresholdInput,
): Promise<ThresholdItem> {
  const contact = await requireOwnContact(user);
  return addThreshold(contact.id, input, user, "portal");
}

export async function changeOwnThreshold(
  user: CurrentUser,
  thresholdId: number,
  input: ThresholdInput,
): Promise<ThresholdItem> {
  const contact = await requireOwnThreshold(user, thresholdId);
  return changeThreshold(contact.id, thresholdId, input, user, "portal");
}

export async function removeOwnThreshold(user: CurrentUser, thresholdId: number): Promise<void> {
  const contact = await requireOwnThreshold(user, thresholdId);
  await removeThreshold(contact.id, thresholdId, user, "portal");
}
