import { describe, expect, it } from "vitest";
import { DEMO_MODELS, DEMO_PROVENANCE } from "@/server/scoring/demo-models";
import { DEMO_MCINTOSH_RATES } from "@/server/scoring/demo-rate-table";
import {
  compileModel,
  ModelParamsError,
  scoreAssessment,
  type ModelDefinition,
} from "@/server/scoring/models";
import { buildRegion } from "./region-fixture";

function catchError(run: () => unknown): unknown {
  try {
    run();
  } catch (error) {
    return error;
  }
  return null;
}

function demoModel(key: string): ModelDefinition {
  const model = DEMO_MODELS.find((m) => m.key === key);
  if (!model) throw new Error(`no demo model ${key}`);
  return model;
}

describe("scoreAssessment", () => {
  it("returns the model's identity with its probabilities", () => {
    const result = scoreAssessment(demoModel("mcintosh-poisson"), buildRegion({ mcintosh: "Dkc" }));
    expect(result.key).toBe("mcintosh-poisson");
    expect(result.version).toBe("demo-1");
    expect(result.provenance).toBe(DEMO_PROVENANCE);
    expect(result.missingInputs).toEqual([]);
    expect(result.reason).toBeNull();
    // P(M+, 72 h) = 1 − exp(−f·(λ_M + λ_X)·3) with f = 0.8 (Poisson with corrected, added rates).
    const rates = DEMO_MCINTOSH_RATES.Dkc;
    expect(result.probabilities?.["M+"]["72h"]).toBeCloseTo(
      1 - Math.exp(-0.8 * (rates.M + rates.X) * 3),
      12,
    );
    expect(result.probabilities?.["M+"]["72h"]).not.toBeCloseTo(
      1 - Math.exp(-(rates.M + rates.X) * 3),
      3,
    );
  });

  it("gives the same result from a definition and from its compiled model", () => {
    const def = demoModel("logistic-magnetic");
    const region = buildRegion();
    expect(scoreAssessment(def, region)).toEqual(compileModel(def).score(region));
    expect(scoreAssessment(def, region)).toEqual(scoreAssessment(def, region));
  });

  it("reports a missing McIntosh class and explains an invalid one", () => {
    const missing = scoreAssessment(demoModel("mcintosh-poisson"), buildRegion({ mcintosh: null }));
    expect(missing.missingInputs).toEqual(["mcintosh"]);
    expect(missing.probabilities).toBeNull();
    const invalid = scoreAssessment(
      demoModel("mcintosh-poisson"),
      buildRegion({ mcintosh: "Drc" }),
    );
    expect(invalid.probabilities).toBeNull();
    expect(invalid.missingInputs).toEqual([]);
    expect(invalid.reason).toMatch(/^mcintosh: .*Drc is not valid/);
  });

  it("reports every missing magnetic input of the logistic model", () => {
    const region = buildRegion({ logR: null, pilLengthMm: undefined });
    const result = scoreAssessment(demoModel("logistic-magnetic"), region);
    expect(result.probabilities).toBeNull();
    expect(result.missingInputs).toEqual(["logR", "pilLengthMm"]);
  });

  it("takes B0 from the context for the limb check", () => {
    const region = buildRegion({ location: "N30W55" });
    const logistic = demoModel("logistic-magnetic");
    // B0 = 0: cos ρ = cos 30° cos 55° → ρ ≈ 60.2°, beyond 60°. B0 = +7°: cos ρ = sin 7° sin 30° +
    // cos 7° cos 30° cos 55° ≈ 0.5540 → ρ ≈ 56.4°, inside (spherical law of cosines).
    expect(scoreAssessment(logistic, region).flags[0]).toMatch(/^limb: N30W55 is 60°/);
    expect(scoreAssessment(logistic, region, { b0Deg: 7 }).flags).toEqual([]);
  });

  it("falls back to Zurich-class rates and says so", () => {
    const model = compileModel({
      ...demoModel("mcintosh-poisson"),
      params: {
        rates: { Axx: { C: 0.01, M: 0, X: 0 } },
        zurichRates: {
          B: { C: 0.1, M: 0, X: 0 },
          C: { C: 0.2, M: 0.01, X: 0 },
          D: { C: 0.5, M: 0.05, X: 0.005 },
          E: { C: 0.7, M: 0.1, X: 0.01 },
          F: { C: 1, M: 0.2, X: 0.02 },
          H: { C: 0.1, M: 0.01, X: 0 },
        },
        correctionFactor: 1,
      },
    } as ModelDefinition);
    const result = model.score(buildRegion({ mcintosh: "Dkc" }));
    expect(result.flags).toEqual(["fallback: no rates for Dkc; Zurich class D rates used"]);
    // λ_M+ = 0.055/day over 24 h: 1 − e^−0.055 = 0.0535149 (common mathematics).
    expect(result.probabilities?.["M+"]["24h"]).toBeCloseTo(0.0535149, 7);
    // Negative case: λ_M alone (X not added) would give 1 − e^−0.05 = 0.0487706.
    expect(result.probabilities?.["M+"]["24h"]).not.toBeCloseTo(0.0487706, 4);
    expect(model.score(buildRegion({ mcintosh: "Axx" })).flags).toEqual([]);
  });

  it("flags order breaks without altering the model's values", () => {
    const model = compileModel({
      key: "inverted",
      version: "test-1",
      kind: "logistic",
      name: "X above M+",
      provenance: "test",
      active: true,
      params: {
        windowHours: 24,
        levels: {
          "C+": { intercept: 1, predictors: [] },
          "M+": { intercept: -2, predictors: [] },
          X: { intercept: 0, predictors: [] },
        },
      },
    });
    const result = model.score(buildRegion());
    expect(result.flags).toContain("order: X > M+ at 24h (0.500 > 0.119)");
    // σ(0) = 0.5 kept as the model gave it.
    expect(result.probabilities?.X["24h"]).toBe(0.5);
  });

  it("refuses to compile invalid parameters, listing the fields", () => {
    const bad = {
      ...demoModel("flare-history"),
      params: { priorRatesPerDay: { C: -1, M: 0, X: 0 }, priorWeight: 1 },
    };
    const error = catchError(() => compileModel(bad as ModelDefinition));
    expect(error).toBeInstanceOf(ModelParamsError);
    expect((error as ModelParamsError).fieldErrors.map((e) => e.path)).toEqual([
      "priorRatesPerDay.C",
    ]);
    expect(() => compileModel(demoModel("flare-history"))).not.toThrow();
  });
});
