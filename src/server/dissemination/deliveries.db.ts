// Owns what the delivery page shows and does: progress counts per bulletin, the failures, and
// putting failed deliveries back in the queue (audited).
import { and, asc, desc, eq, gt, inArray, isNull, or, sql, type SQL } from "drizzle-orm";
import { getDb } from "@/db/client";
import { bulletins, contacts, outbox } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import type { RetryDeliveriesInput } from "@/lib/schemas/subscriptions";
import { recordAudit } from "@/server/audit/audit.db";
import { DELIVERABLE_KINDS } from "./outbox.db";

export interface StatusCounts {
  queued: number;
  sending: number;
  sent: number;
  failed: number;
  total: number;
}

export interface DeliveryRow {
  id: number;
  kind: string;
  toEmail: string;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: Date;
}

const deliverable = inArray(outbox.kind, [...DELIVERABLE_KINDS]);
const emptyCounts = (): StatusCounts => ({ queued: 0, sending: 0, sent: 0, failed: 0, total: 0 });

async function countByKind(where: SQL | undefined): Promise<Record<string, StatusCounts>> {
  const rows = await getDb()
    .select({ kind: outbox.kind, status: outbox.status, n: sql<number>`count(*)::int` })
    .from(outbox)
    .where(and(deliverable, where))
    .groupBy(outbox.kind, outbox.status);
  const out: Record<string, StatusCounts> = {};
  for (const r of rows) {
    const c = (out[r.kind] ??= emptyCounts());
    c[r.status] += r.n;
    c.total += r.n;
  }
  return out;
}

export function sumCounts(byKind: Record<string, StatusCounts>): StatusCounts {
  const total = emptyCounts();
  for (const c of Object.values(byKind))
    for (const k of Object.keys(total) as (keyof StatusCounts)[]) total[k] += c[k];
  return total;
}

const rowColumns = {
  id: outbox.id,
  kind: outbox.kind,
  toEmail: outbox.toEmail,
  attempts: outbox.attempts,
  lastError: outbox.lastError,
  nextAttemptAt: outbox.nextAttemptAt,
};

export async function getDeliveryProgress(bulletinId: number) {
  const db = getDb();
  const [bulletin] = await db
    .select({
      id: bulletins.id,
      forecastDay: bulletins.forecastDay,
      version: bulletins.version,
      status: bulletins.status,
      issueTime: bulletins.issueTime,
    })
    .from(bulletins)
    .where(eq(bulletins.id, bulletinId));
  const byKind = await countByKind(eq(outbox.bulletinId, bulletinId));
  const failures = await db
    .select(rowColumns)
    .from(outbox)
    .where(and(deliverable, eq(outbox.bulletinId, bulletinId), eq(outbox.status, "failed")))
    .orderBy(asc(outbox.id))
    .limit(200);
  const retrying = await db
    .select(rowColumns)
    .from(outbox)
    .where(
      and(
        deliverable,
        eq(outbox.bulletinId, bulletinId),
        eq(outbox.status, "queued"),
        gt(outbox.attempts, 0),
      ),
    )
    .orderBy(asc(outbox.nextAttemptAt))
    .limit(50);
  return { bulletin: bulletin ?? null, counts: sumCounts(byKind), byKind, failures, retrying };
}

export async function listDeliverySummaries(limit = 30) {
  const db = getDb();
  const recent = await db
    .select({
      id: bulletins.id,
      forecastDay: bulletins.forecastDay,
      version: bulletins.version,
      status: bulletins.status,
      issueTime: bulletins.issueTime,
    })
    .from(bulletins)
    .where(sql`exists (select 1 from ${outbox} where ${outbox.bulletinId} = ${bulletins.id})`)
    .orderBy(desc(bulletins.issueTime), desc(bulletins.id))
    .limit(limit);
  return Promise.all(
    recent.map(async (b) => ({
      ...b,
      counts: sumCounts(await countByKind(eq(outbox.bulletinId, b.id))),
    })),
  );
}

/** Failed deliveries back to the queue with a fresh backoff; never to a contact who unsubscribed. */
export async function retryFailedDeliveries(
  input: RetryDeliveriesInput,
  actor: CurrentUser,
  now: Date = new Date(),
): Promise<number> {
  const scope = input.ids
    ? inArray(outbox.id, input.ids)
    : eq(outbox.bulletinId, input.bulletinId as number);
  const stillSubscribed = or(
    isNull(outbox.contactId),
    sql`exists (select 1 from ${contacts} where ${contacts.id} = ${outbox.contactId} and ${contacts.unsubscribedAt} is null)`,
  );
  return getDb().transaction(async (tx) => {
    const rows = await tx
      .update(outbox)
      .set({ status: "queued", attempts: 0, nextAttemptAt: now, lastError: null })
      .where(and(deliverable, eq(outbox.status, "failed"), scope, stillSubscribed))
      .returning({ id: outbox.id });
    await recordAudit(
      {
        actor: { id: actor.id, email: actor.email },
        action: "delivery.retried",
        targetType: input.bulletinId ? "bulletin" : "outbox",
        targetId: input.bulletinId ?? input.ids?.join(","),
        details: { count: rows.length },
      },
      tx,
    );
    return rows.length;
  });
}
