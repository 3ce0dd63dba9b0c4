import { describe, expect, it } from "vitest";
import {
  fingerprintContent,
  fromStoredContent,
  toStoredContent,
} from "@/server/bulletins/content-json";
import { issued } from "./bulletin-fixture";

describe("stored content", () => {
  it("round-trips through JSON with the issue time as ISO text", () => {
    const b = issued();
    const stored = toStoredContent(b);
    expect(stored.issueTime).toBe("2031-05-06T00:30:00.000Z");
    expect(fromStoredContent(JSON.parse(JSON.stringify(stored)))).toEqual(b);
  });

  it("refuses damaged content instead of showing it", () => {
    const stored = toStoredContent(issued()) as unknown as Record<string, unknown>;
    expect(() => fromStoredContent({ ...stored, fullDisk: { "C+": {} } })).toThrow(/not readable/);
    expect(() => fromStoredContent(null)).toThrow(/not readable/);
    expect(() => fromStoredContent({ ...stored, issueTime: "yesterday" })).toThrow(/not readable/);
  });
});

describe("fingerprintContent", () => {
  it("is a SHA-256 hex digest that ignores key order, the id and the issue time", () => {
    const b = issued();
    // jsonb hands keys back in its own order; rebuild every object with its keys reversed.
    const reverseKeys = (v: unknown): unknown =>
      Array.isArray(v)
        ? v.map(reverseKeys)
        : v && typeof v === "object"
          ? Object.fromEntries(
              Object.entries(v)
                .reverse()
                .map(([k, x]) => [k, reverseKeys(x)]),
            )
          : v;
    const reordered = { ...(reverseKeys(b) as typeof b), issueTime: b.issueTime };
    expect(Object.keys(reordered.fullDisk)).toEqual(["X", "M+", "C+"]);
    expect(fingerprintContent(b)).toMatch(/^[0-9a-f]{64}$/);
    expect(fingerprintContent(reordered)).toBe(fingerprintContent(b));
    expect(
      fingerprintContent(issued({ id: 99, issueTime: new Date("2031-05-07T00:00:00Z") })),
    ).toBe(fingerprintContent(b));
  });

  it("changes when anything a reader sees changes", () => {
    const b = issued();
    const fullDisk = structuredClone(b.fullDisk);
    fullDisk.X["24h"] = 0.05;
    expect(fingerprintContent(issued({ fullDisk }))).not.toBe(fingerprintContent(b));
    expect(fingerprintContent(issued({ discussion: "Changed." }))).not.toBe(fingerprintContent(b));
    expect(fingerprintContent(issued({ version: 2 }))).not.toBe(fingerprintContent(b));
  });
});
