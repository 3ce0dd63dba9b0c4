import { describe, expect, it } from "vitest";
import { PREDICTOR_INPUTS, type PredictorInput } from "@/lib/domain/assessment-input";
import { compileLogistic, evaluateLinearPredictor, sigmoid } from "@/server/scoring/logistic";
import type { LogisticLevelParams, LogisticParams } from "@/server/scoring/model-params";
import type { TransformName } from "@/server/scoring/transforms";
import reference from "./fixtures/reference-values.json";
import { buildRegion } from "./region-fixture";

function levelOn(
  input: PredictorInput,
  intercept: number,
  coefficient: number,
): LogisticLevelParams {
  return { intercept, predictors: [{ input, transform: "identity", coefficient }] };
}

function paramsOn(input: PredictorInput, windowHours = 24): LogisticParams {
  return {
    windowHours,
    levels: {
      "C+": levelOn(input, -1, 0.1),
      "M+": levelOn(input, -2, 0.1),
      X: levelOn(input, -3, 0.1),
    },
  };
}

describe("sigmoid", () => {
  it("gives 1/(1 + e) = 0.2689414 for β₀ = −2, β₁ = 0.5, x = 2 (common mathematics)", () => {
    expect(sigmoid(-2 + 0.5 * 2)).toBeCloseTo(0.2689414, 7);
    expect(sigmoid(0)).toBe(0.5);
    expect(sigmoid(-1)).not.toBeCloseTo(0.5, 2);
  });

  it("stays finite and symmetric far out: σ(−z) = 1 − σ(z)", () => {
    expect(sigmoid(1000)).toBe(1);
    expect(sigmoid(-1000)).toBe(0);
    expect(Number.isNaN(sigmoid(-1000))).toBe(false);
    expect(sigmoid(-3.2)).toBeCloseTo(1 - sigmoid(3.2), 15);
  });
});

describe("evaluateLinearPredictor with declared transforms", () => {
  it("matches scipy.special.expit of β₀ + Σβᵢ·f(xᵢ)", () => {
    // Source: tests/unit/scoring/fixtures/make-reference-values.py (SciPy expit, NumPy transforms).
    for (const c of reference.logistic) {
      const values: Partial<Record<PredictorInput, number>> = {};
      const predictors = c.predictors.map((p, i) => {
        const input = PREDICTOR_INPUTS[i] as PredictorInput;
        values[input] = p.value;
        return { input, transform: p.transform as TransformName, coefficient: p.coefficient };
      });
      const z = evaluateLinearPredictor({ intercept: c.intercept, predictors }, values);
      expect(z.ok, JSON.stringify(c)).toBe(true);
      if (z.ok) expect(sigmoid(z.value), JSON.stringify(c)).toBeCloseTo(c.p, 12);
    }
  });

  it("refuses a value outside a transform's domain instead of returning NaN", () => {
    const level: LogisticLevelParams = {
      intercept: 0,
      predictors: [{ input: "unsignedFluxMx", transform: "log10", coefficient: 1 }],
    };
    const z = evaluateLinearPredictor(level, { unsignedFluxMx: 0 });
    expect(z).toEqual({ ok: false, reason: expect.stringMatching(/outside the domain of log10/) });
    expect(evaluateLinearPredictor(level, { unsignedFluxMx: 100 })).toEqual({ ok: true, value: 2 });
  });
});

describe("compiled logistic model", () => {
  it("lists every missing input and gives no probabilities", () => {
    const params: LogisticParams = {
      windowHours: 24,
      levels: {
        "C+": levelOn("logR", 0, 1),
        "M+": levelOn("meanShearDeg", 0, 1),
        X: levelOn("logR", 0, 1),
      },
    };
    const outcome = compileLogistic(params)(
      buildRegion({ logR: null, meanShearDeg: undefined }),
      {},
    );
    expect(outcome.probabilities).toBeNull();
    expect(outcome.missingInputs).toEqual(["logR", "meanShearDeg"]);
    expect(outcome.reason).toMatch(/missing inputs: logR, meanShearDeg/);
    const complete = compileLogistic(params)(buildRegion({ logR: 1, meanShearDeg: 2 }), {});
    expect(complete.missingInputs).toEqual([]);
    expect(complete.probabilities).not.toBeNull();
  });

  it("gives 24 h from the fitted window and 48/72 h by Poisson conversion", () => {
    const region = buildRegion({ logR: 10 });
    const daily = compileLogistic(paramsOn("logR"))(region, {}).probabilities;
    // C+: σ(−1 + 0.1·10) = σ(0) = 0.5; 48 h: 1 − 0.5² = 0.75; 72 h: 1 − 0.5³ = 0.875.
    expect(daily?.["C+"]).toEqual({ "24h": 0.5, "48h": 0.75, "72h": 0.875 });
    const halfDay = compileLogistic(paramsOn("logR", 12))(region, {}).probabilities;
    // Fitted for 12 h: 24 h = 1 − 0.5² = 0.75 (Poisson window conversion).
    expect(halfDay?.["C+"]["24h"]).toBeCloseTo(0.75, 12);
    expect(halfDay?.["C+"]["24h"]).not.toBeCloseTo(0.5, 3);
  });

  it("refuses inputs that break a hard limit", () => {
    const outcome = compileLogistic(paramsOn("meanShearDeg"))(
      buildRegion({ meanShearDeg: 120 }),
      {},
    );
    expect(outcome.probabilities).toBeNull();
    expect(outcome.reason).toMatch(/meanShearDeg: .*cannot exceed 90/);
  });

  it("flags magnetic metrics of regions beyond 60° from disk centre", () => {
    const score = compileLogistic(paramsOn("logR"));
    expect(score(buildRegion({ location: "N10W70" }), {}).flags[0]).toMatch(/^limb: N10W70 is 70°/);
    expect(score(buildRegion({ location: "N10W20" }), {}).flags).toEqual([]);
    expect(score(buildRegion({ location: "Q10W20" }), {}).flags[0]).toMatch(
      /^location: .*limb check skipped/,
    );
    // Area is not a magnetic metric: no limb flag.
    expect(
      compileLogistic(paramsOn("areaMsh"))(buildRegion({ location: "N10W70" }), {}).flags,
    ).toEqual([]);
  });

  it("reads the delta indicator from the Mount Wilson class", () => {
    const score = compileLogistic(paramsOn("deltaIndicator"));
    const delta = score(buildRegion({ mountWilson: "beta-gamma-delta" }), {}).probabilities;
    const plain = score(buildRegion({ mountWilson: "beta" }), {}).probabilities;
    // C+: σ(−1 + 0.1) = 0.2890505 with delta, σ(−1) = 0.2689414 without (common mathematics).
    expect(delta?.["C+"]["24h"]).toBeCloseTo(0.2890505, 7);
    expect(plain?.["C+"]["24h"]).toBeCloseTo(0.2689414, 7);
    expect(score(buildRegion({ mountWilson: null }), {}).missingInputs).toEqual(["deltaIndicator"]);
  });
});
