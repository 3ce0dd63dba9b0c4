import { describe, expect, it } from "vitest";
import {
  buildPoissonGrid,
  convertWindow,
  cumulativeLevelRates,
  probabilityOfAtLeastOne,
  rateFromProbability,
} from "@/server/scoring/poisson";
import reference from "./fixtures/reference-values.json";

describe("P(at least one) = 1 − exp(−λT) (Gallagher et al. 2002; Bloomfield et al. 2012)", () => {
  it("gives 0.3934693 for λ = 0.5/day over 24 h (1 − e^−0.5; common mathematics)", () => {
    expect(probabilityOfAtLeastOne(0.5, 1)).toBeCloseTo(0.3934693, 7);
    // Negative case: not the linear approximation λT = 0.5.
    expect(probabilityOfAtLeastOne(0.5, 1)).not.toBeCloseTo(0.5, 2);
  });

  it("matches scipy.stats.poisson.sf(0, λT)", () => {
    // Source: tests/unit/scoring/fixtures/make-reference-values.py (SciPy).
    for (const c of reference.poisson) {
      expect(probabilityOfAtLeastOne(c.ratePerDay, c.days), JSON.stringify(c)).toBeCloseTo(c.p, 12);
    }
    expect(reference.poisson.length).toBeGreaterThan(10);
  });

  it("keeps precision for tiny rates (1e-6/day → 9.999995e-7, SciPy fixture)", () => {
    const tiny = reference.poisson.find((c) => c.ratePerDay === 1e-6 && c.days === 1);
    expect(tiny).toBeDefined();
    expect(Math.abs(probabilityOfAtLeastOne(1e-6, 1) - tiny!.p) / tiny!.p).toBeLessThan(1e-12);
  });

  it("refuses negative or non-finite rates and windows", () => {
    expect(() => probabilityOfAtLeastOne(-0.1, 1)).toThrow(RangeError);
    expect(() => probabilityOfAtLeastOne(Number.NaN, 1)).toThrow(RangeError);
    expect(() => probabilityOfAtLeastOne(0.1, -1)).toThrow(RangeError);
  });
});

describe("rateFromProbability", () => {
  it("inverts the Poisson probability: λ = −ln(1 − p)/T", () => {
    // −ln(1 − 0.3934693402873666) = 0.5 (common mathematics).
    expect(rateFromProbability(0.3934693402873666, 1)).toBeCloseTo(0.5, 12);
    expect(rateFromProbability(0.6321205588285577, 2)).toBeCloseTo(0.5, 12);
    expect(rateFromProbability(0.3934693402873666, 1)).not.toBeCloseTo(0.3934693, 3);
  });

  it("is null for p = 1 and refuses probabilities outside [0, 1]", () => {
    expect(rateFromProbability(1, 1)).toBeNull();
    expect(rateFromProbability(0, 1)).toBe(0);
    expect(() => rateFromProbability(1.2, 1)).toThrow(RangeError);
    expect(() => rateFromProbability(0.5, 0)).toThrow(RangeError);
  });
});

describe("convertWindow: P_T = 1 − (1 − P24)^(T/24)", () => {
  it("turns 0.3 at 24 h into 0.51 at 48 h and 0.657 at 72 h (1 − 0.7², 1 − 0.7³; common mathematics)", () => {
    expect(convertWindow(0.3, 48)).toBeCloseTo(0.51, 12);
    expect(convertWindow(0.3, 72)).toBeCloseTo(0.657, 12);
    expect(convertWindow(0.3, 24)).toBeCloseTo(0.3, 12);
    // Negative case: not simple scaling 2 × 0.3.
    expect(convertWindow(0.3, 48)).not.toBeCloseTo(0.6, 2);
  });

  it("matches SciPy's Poisson survival function at the converted rate", () => {
    // Source: tests/unit/scoring/fixtures/make-reference-values.py (SciPy).
    for (const c of reference.windowConversion) {
      expect(convertWindow(c.p, c.toHours, c.fromHours), JSON.stringify(c)).toBeCloseTo(
        c.expected,
        12,
      );
    }
  });

  it("keeps certainty certain and refuses invalid probabilities", () => {
    expect(convertWindow(1, 72)).toBe(1);
    expect(convertWindow(0, 72)).toBe(0);
    expect(() => convertWindow(-0.1, 48)).toThrow(RangeError);
    expect(() => convertWindow(0.2, 48, 0)).toThrow(RangeError);
  });
});

describe("level rates", () => {
  it("adds exclusive class rates: λ_C+ = λ_C + λ_M + λ_X, λ_M+ = λ_M + λ_X (Bloomfield et al. 2012)", () => {
    const levels = cumulativeLevelRates({ C: 1, M: 0.2, X: 0.05 });
    expect(levels["C+"]).toBeCloseTo(1.25, 12);
    expect(levels["M+"]).toBeCloseTo(0.25, 12);
    expect(levels.X).toBeCloseTo(0.05, 12);
    expect(levels["M+"]).not.toBeCloseTo(0.2, 3);
  });

  it("scales every rate by the table's correction factor (McCloskey et al. 2018)", () => {
    const levels = cumulativeLevelRates({ C: 1, M: 0.2, X: 0.05 }, 0.8);
    expect(levels["C+"]).toBeCloseTo(1.0, 12);
    expect(levels["M+"]).toBeCloseTo(0.2, 12);
    expect(levels.X).toBeCloseTo(0.04, 12);
    expect(() => cumulativeLevelRates({ C: 1, M: -0.2, X: 0 })).toThrow(RangeError);
  });

  it("makes P(M+) the probability of an M or an X flare from independent processes", () => {
    // 1 − exp(−(λ_M + λ_X)) = 1 − (1 − P_M)(1 − P_X): exp(−a − b) = exp(−a)·exp(−b).
    const grid = buildPoissonGrid(cumulativeLevelRates({ C: 0.9, M: 0.3, X: 0.1 }));
    const pM = probabilityOfAtLeastOne(0.3, 1);
    const pX = probabilityOfAtLeastOne(0.1, 1);
    expect(grid["M+"]["24h"]).toBeCloseTo(1 - (1 - pM) * (1 - pX), 12);
    expect(grid["M+"]["24h"]).not.toBeCloseTo(pM + pX, 3);
    // λ_C+ = 1.3/day over 3 days: 1 − e^−3.9 = 0.9797581 (common mathematics).
    expect(grid["C+"]["72h"]).toBeCloseTo(0.9797581, 7);
  });
});
