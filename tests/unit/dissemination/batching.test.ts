import { describe, expect, it } from "vitest";
import { markBatch, planBatches, type Batchable } from "@/server/dissemination/batching";

const items = (n: number, bytes = 1000, from = 1): Batchable[] =>
  Array.from({ length: n }, (_, i) => ({ id: from + i, bytes, batchMarker: null }));

describe("planBatches", () => {
  it("never puts more than 100 messages in a batch (Resend's batch limit)", () => {
    const batches = planBatches(items(250));
    expect(batches.map((b) => b.items.length)).toEqual([100, 100, 50]);
    expect(batches.flatMap((b) => b.items.map((i) => i.id))).toEqual(items(250).map((i) => i.id));
  });

  it("starts a new batch before the byte budget would be exceeded", () => {
    const batches = planBatches(items(10, 300), 100, 1000);
    expect(batches.map((b) => b.items.length)).toEqual([3, 3, 3, 1]);
    for (const b of batches)
      expect(b.items.reduce((n, i) => n + i.bytes, 0)).toBeLessThanOrEqual(1000);
  });

  it("sends one oversized message on its own rather than never", () => {
    const batches = planBatches(
      [{ id: 1, bytes: 5000, batchMarker: null }, ...items(2, 100, 2)],
      100,
      1000,
    );
    expect(batches.map((b) => b.items.map((i) => i.id))).toEqual([[1], [2, 3]]);
  });

  it("keeps a batch attempted before exactly together, whatever else is due", () => {
    const marker = markBatch([5, 9]);
    const due: Batchable[] = [
      ...items(3),
      { id: 9, bytes: 10, batchMarker: marker },
      { id: 5, bytes: 10, batchMarker: marker },
    ];
    const batches = planBatches(due, 2, 1_000_000);
    expect(batches[0]).toEqual({
      marker,
      items: [
        { id: 5, bytes: 10, batchMarker: marker },
        { id: 9, bytes: 10, batchMarker: marker },
      ],
    });
    expect(batches.slice(1).map((b) => b.items.map((i) => i.id))).toEqual([[1, 2], [3]]);
  });

  it("names a batch by its members, so the same members give the same marker", () => {
    expect(markBatch([1, 2, 3])).toBe(markBatch([1, 2, 3]));
    expect(markBatch([1, 2, 3])).not.toBe(markBatch([1, 2, 4]));
    expect(planBatches(items(3))[0]?.marker).toBe(markBatch([1, 2, 3]));
  });
});
