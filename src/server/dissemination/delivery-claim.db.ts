// Owns the outbox state changes of the delivery worker: leases, claims and recorded outcomes.
// While a row is 'sending', next_attempt_at holds its lease expiry and provider_id its batch marker.
import { and, asc, eq, inArray, lte, sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { outbox } from "@/db/schema";
import { DELIVERABLE_KINDS } from "./outbox.db";

/** Longer than any batch request should take; a crash leaves rows for at most this long. */
export const LEASE_MS = 5 * 60_000;

export type DueRow = Pick<
  typeof outbox.$inferSelect,
  | "id"
  | "kind"
  | "bulletinId"
  | "alertId"
  | "contactId"
  | "toEmail"
  | "subject"
  | "html"
  | "text"
  | "idempotencyKey"
  | "attempts"
  | "providerId"
  | "createdAt"
>;

const dueColumns = {
  id: outbox.id,
  kind: outbox.kind,
  bulletinId: outbox.bulletinId,
  alertId: outbox.alertId,
  contactId: outbox.contactId,
  toEmail: outbox.toEmail,
  subject: outbox.subject,
  html: outbox.html,
  text: outbox.text,
  idempotencyKey: outbox.idempotencyKey,
  attempts: outbox.attempts,
  providerId: outbox.providerId,
  createdAt: outbox.createdAt,
};

const isDeliverable = inArray(outbox.kind, [...DELIVERABLE_KINDS]);

/** Rows left 'sending' past their lease (a crash or restart) go back to the queue, marker kept. */
export async function releaseExpiredLeases(db: Db | Tx, now: Date): Promise<number> {
  const rows = await db
    .update(outbox)
    .set({ status: "queued" })
    .where(and(eq(outbox.status, "sending"), lte(outbox.nextAttemptAt, now), isDeliverable))
    .returning({ id: outbox.id });
  return rows.length;
}

/**
 * At start-up every 'sending' row was left by a process that is gone: the data directory lock
 * allows one process per directory, so none is still in flight and all go back to the queue.
 */
export async function releaseOrphanedLeases(db: Db | Tx): Promise<number> {
  const rows = await db
    .update(outbox)
    .set({ status: "queued" })
    .where(and(eq(outbox.status, "sending"), isDeliverable))
    .returning({ id: outbox.id });
  return rows.length;
}

/** Due rows, oldest first, plus every queued row sharing a batch marker with one of them. */
export async function selectDueRows(db: Db | Tx, now: Date, limit: number): Promise<DueRow[]> {
  const due = await db
    .select(dueColumns)
    .from(outbox)
    .where(and(eq(outbox.status, "queued"), lte(outbox.nextAttemptAt, now), isDeliverable))
    .orderBy(asc(outbox.nextAttemptAt), asc(outbox.id))
    .limit(limit);
  const markers = [
    ...new Set(due.map((r) => r.providerId).filter((m): m is string => !!m?.startsWith("batch:"))),
  ];
  if (markers.length === 0) return due;
  const siblings = await db
    .select(dueColumns)
    .from(outbox)
    .where(and(eq(outbox.status, "queued"), inArray(outbox.providerId, markers)));
  const byId = new Map(due.map((r) => [r.id, r]));
  for (const row of siblings) byId.set(row.id, row);
  return [...byId.values()];
}

/**
 * Claims planned batches in one statement: each row 'sending' under a lease, one more attempt,
 * and its batch marker written before anything is sent. Returns the ids actually claimed.
 */
export async function claimBatches(
  db: Db | Tx,
  batches: { marker: string; ids: number[] }[],
  now: Date,
): Promise<Set<number>> {
  const pairs = batches.flatMap((b) => b.ids.map((id) => sql`(${id}::integer, ${b.marker}::text)`));
  if (pairs.length === 0) return new Set();
  const lease = new Date(now.getTime() + LEASE_MS).toISOString();
  const result = await db.execute<{ id: number }>(sql`
    update ${outbox} set status = 'sending', attempts = ${outbox.attempts} + 1, next_attempt_at = ${lease}::timestamptz, provider_id = claimed.marker
    from (values ${sql.join(pairs, sql`, `)}) as claimed(id, marker)
    where ${outbox.id} = claimed.id and ${outbox.status} = 'queued'
    returning ${outbox.id} as id`);
  return new Set(result.rows.map((r) => Number(r.id)));
}

export async function claimBatch(
  db: Db | Tx,
  ids: number[],
  marker: string,
  now: Date,
): Promise<Set<number>> {
  return claimBatches(db, [{ marker, ids }], now);
}

export async function recordSent(
  db: Db | Tx,
  sent: { id: number; providerId: string }[],
  now: Date,
): Promise<void> {
  if (sent.length === 0) return;
  const values = sql.join(
    sent.map((s) => sql`(${s.id}::integer, ${s.providerId}::text)`),
    sql`, `,
  );
  await db.execute(sql`
    update ${outbox} set status = 'sent', sent_at = ${now.toISOString()}::timestamptz, last_error = null, provider_id = delivered.provider_id
    from (values ${values}) as delivered(id, provider_id)
    where ${outbox.id} = delivered.id`);
}

export async function recordRetry(
  db: Db | Tx,
  ids: number[],
  at: Date,
  error: string,
): Promise<void> {
  if (ids.length === 0) return;
  await db
    .update(outbox)
    .set({ status: "queued", nextAttemptAt: at, lastError: error })
    .where(and(inArray(outbox.id, ids), eq(outbox.status, "sending")));
}

/**
 * A refused batch was not accepted, so its marker is dropped and a manual retry may regroup it;
 * one given up after retryable failures keeps it (its last answer may have been lost).
 */
export async function recordFailed(
  db: Db | Tx,
  ids: number[],
  error: string,
  keepMarker: boolean,
): Promise<void> {
  if (ids.length === 0) return;
  await db
    .update(outbox)
    .set(
      keepMarker
        ? { status: "failed", lastError: error }
        : { status: "failed", lastError: error, providerId: null },
    )
    .where(inArray(outbox.id, ids));
}
