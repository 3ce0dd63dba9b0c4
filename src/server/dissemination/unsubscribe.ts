// Owns unsubscribing by the signed link in every e-mail: effective at once (queued e-mails to the
// contact are cancelled in the same transaction) and audited; a second use is refused.
import { and, eq, isNull } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { contacts, organisations, outbox } from "@/db/schema";
import { formatUtc } from "@/lib/ui/format";
import { recordAudit, type AuditActor } from "@/server/audit/audit.db";
import { requireAuthSecret } from "@/server/config";
import { refuseUnsubscribe, type LinkRefusal } from "./link-failures";
import { readUnsubscribeToken } from "./link-tokens";

export interface UnsubscribeTarget {
  contactId: number;
  name: string;
  email: string;
  organisationName: string;
  unsubscribedAt: Date | null;
}

export type UnsubscribeView =
  { ok: true; contact: UnsubscribeTarget; cancelled?: number } | LinkRefusal;

async function findTarget(contactId: number): Promise<UnsubscribeTarget | null> {
  const [row] = await getDb()
    .select({
      contactId: contacts.id,
      name: contacts.name,
      email: contacts.email,
      organisationName: organisations.name,
      unsubscribedAt: contacts.unsubscribedAt,
    })
    .from(contacts)
    .innerJoin(organisations, eq(organisations.id, contacts.organisationId))
    .where(eq(contacts.id, contactId));
  return row ?? null;
}

export async function inspectUnsubscribeLink(
  token: string,
  now: Date = new Date(),
): Promise<UnsubscribeView> {
  const check = readUnsubscribeToken(requireAuthSecret(), token, now);
  if (!check.ok) return refuseUnsubscribe(check.reason);
  const contact = await findTarget(check.payload.contactId);
  if (!contact) return refuseUnsubscribe("unknown");
  if (contact.unsubscribedAt) return refuseUnsubscribe("used", formatUtc(contact.unsubscribedAt));
  return { ok: true, contact };
}

/** Marks the contact unsubscribed and cancels their queued e-mails; returns how many. */
export async function unsubscribeContact(
  tx: Db | Tx,
  contactId: number,
  now: Date,
  actor: AuditActor | null,
  via: string,
): Promise<number | null> {
  const [row] = await tx
    .update(contacts)
    .set({ unsubscribedAt: now })
    .where(and(eq(contacts.id, contactId), isNull(contacts.unsubscribedAt)))
    .returning({ id: contacts.id, email: contacts.email });
  if (!row) return null;
  const cancelled = await tx
    .update(outbox)
    .set({ status: "failed", lastError: "cancelled: the contact unsubscribed before it was sent" })
    .where(and(eq(outbox.contactId, contactId), eq(outbox.status, "queued")))
    .returning({ id: outbox.id });
  await recordAudit(
    {
      actor,
      action: "contact.unsubscribed",
      targetType: "contact",
      targetId: contactId,
      details: { via, email: row.email, cancelledDeliveries: cancelled.length },
    },
    tx,
  );
  return cancelled.length;
}

export async function unsubscribeByLink(
  token: string,
  now: Date = new Date(),
): Promise<UnsubscribeView> {
  const view = await inspectUnsubscribeLink(token, now);
  if (!view.ok) return view;
  const cancelled = await getDb().transaction((tx) =>
    unsubscribeContact(tx, view.contact.contactId, now, null, "link"),
  );
  const fresh = await findTarget(view.contact.contactId);
  if (cancelled === null)
    return refuseUnsubscribe(
      "used",
      fresh?.unsubscribedAt ? formatUtc(fresh.unsubscribedAt) : undefined,
    );
  return { ok: true, contact: fresh ?? view.contact, cancelled };
}
