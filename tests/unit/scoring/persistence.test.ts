import { describe, expect, it } from "vitest";
import {
  compilePersistence,
  estimatePersistenceRates,
  explainFlareCountError,
} from "@/server/scoring/persistence";
import type { PersistenceParams } from "@/server/scoring/model-params";
import { buildRegion } from "./region-fixture";

const PARAMS: PersistenceParams = {
  priorRatesPerDay: { C: 0.3, M: 0.03, X: 0.003 },
  priorWeight: 1,
};

describe("persistence rates λ = (count + prior·w)/(1 + w)", () => {
  it("shrinks the last day's counts towards the prior (hand-computed)", () => {
    const rates = estimatePersistenceRates({ C: 3, M: 1, X: 0 }, PARAMS);
    // (3 + 0.3)/2 = 1.65, (1 + 0.03)/2 = 0.515, (0 + 0.003)/2 = 0.0015.
    expect(rates.C).toBeCloseTo(1.65, 12);
    expect(rates.M).toBeCloseTo(0.515, 12);
    expect(rates.X).toBeCloseTo(0.0015, 12);
    expect(rates.M).not.toBeCloseTo(1, 2);
  });

  it("uses the counts alone with weight 0 and the prior alone as the weight grows", () => {
    expect(estimatePersistenceRates({ C: 3, M: 1, X: 0 }, { ...PARAMS, priorWeight: 0 })).toEqual({
      C: 3,
      M: 1,
      X: 0,
    });
    const heavy = estimatePersistenceRates({ C: 3, M: 1, X: 0 }, { ...PARAMS, priorWeight: 1000 });
    expect(heavy.C).toBeCloseTo(0.3, 2);
    expect(heavy.C).not.toBeCloseTo(3, 1);
  });
});

describe("compiled persistence model", () => {
  it("turns the rates into Poisson probabilities with added class rates", () => {
    const outcome = compilePersistence(PARAMS)(
      buildRegion({ flares24h: { C: 3, M: 1, X: 0 } }),
      {},
    );
    // λ_M+ = 0.515 + 0.0015 = 0.5165: 1 − e^−0.5165 = 0.4033950 (24 h), 1 − e^−1.033 = 0.6440625
    // (48 h); λ_C+ = 2.1665: 1 − e^−2.1665 = 0.8854221 (python3 math.exp; common mathematics).
    expect(outcome.probabilities?.["M+"]["24h"]).toBeCloseTo(0.403395, 6);
    expect(outcome.probabilities?.["M+"]["48h"]).toBeCloseTo(0.6440625, 7);
    expect(outcome.probabilities?.["C+"]["24h"]).toBeCloseTo(0.8854221, 7);
    expect(outcome.probabilities?.["M+"]["24h"]).not.toBeCloseTo(0.515, 2);
    expect(outcome.reason).toBeNull();
  });

  it("refuses counts that are not whole numbers ≥ 0", () => {
    const negative = compilePersistence(PARAMS)(
      buildRegion({ flares24h: { C: -1, M: 0, X: 0 } }),
      {},
    );
    expect(negative.probabilities).toBeNull();
    expect(negative.reason).toMatch(/flares24h.C must be a whole number/);
    expect(explainFlareCountError({ C: 0, M: 1.5, X: 0 })).toMatch(/flares24h.M/);
    expect(explainFlareCountError({ C: 0, M: 1, X: 0 })).toBeNull();
  });

  it("reports missing flare counts as a missing input", () => {
    const region = { ...buildRegion(), flares24h: null } as unknown as ReturnType<
      typeof buildRegion
    >;
    const outcome = compilePersistence(PARAMS)(region, {});
    expect(outcome.missingInputs).toEqual(["flares24h"]);
    expect(outcome.probabilities).toBeNull();
  });
});
