import { describe, expect, it } from "vitest";
import { MCINTOSH_CLASSES } from "@/lib/domain/mcintosh";
import { DEMO_MODELS, DEMO_PROVENANCE } from "@/server/scoring/demo-models";
import { DEMO_MCINTOSH_RATES } from "@/server/scoring/demo-rate-table";
import { compileModel } from "@/server/scoring/models";
import { buildRegion } from "./region-fixture";

describe("demo models", () => {
  it("are the three active demo models, each labelled as invented", () => {
    expect(DEMO_MODELS.map((m) => [m.key, m.kind, m.version, m.active])).toEqual([
      ["mcintosh-poisson", "mcintosh-poisson", "demo-1", true],
      ["logistic-magnetic", "logistic", "demo-1", true],
      ["flare-history", "persistence", "demo-1", true],
    ]);
    for (const model of DEMO_MODELS)
      expect(model.provenance).toBe("demo — invented for the scenario; not a published table");
    expect(DEMO_PROVENANCE).toMatch(/^demo — invented/);
  });

  it("cover all 60 McIntosh classes with rates growing with complexity", () => {
    expect(Object.keys(DEMO_MCINTOSH_RATES).sort()).toEqual([...MCINTOSH_CLASSES].sort());
    for (const cls of MCINTOSH_CLASSES) {
      const r = DEMO_MCINTOSH_RATES[cls];
      expect(r.C, cls).toBeGreaterThan(r.M);
      expect(r.M, cls).toBeGreaterThan(r.X);
    }
    const m = (cls: keyof typeof DEMO_MCINTOSH_RATES) => DEMO_MCINTOSH_RATES[cls].M;
    expect(m("Axx")).toBeLessThan(m("Bxo"));
    expect(m("Dso")).toBeLessThan(m("Dsi"));
    expect(m("Dsi")).toBeLessThan(m("Dsc"));
    expect(m("Dkc")).toBeLessThan(m("Ekc"));
    expect(m("Ekc")).toBeLessThan(m("Fkc"));
    expect(m("Fkc")).toBe(Math.max(...MCINTOSH_CLASSES.map(m)));
  });

  it("give P(C+) ≈ 0.5 in 24 h for the documented typical region (logistic demo)", () => {
    const logistic = compileModel(DEMO_MODELS[1]!);
    const p = logistic.score(
      buildRegion({ unsignedFluxMx: 1e22, logR: 4, meanShearDeg: 40, pilLengthMm: 50 }),
    ).probabilities;
    // Linear predictor −25.05 + 22 + 2 + 0.8 + 0.25 = 0 → 0.5 (SciPy expit fixture, case 2).
    expect(p?.["C+"]["24h"]).toBeCloseTo(0.5, 9);
    expect(p?.["M+"]["24h"]).toBeCloseTo(0.1, 2);
    expect(p?.X["24h"]).toBeCloseTo(0.01, 3);
    // Negative case: a region with ten times less flux scores lower (positive flux coefficient).
    const quieter = logistic.score(
      buildRegion({ unsignedFluxMx: 1e21, logR: 4, meanShearDeg: 40, pilLengthMm: 50 }),
    );
    expect(quieter.probabilities?.["C+"]["24h"]).toBeLessThan(0.5);
    expect(quieter.probabilities?.["C+"]["24h"]).not.toBeCloseTo(0.5, 1);
  });

  it("respect the order rules for every class and a spread of magnetic inputs", () => {
    const compiled = DEMO_MODELS.map(compileModel);
    for (const cls of MCINTOSH_CLASSES) {
      for (const flux of [1e20, 1e21, 1e22, 1e23]) {
        for (const logR of [0, 3, 6]) {
          const region = buildRegion({
            mcintosh: cls,
            unsignedFluxMx: flux,
            logR,
            meanShearDeg: 60,
          });
          for (const model of compiled) {
            const result = model.score(region);
            expect(result.flags, `${model.key} ${cls} ${flux} ${logR}`).toEqual([]);
            expect(result.probabilities).not.toBeNull();
          }
        }
      }
    }
  });
});
