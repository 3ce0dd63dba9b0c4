import { describe, expect, it } from "vitest";
import { MAX_ATTEMPTS, planAfterFailure, retryDelayMs } from "@/server/dissemination/backoff";

const NOW = new Date("2026-05-04T00:00:00Z");

describe("retryDelayMs", () => {
  it("doubles from 15 s after each failed attempt (exponential backoff, common practice)", () => {
    expect([1, 2, 3, 4, 5].map((a) => retryDelayMs(a))).toEqual([
      15_000, 30_000, 60_000, 120_000, 240_000,
    ]);
  });

  it("is capped at 30 minutes", () => {
    expect(retryDelayMs(8)).toBe(1_800_000); // 15 s × 2^7 = 1,920 s, above the cap
    expect(retryDelayMs(30)).toBe(1_800_000);
    expect(retryDelayMs(7)).toBe(960_000);
  });

  it("waits at least as long as a Retry-After in seconds asks (RFC 9110 §10.2.3)", () => {
    expect(retryDelayMs(1, 120)).toBe(120_000);
    expect(retryDelayMs(3, 1)).toBe(60_000);
  });
});

describe("planAfterFailure", () => {
  it("retries a transient failure at now + delay", () => {
    expect(planAfterFailure(2, true, NOW)).toEqual({
      next: "retry",
      at: new Date("2026-05-04T00:00:30Z"),
    });
  });

  it("gives up on a permanent failure at once and on a transient one after the last attempt", () => {
    expect(planAfterFailure(1, false, NOW)).toEqual({ next: "give-up" });
    expect(planAfterFailure(MAX_ATTEMPTS, true, NOW)).toEqual({ next: "give-up" });
    expect(planAfterFailure(MAX_ATTEMPTS - 1, true, NOW).next).toBe("retry");
  });
});
