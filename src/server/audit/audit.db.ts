// Writes and reads the append-only audit trail.
import { and, desc, eq, gte, ilike, lt, or, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { auditEvents } from "@/db/schema";
import { currentRequestFacts } from "@/server/http/request-context";

export interface AuditActor {
  id: number | null;
  email: string | null;
}

export interface AuditInput {
  actor: AuditActor | null;
  action: string;
  targetType?: string;
  targetId?: string | number;
  details?: Record<string, unknown>;
}

export async function recordAudit(input: AuditInput, tx: Db | Tx = getDb()): Promise<void> {
  await tx.insert(auditEvents).values({
    actorUserId: input.actor?.id ?? null,
    actorEmail: input.actor?.email ?? null,
    action: input.action,
    targetType: input.targetType ?? null,
    targetId: input.targetId === undefined ? null : String(input.targetId),
    details: input.details ?? {},
    ip: currentRequestFacts().ip,
  });
}

export interface AuditFilter {
  action?: string;
  actor?: string;
  from?: Date;
  to?: Date;
  page: number;
  pageSize: number;
}

export interface AuditRow {
  id: number;
  at: Date;
  actorEmail: string | null;
  action: string;
  targetType: string | null;
  targetId: string | null;
  details: Record<string, unknown>;
  ip: string | null;
}

export async function listAudit(filter: AuditFilter): Promise<{ rows: AuditRow[]; total: number }> {
  const db = getDb();
  const conditions: SQL[] = [];
  if (filter.action) conditions.push(ilike(auditEvents.action, `${filter.action}%`));
  if (filter.actor) {
    const like = `%${filter.actor}%`;
    const actorMatch = or(ilike(auditEvents.actorEmail, like), eq(auditEvents.targetId, filter.actor));
    if (actorMatch) conditions.push(actorMatch);
  }
  if (filter.from) conditions.push(gte(auditEvents.at, filter.from));
  if (filter.to) conditions.push(lt(auditEvents.at, filter.to));
  const where = conditions.length ? and(...conditions) : undefined;
  const rows = await db
    .select()
    .from(auditEvents)
    .where(where)
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(filter.pageSize)
    .offset((filter.page - 1) * filter.pageSize);
  const [count] = await db.select({ n: sql<number>`count(*)::int` }).from(auditEvents).where(where);
  return { rows, total: count?.n ?? 0 };
}

export async function listAuditActions(): Promise<string[]> {
  const rows = await getDb()
    .selectDistinct({ action: auditEvents.action })
    .from(auditEvents)
    .orderBy(auditEvents.action);
  return rows.map((r) => r.action);
}
