import { describe, expect, it } from "vitest";
import { decideCrossing, isAlertInForce, isAtOrAbove } from "@/server/dissemination/crossing";

// The rule is the product's own (documented in src/server/dissemination/crossing.ts); the
// probabilities are invented (demo — invented for the scenario).
const base = { threshold: 0.4, hasAlertInForce: false };

describe("decideCrossing", () => {
  it("alerts on the first bulletin when the probability is at or above the threshold", () => {
    expect(decideCrossing({ ...base, probability: 0.45, previousProbability: null })).toEqual({
      alert: true,
      reason: "first-bulletin",
    });
    expect(decideCrossing({ ...base, probability: 0.4, previousProbability: null })).toEqual({
      alert: true,
      reason: "first-bulletin",
    });
  });

  it("never alerts below the threshold, whatever came before", () => {
    expect(decideCrossing({ ...base, probability: 0.39, previousProbability: null })).toEqual({
      alert: false,
      reason: "below",
    });
    expect(
      decideCrossing({
        ...base,
        probability: 0.39,
        previousProbability: 0.8,
        hasAlertInForce: false,
      }),
    ).toEqual({ alert: false, reason: "below" });
    expect(decideCrossing({ ...base, probability: Number.NaN, previousProbability: null })).toEqual(
      { alert: false, reason: "below" },
    );
  });

  it("alerts when the probability rises across the threshold, even with an older alert in force", () => {
    expect(decideCrossing({ ...base, probability: 0.5, previousProbability: 0.3 })).toMatchObject({
      alert: true,
      reason: "rose-across",
    });
    expect(
      decideCrossing({
        ...base,
        probability: 0.5,
        previousProbability: 0.3,
        hasAlertInForce: true,
      }),
    ).toMatchObject({ alert: true, reason: "rose-across" });
  });

  it("does not repeat an alert while one is in force and the risk stayed above", () => {
    expect(
      decideCrossing({
        ...base,
        probability: 0.6,
        previousProbability: 0.5,
        hasAlertInForce: true,
      }),
    ).toEqual({ alert: false, reason: "still-above-in-force" });
    expect(
      decideCrossing({
        ...base,
        probability: 0.6,
        previousProbability: 0.5,
        hasAlertInForce: false,
      }),
    ).toEqual({ alert: true, reason: "still-above-new-window" });
  });

  it("treats 40 % entered as a percentage as equal to a 0.4 threshold despite float noise", () => {
    // 0.1 + 0.3 = 0.30000000000000004 and 0.7 - 0.3 = 0.39999999999999997 in IEEE 754 doubles.
    expect(isAtOrAbove(0.7 - 0.3, 0.4)).toBe(true);
    expect(isAtOrAbove(0.399, 0.4)).toBe(false);
  });
});

describe("isAlertInForce", () => {
  const issueTime = new Date("2026-05-04T00:30:00Z");
  it("holds until the window ends and not a moment after", () => {
    expect(isAlertInForce({ issueTime, windowHours: 24 }, new Date("2026-05-05T00:29:59Z"))).toBe(
      true,
    );
    expect(isAlertInForce({ issueTime, windowHours: 24 }, new Date("2026-05-05T00:30:00Z"))).toBe(
      false,
    );
    expect(isAlertInForce({ issueTime, windowHours: 72 }, new Date("2026-05-06T12:00:00Z"))).toBe(
      true,
    );
  });
});
