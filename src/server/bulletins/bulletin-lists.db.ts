// Drizzle access for lists of bulletins: the desk's filtered, paged list and the published feed.
import { and, desc, eq, inArray, lt, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb } from "@/db/client";
import { bulletins, users } from "@/db/schema";
import type { BulletinState } from "@/lib/domain/bulletin-states";
import type { BulletinSummary } from "@/lib/query/bulletins";
import type { BulletinRow } from "./bulletins.db";

export const PUBLISHED_STATES: BulletinState[] = ["issued", "superseded", "withdrawn"];

export interface BulletinListFilter {
  /** Only these states (subscribers see published ones only). */
  statuses?: readonly BulletinState[];
  day?: string;
  page: number;
  pageSize: number;
}

const approvers = alias(users, "approvers");

export function toSummary(
  row: BulletinRow,
  authorName: string,
  approverName: string | null,
): BulletinSummary {
  return {
    id: row.id,
    forecastDay: row.forecastDay,
    version: row.version,
    status: row.status,
    authorId: row.authorId,
    authorName,
    approverName,
    issueTime: row.issueTime?.toISOString() ?? null,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
    supersedesId: row.supersedesId,
    isDemo: row.isDemo,
    revision: row.revision,
  };
}

export async function listBulletins(
  filter: BulletinListFilter,
): Promise<{ rows: BulletinSummary[]; total: number }> {
  const conditions: SQL[] = [];
  if (filter.statuses) conditions.push(inArray(bulletins.status, [...filter.statuses]));
  if (filter.day) conditions.push(eq(bulletins.forecastDay, filter.day));
  const where = conditions.length ? and(...conditions) : undefined;
  const db = getDb();
  const rows = await db
    .select({ b: bulletins, author: users.name, approver: approvers.name })
    .from(bulletins)
    .innerJoin(users, eq(bulletins.authorId, users.id))
    .leftJoin(approvers, eq(bulletins.approverId, approvers.id))
    .where(where)
    .orderBy(desc(bulletins.forecastDay), desc(bulletins.version))
    .limit(filter.pageSize)
    .offset((filter.page - 1) * filter.pageSize);
  const [count] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(bulletins)
    .where(where);
  return { rows: rows.map((r) => toSummary(r.b, r.author, r.approver)), total: count?.n ?? 0 };
}

export async function findSummary(id: number): Promise<BulletinSummary | null> {
  const [r] = await getDb()
    .select({ b: bulletins, author: users.name, approver: approvers.name })
    .from(bulletins)
    .innerJoin(users, eq(bulletins.authorId, users.id))
    .leftJoin(approvers, eq(bulletins.approverId, approvers.id))
    .where(eq(bulletins.id, id));
  return r ? toSummary(r.b, r.author, r.approver) : null;
}

/** Published bulletins, newest issue time first, strictly before `before` when given. */
export async function listPublished(limit: number, before?: Date): Promise<BulletinRow[]> {
  const conditions: SQL[] = [inArray(bulletins.status, PUBLISHED_STATES)];
  if (before) conditions.push(lt(bulletins.issueTime, before));
  return getDb()
    .select()
    .from(bulletins)
    .where(and(...conditions))
    .orderBy(desc(bulletins.issueTime), desc(bulletins.id))
    .limit(limit);
}

/** Bulletins whose supersedesId is one of `ids` and that were issued (their successors). */
export async function listSuccessors(ids: number[]): Promise<BulletinRow[]> {
  if (ids.length === 0) return [];
  return getDb()
    .select()
    .from(bulletins)
    .where(and(inArray(bulletins.supersedesId, ids), inArray(bulletins.status, PUBLISHED_STATES)));
}

export async function listBulletinsById(ids: number[]): Promise<BulletinRow[]> {
  if (ids.length === 0) return [];
  return getDb().select().from(bulletins).where(inArray(bulletins.id, ids));
}
