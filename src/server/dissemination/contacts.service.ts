// Owns the desk's use cases for contacts: add, change (including unsubscribing and
// resubscribing on a contact's behalf) and remove, each audited.
import { and, eq, ne, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { alerts, contacts, outbox } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { ContactInput, ContactUpdateInput } from "@/lib/schemas/subscriptions";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import {
  findContactItem,
  findOrganisation,
  listSubscriberAccounts,
  type ContactItem,
} from "./contacts.db";
import { unsubscribeContact } from "./unsubscribe";

const actorOf = (u: CurrentUser) => ({ id: u.id, email: u.email });

async function requireFreeEmail(db: Db | Tx, email: string, exceptId?: number): Promise<void> {
  const same = sql`lower(${contacts.email}) = ${email.trim().toLowerCase()}`;
  const [taken] = await db
    .select({ id: contacts.id })
    .from(contacts)
    .where(exceptId ? and(same, ne(contacts.id, exceptId)) : same);
  if (taken)
    throw new AppError("CONFLICT", "Another contact already uses this e-mail address.", {
      fields: { email: "This address is already a contact." },
    });
}

async function requireOrganisation(db: Db | Tx, id: number): Promise<void> {
  if (!(await findOrganisation(id, db)))
    throw new AppError("BAD_REQUEST", "Choose an existing organisation.", {
      fields: { organisationId: "No such organisation." },
    });
}

export async function createContact(input: ContactInput, actor: CurrentUser): Promise<ContactItem> {
  const id = await getDb().transaction(async (tx) => {
    await requireOrganisation(tx, input.organisationId);
    await requireFreeEmail(tx, input.email);
    const userId = (await listSubscriberAccounts(tx)).get(input.email.toLowerCase()) ?? null;
    const [row] = await tx
      .insert(contacts)
      .values({ ...input, userId })
      .returning({ id: contacts.id });
    if (!row) throw new Error("contact insert returned nothing");
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "contact.created",
        targetType: "contact",
        targetId: row.id,
        details: { email: input.email, organisationId: input.organisationId, linkedUserId: userId },
      },
      tx,
    );
    return row.id;
  });
  return (await findContactItem(id)) as ContactItem;
}

export async function updateContact(
  id: number,
  input: ContactUpdateInput,
  actor: CurrentUser,
  now: Date = new Date(),
): Promise<ContactItem> {
  await getDb().transaction(async (tx) => {
    const [before] = await tx.select().from(contacts).where(eq(contacts.id, id));
    if (!before) throw new AppError("NOT_FOUND", "No such contact.");
    if (input.organisationId !== undefined) await requireOrganisation(tx, input.organisationId);
    const { isSubscribed, ...fields } = input;
    const change: Partial<typeof contacts.$inferInsert> = { ...fields };
    if (input.email !== undefined && input.email.toLowerCase() !== before.email.toLowerCase()) {
      await requireFreeEmail(tx, input.email, id);
      change.userId = (await listSubscriberAccounts(tx)).get(input.email.toLowerCase()) ?? null;
    }
    if (Object.keys(change).length) {
      await tx.update(contacts).set(change).where(eq(contacts.id, id));
      await recordAudit(
        {
          actor: actorOf(actor),
          action: "contact.updated",
          targetType: "contact",
          targetId: id,
          details: { changes: fields },
        },
        tx,
      );
    }
    if (isSubscribed === false) await unsubscribeContact(tx, id, now, actorOf(actor), "desk");
    if (isSubscribed === true && before.unsubscribedAt) {
      await tx.update(contacts).set({ unsubscribedAt: null }).where(eq(contacts.id, id));
      await recordAudit(
        {
          actor: actorOf(actor),
          action: "contact.resubscribed",
          targetType: "contact",
          targetId: id,
          details: { via: "desk" },
        },
        tx,
      );
    }
  });
  return (await findContactItem(id)) as ContactItem;
}

/** A contact with deliveries or alerts on record stays for the record: unsubscribe it instead. */
export async function deleteContact(id: number, actor: CurrentUser): Promise<void> {
  await getDb().transaction(async (tx) => {
    const [row] = await tx.select().from(contacts).where(eq(contacts.id, id));
    if (!row) throw new AppError("NOT_FOUND", "No such contact.");
    const [deliveries] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(outbox)
      .where(eq(outbox.contactId, id));
    const [raised] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(alerts)
      .where(eq(alerts.contactId, id));
    if ((deliveries?.n ?? 0) + (raised?.n ?? 0) > 0)
      throw new AppError(
        "CONFLICT",
        "This contact has deliveries or alerts on record, so it stays: unsubscribe it instead.",
      );
    await tx.delete(contacts).where(eq(contacts.id, id));
    await recordAudit(
      {
        actor: actorOf(actor),
        action: "contact.deleted",
        targetType: "contact",
        targetId: id,
        details: { email: row.email },
      },
      tx,
    );
  });
}
