// Owns the Drizzle reads of contacts and thresholds for the desk's contact pages.
import { and, asc, eq, ilike, inArray, or, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { alertThresholds, contacts, organisations, users } from "@/db/schema";

export interface ThresholdItem {
  id: number;
  level: string;
  windowHours: number;
  probability: number;
}

export interface ContactItem {
  id: number;
  organisationId: number;
  organisationName: string;
  name: string;
  email: string;
  wantsBulletins: boolean;
  unsubscribedAt: Date | null;
  userId: number | null;
  isDemo: boolean;
  thresholds: ThresholdItem[];
}

export interface ContactFilter {
  q?: string;
  organisationId?: number;
  page: number;
  pageSize: number;
}

export async function listThresholdsFor(
  contactIds: number[],
  db: Db | Tx = getDb(),
): Promise<Map<number, ThresholdItem[]>> {
  const map = new Map<number, ThresholdItem[]>();
  if (contactIds.length === 0) return map;
  const rows = await db
    .select({
      id: alertThresholds.id,
      contactId: alertThresholds.contactId,
      level: alertThresholds.level,
      windowHours: alertThresholds.windowHours,
      probability: alertThresholds.probability,
    })
    .from(alertThresholds)
    .where(inArray(alertThresholds.contactId, contactIds))
    .orderBy(asc(alertThresholds.level), asc(alertThresholds.windowHours), asc(alertThresholds.id));
  for (const { contactId, ...t } of rows) map.set(contactId, [...(map.get(contactId) ?? []), t]);
  return map;
}

const contactColumns = {
  id: contacts.id,
  organisationId: contacts.organisationId,
  organisationName: organisations.name,
  name: contacts.name,
  email: contacts.email,
  wantsBulletins: contacts.wantsBulletins,
  unsubscribedAt: contacts.unsubscribedAt,
  userId: contacts.userId,
  isDemo: contacts.isDemo,
};

export async function listContacts(
  filter: ContactFilter,
): Promise<{ rows: ContactItem[]; total: number }> {
  const db = getDb();
  const conditions: SQL[] = [];
  if (filter.q) {
    const match = or(ilike(contacts.name, `%${filter.q}%`), ilike(contacts.email, `%${filter.q}%`));
    if (match) conditions.push(match);
  }
  if (filter.organisationId) conditions.push(eq(contacts.organisationId, filter.organisationId));
  const where = conditions.length ? and(...conditions) : undefined;
  const rows = await db
    .select(contactColumns)
    .from(contacts)
    .innerJoin(organisations, eq(organisations.id, contacts.organisationId))
    .where(where)
    .orderBy(asc(organisations.name), asc(contacts.name), asc(contacts.id))
    .limit(filter.pageSize)
    .offset((filter.page - 1) * filter.pageSize);
  const [count] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(contacts)
    .where(where);
  const thresholds = await listThresholdsFor(
    rows.map((r) => r.id),
    db,
  );
  return {
    rows: rows.map((r) => ({ ...r, thresholds: thresholds.get(r.id) ?? [] })),
    total: count?.n ?? 0,
  };
}

export async function findContactItem(
  id: number,
  db: Db | Tx = getDb(),
): Promise<ContactItem | null> {
  const [row] = await db
    .select(contactColumns)
    .from(contacts)
    .innerJoin(organisations, eq(organisations.id, contacts.organisationId))
    .where(eq(contacts.id, id));
  if (!row) return null;
  return { ...row, thresholds: (await listThresholdsFor([id], db)).get(id) ?? [] };
}

/** Lower-cased e-mail addresses of every contact (for import duplicate checks). */
export async function listContactEmails(db: Db | Tx = getDb()): Promise<Set<string>> {
  const rows = await db.select({ email: contacts.email }).from(contacts);
  return new Set(rows.map((r) => r.email.toLowerCase()));
}

/** Subscriber accounts by lower-cased e-mail, so a new contact is linked to its account. */
export async function listSubscriberAccounts(db: Db | Tx = getDb()): Promise<Map<string, number>> {
  const rows = await db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(eq(users.role, "subscriber"));
  return new Map(rows.map((r) => [r.email.toLowerCase(), r.id]));
}

export async function findOrganisation(id: number, db: Db | Tx = getDb()) {
  const [row] = await db.select().from(organisations).where(eq(organisations.id, id));
  return row ?? null;
}
