// Owns cutting due messages into provider batches: at most 100 messages (Resend's batch limit)
// and a byte budget per request, keeping any batch already attempted exactly as it was.
import { createHash } from "node:crypto";

export const MAX_BATCH_MESSAGES = 100;
/** The local fake refuses request bodies over 1 MiB; 900 KiB leaves room for the envelope. */
export const DEFAULT_BATCH_BYTES = 900 * 1024;

export interface Batchable {
  id: number;
  bytes: number;
  /** Set once a batch was attempted: the provider's idempotency key covers that exact batch. */
  batchMarker: string | null;
}

export interface PlannedBatch<T extends Batchable> {
  marker: string;
  items: T[];
}

/** Names a batch by its members, so a retried batch is recognised by the same marker. */
export function markBatch(ids: readonly number[]): string {
  return `batch:${createHash("sha256").update(ids.join(",")).digest("hex")}`;
}

/**
 * A batch attempted before is resent with the same members in the same order: the provider
 * dedupes a batch by one key derived from all its messages' keys, so a regrouped retry of an
 * accepted batch (e.g. after a crash before the result was written) would deliver twice.
 */
export function planBatches<T extends Batchable>(
  items: readonly T[],
  maxMessages = MAX_BATCH_MESSAGES,
  maxBytes = DEFAULT_BATCH_BYTES,
): PlannedBatch<T>[] {
  const sorted = [...items].sort((a, b) => a.id - b.id);
  const kept = new Map<string, T[]>();
  const fresh: T[] = [];
  for (const item of sorted) {
    if (item.batchMarker) kept.set(item.batchMarker, [...(kept.get(item.batchMarker) ?? []), item]);
    else fresh.push(item);
  }
  const batches: PlannedBatch<T>[] = [...kept].map(([marker, members]) => ({
    marker,
    items: members,
  }));
  let current: T[] = [];
  let bytes = 0;
  const close = () => {
    if (current.length)
      batches.push({ marker: markBatch(current.map((i) => i.id)), items: current });
    current = [];
    bytes = 0;
  };
  for (const item of fresh) {
    if (current.length >= maxMessages || (current.length > 0 && bytes + item.bytes > maxBytes))
      close();
    current.push(item);
    bytes += item.bytes;
  }
  close();
  return batches;
}
