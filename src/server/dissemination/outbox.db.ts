// Owns writing the delivery outbox: its kinds, idempotency keys and chunked inserts. A key is
// unique, so queueing the same message twice writes it once.
import { and, eq, inArray, sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { contacts, outbox } from "@/db/schema";
import type { RenderedEmail } from "@/server/email/render";

export const DELIVERABLE_KINDS = [
  "bulletin",
  "alert",
  "alert-reminder",
  "alert-escalation",
] as const;
export type DeliverableKind = (typeof DELIVERABLE_KINDS)[number];

/**
 * The bulletin body is stored once per bulletin (kind "bulletin-body", never sent) and each
 * bulletin row stays empty; the worker merges the recipient's unsubscribe link at send time.
 * Ten thousand copies of a 30 KB page would make the issuing transaction far too slow.
 */
export const BULLETIN_BODY_KIND = "bulletin-body";

export const outboxKeys = {
  bulletinBody: (bulletinId: number) => `bulletin-body:${bulletinId}`,
  bulletin: (bulletinId: number, contactId: number) =>
    `bulletin:${bulletinId}:contact:${contactId}`,
  alert: (alertId: number) => `alert:${alertId}`,
  reminder: (alertId: number) => `alert-reminder:${alertId}`,
  escalation: (alertId: number, userId: number) => `alert-escalation:${alertId}:user:${userId}`,
};

export type OutboxInsert = typeof outbox.$inferInsert;

// 1,000 rows × 12 columns stays far below PostgreSQL's 65,535 bind parameters per statement.
const CHUNK = 1000;

/** Inserts rows, skipping keys already queued; returns how many were new. */
export async function insertOutboxRows(tx: Db | Tx, rows: OutboxInsert[]): Promise<number> {
  let inserted = 0;
  for (let start = 0; start < rows.length; start += CHUNK) {
    const written = await tx
      .insert(outbox)
      .values(rows.slice(start, start + CHUNK))
      .onConflictDoNothing({ target: outbox.idempotencyKey })
      .returning({ id: outbox.id });
    inserted += written.length;
  }
  return inserted;
}

export async function insertBulletinBody(
  tx: Db | Tx,
  bulletinId: number,
  body: RenderedEmail,
  at: Date,
): Promise<void> {
  await insertOutboxRows(tx, [
    {
      kind: BULLETIN_BODY_KIND,
      bulletinId,
      toEmail: "",
      ...body,
      idempotencyKey: outboxKeys.bulletinBody(bulletinId),
      createdAt: at,
      nextAttemptAt: at,
    },
  ]);
}

export async function findBulletinBody(
  tx: Db | Tx,
  bulletinId: number,
): Promise<RenderedEmail | null> {
  const [row] = await tx
    .select({ subject: outbox.subject, html: outbox.html, text: outbox.text })
    .from(outbox)
    .where(eq(outbox.idempotencyKey, outboxKeys.bulletinBody(bulletinId)));
  return row ?? null;
}

/**
 * One bulletin row per subscribed contact who wants bulletins, written by a single INSERT … SELECT:
 * ten thousand rows bound one by one would keep the issuing transaction open for seconds.
 */
export async function insertBulletinDeliveries(
  tx: Db | Tx,
  bulletinId: number,
  subject: string,
  at: Date,
): Promise<number> {
  const stamp = sql`${at.toISOString()}::timestamptz`;
  const result = await tx.execute<{ id: number }>(sql`
    insert into ${outbox} (kind, bulletin_id, contact_id, to_email, subject, html, text, idempotency_key, created_at, next_attempt_at)
    select 'bulletin', ${bulletinId}::integer, ${contacts.id}, ${contacts.email}, ${subject}, '', '',
           'bulletin:' || ${bulletinId}::integer || ':contact:' || ${contacts.id}, ${stamp}, ${stamp}
    from ${contacts}
    where ${contacts.unsubscribedAt} is null and ${contacts.wantsBulletins}
    order by ${contacts.id}
    on conflict (idempotency_key) do nothing
    returning id`);
  return result.rows.length;
}

/**
 * For withdrawing a bulletin inside its transaction: its e-mails not yet handed to the provider
 * (bulletin, alerts, reminders) are marked failed with the reason; returns how many.
 */
export async function cancelQueuedDeliveries(
  tx: Db | Tx,
  bulletinId: number,
  reason: string,
): Promise<number> {
  const rows = await tx
    .update(outbox)
    .set({ status: "failed", lastError: `cancelled: ${reason}`.slice(0, 500) })
    .where(
      and(
        eq(outbox.bulletinId, bulletinId),
        eq(outbox.status, "queued"),
        inArray(outbox.kind, [...DELIVERABLE_KINDS]),
      ),
    )
    .returning({ id: outbox.id });
  return rows.length;
}
