// Owns one delivery pass: resume expired leases, claim due messages in batches, send them through
// the provider with their idempotency keys, and record each outcome (sent, retry later, failed).
import { getDb, type Db } from "@/db/client";
import { requireAuthSecret } from "@/server/config";
import { getMailer } from "@/server/delivery/transactional";
import type { Mailer, SendResult } from "@/server/email/send";
import { planAfterFailure } from "./backoff";
import {
  DEFAULT_BATCH_BYTES,
  MAX_BATCH_MESSAGES,
  planBatches,
  type PlannedBatch,
} from "./batching";
import { composeMessage } from "./compose-message";
import {
  claimBatches,
  recordFailed,
  recordRetry,
  recordSent,
  releaseExpiredLeases,
  selectDueRows,
  type DueRow,
} from "./delivery-claim.db";
import type { MailMessage } from "@/server/email/send";

export interface DeliveryPassOptions {
  mailer?: Mailer;
  /** Messages looked at per pass; the worker runs the next pass at once while more are due. */
  maxMessages?: number;
  maxBatchBytes?: number;
  /** Batch requests in flight at once. */
  concurrency?: number;
}

export interface DeliveryPassResult {
  resumed: number;
  claimed: number;
  sent: number;
  retrying: number;
  failed: number;
  hasMore: boolean;
}

interface Item {
  id: number;
  bytes: number;
  batchMarker: string | null;
  row: DueRow;
  message: MailMessage;
}

function describeFailure(result: Extract<SendResult, { ok: false }>): string {
  return `${result.status ?? "no answer"}: ${result.message}`.slice(0, 500);
}

async function sendBatch(
  db: Db,
  mailer: Mailer,
  batch: PlannedBatch<Item>,
  now: Date,
  tally: DeliveryPassResult,
): Promise<void> {
  const results: SendResult[] = await mailer
    .sendBatch(batch.items.map((i) => i.message))
    .catch((err: unknown) =>
      batch.items.map(() => ({
        ok: false as const,
        status: null,
        retryable: true,
        message: String(err),
      })),
    );
  const sent: { id: number; providerId: string }[] = [];
  const retries = new Map<string, { at: Date; error: string; ids: number[] }>();
  const failed = { kept: [] as number[], dropped: [] as number[], error: "" };
  batch.items.forEach((item, index) => {
    const result = results[index] ?? {
      ok: false as const,
      status: null,
      retryable: true,
      message: "no result for this message",
    };
    if (result.ok) return void sent.push({ id: item.id, providerId: result.id });
    const attempts = item.row.attempts + 1;
    const step = planAfterFailure(attempts, result.retryable, now, result.retryAfterSeconds);
    if (step.next === "retry") {
      const key = String(step.at.getTime());
      const entry = retries.get(key) ?? { at: step.at, error: describeFailure(result), ids: [] };
      entry.ids.push(item.id);
      retries.set(key, entry);
    } else {
      failed.error = result.retryable
        ? `gave up after ${attempts} attempts: ${describeFailure(result)}`
        : describeFailure(result);
      (result.retryable ? failed.kept : failed.dropped).push(item.id);
    }
  });
  await recordSent(db, sent, now);
  for (const retry of retries.values()) await recordRetry(db, retry.ids, retry.at, retry.error);
  await recordFailed(db, failed.kept, failed.error, true);
  await recordFailed(db, failed.dropped, failed.error, false);
  tally.sent += sent.length;
  tally.retrying += [...retries.values()].reduce((n, r) => n + r.ids.length, 0);
  tally.failed += failed.kept.length + failed.dropped.length;
}

async function runPool<T>(
  items: T[],
  concurrency: number,
  work: (item: T) => Promise<void>,
): Promise<void> {
  let next = 0;
  const lanes = Array.from(
    { length: Math.max(1, Math.min(concurrency, items.length)) },
    async () => {
      while (next < items.length) await work(items[next++] as T);
    },
  );
  await Promise.all(lanes);
}

async function deliver(now: Date, options: DeliveryPassOptions): Promise<DeliveryPassResult> {
  const db = getDb();
  const mailer = options.mailer ?? getMailer();
  const secret = requireAuthSecret();
  const maxMessages = options.maxMessages ?? 1000;
  const tally: DeliveryPassResult = {
    resumed: await releaseExpiredLeases(db, now),
    claimed: 0,
    sent: 0,
    retrying: 0,
    failed: 0,
    hasMore: false,
  };
  const due = await selectDueRows(db, now, maxMessages);
  tally.hasMore = due.length >= maxMessages;
  const items: Item[] = [];
  for (const row of due) {
    const composed = await composeMessage(db, row, secret);
    if (!composed.ok) {
      await recordFailed(db, [row.id], composed.error, false);
      tally.failed += 1;
      continue;
    }
    const marker = row.providerId?.startsWith("batch:") ? row.providerId : null;
    items.push({
      id: row.id,
      bytes: composed.bytes,
      batchMarker: marker,
      row,
      message: composed.message,
    });
  }
  const planned = planBatches(
    items,
    MAX_BATCH_MESSAGES,
    options.maxBatchBytes ?? DEFAULT_BATCH_BYTES,
  );
  const ids = await claimBatches(
    db,
    planned.map((b) => ({ marker: b.marker, ids: b.items.map((i) => i.id) })),
    now,
  );
  const claimed = planned
    .map((b) => ({ marker: b.marker, items: b.items.filter((i) => ids.has(i.id)) }))
    .filter((b) => b.items.length > 0);
  tally.claimed = claimed.reduce((n, b) => n + b.items.length, 0);
  await runPool(claimed, options.concurrency ?? 3, (batch) =>
    sendBatch(db, mailer, batch, now, tally),
  );
  return tally;
}

// Passes never overlap in one process: a second caller waits for the pass in progress.
let lastPass: Promise<unknown> = Promise.resolve();

export function runDeliveryPass(
  now: Date = new Date(),
  options: DeliveryPassOptions = {},
): Promise<DeliveryPassResult> {
  const pass = lastPass.then(() => deliver(now, options));
  lastPass = pass.catch(() => undefined);
  return pass;
}
