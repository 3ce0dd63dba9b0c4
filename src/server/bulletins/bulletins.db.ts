// Drizzle access to one bulletin row: find, insert, and the revision-checked update every
// transition goes through, plus review comments and who contributed to a bulletin.
import { and, asc, desc, eq, inArray, lt, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { auditEvents, bulletinComments, bulletins, users } from "@/db/schema";
import type { BulletinState } from "@/lib/domain/bulletin-states";

export type BulletinRow = typeof bulletins.$inferSelect;
export type BulletinChange = Partial<Omit<typeof bulletins.$inferInsert, "id" | "revision">>;

export interface BulletinComment {
  id: number;
  authorName: string;
  body: string;
  createdAt: Date;
}

export async function findBulletin(id: number, tx: Db | Tx = getDb()): Promise<BulletinRow | null> {
  const [row] = await tx.select().from(bulletins).where(eq(bulletins.id, id));
  return row ?? null;
}

export async function findOpenBulletinForDay(
  day: string,
  tx: Db | Tx = getDb(),
): Promise<BulletinRow | null> {
  const [row] = await tx
    .select()
    .from(bulletins)
    .where(
      and(
        eq(bulletins.forecastDay, day),
        inArray(bulletins.status, ["draft", "in_review", "returned"]),
      ),
    );
  return row ?? null;
}

export async function findLatestVersionForDay(
  day: string,
  tx: Db | Tx = getDb(),
): Promise<BulletinRow | null> {
  const [row] = await tx
    .select()
    .from(bulletins)
    .where(eq(bulletins.forecastDay, day))
    .orderBy(desc(bulletins.version))
    .limit(1);
  return row ?? null;
}

/** The most recently issued bulletin still in force, other than `excludeId`. */
export async function findLatestIssued(
  excludeId: number,
  tx: Db | Tx = getDb(),
): Promise<BulletinRow | null> {
  const [row] = await tx
    .select()
    .from(bulletins)
    .where(and(eq(bulletins.status, "issued"), sql`${bulletins.id} <> ${excludeId}`))
    .orderBy(desc(bulletins.issueTime), desc(bulletins.id))
    .limit(1);
  return row ?? null;
}

/**
 * The bulletin a reader had before this one: the version it corrects, else the latest issued
 * before it (for an open bulletin: the latest one in force). Withdrawn ones are not counted.
 */
export async function findPreviousPublished(
  row: BulletinRow,
  tx: Db | Tx = getDb(),
): Promise<BulletinRow | null> {
  if (row.supersedesId !== null) return findBulletin(row.supersedesId, tx);
  const [found] = await tx
    .select()
    .from(bulletins)
    .where(
      and(
        inArray(bulletins.status, row.issueTime ? ["issued", "superseded"] : ["issued"]),
        sql`${bulletins.id} <> ${row.id}`,
        row.issueTime ? lt(bulletins.issueTime, row.issueTime) : undefined,
      ),
    )
    .orderBy(desc(bulletins.issueTime), desc(bulletins.id))
    .limit(1);
  return found ?? null;
}

export async function insertBulletin(
  tx: Tx,
  values: typeof bulletins.$inferInsert,
): Promise<BulletinRow> {
  const [row] = await tx.insert(bulletins).values(values).returning();
  if (!row) throw new Error("bulletin insert returned nothing");
  return row;
}

/**
 * Applies `change` only if the row still has the revision and status the caller read, and bumps
 * the revision (optimistic concurrency). Returns the new row, or null when someone got there first.
 */
export async function updateIfUnchanged(
  tx: Tx,
  id: number,
  seen: { revision: number; status: BulletinState },
  change: BulletinChange,
): Promise<BulletinRow | null> {
  const [row] = await tx
    .update(bulletins)
    .set({ ...change, revision: sql`${bulletins.revision} + 1`, updatedAt: new Date() })
    .where(
      and(
        eq(bulletins.id, id),
        eq(bulletins.revision, seen.revision),
        eq(bulletins.status, seen.status),
      ),
    )
    .returning();
  return row ?? null;
}

export async function insertComment(
  tx: Tx,
  bulletinId: number,
  authorId: number,
  body: string,
): Promise<void> {
  await tx.insert(bulletinComments).values({ bulletinId, authorId, body });
}

export async function listComments(bulletinId: number): Promise<BulletinComment[]> {
  return getDb()
    .select({
      id: bulletinComments.id,
      authorName: users.name,
      body: bulletinComments.body,
      createdAt: bulletinComments.createdAt,
    })
    .from(bulletinComments)
    .innerJoin(users, eq(bulletinComments.authorId, users.id))
    .where(eq(bulletinComments.bulletinId, bulletinId))
    .orderBy(asc(bulletinComments.createdAt), asc(bulletinComments.id));
}

const CONTRIBUTING_ACTIONS = ["bulletin.created", "bulletin.edited", "bulletin.submitted"];

/** Users who created, edited or submitted the bulletin, read from the audit trail. */
export async function listContributorIds(
  bulletinId: number,
  tx: Db | Tx = getDb(),
): Promise<number[]> {
  const rows = await tx
    .selectDistinct({ id: auditEvents.actorUserId })
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.targetType, "bulletin"),
        eq(auditEvents.targetId, String(bulletinId)),
        inArray(auditEvents.action, CONTRIBUTING_ACTIONS),
      ),
    );
  return rows.flatMap((r) => (r.id === null ? [] : [r.id]));
}
