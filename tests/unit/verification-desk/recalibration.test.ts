import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import type { AssessmentInput } from "@/lib/domain/assessment-input";
import { MCINTOSH_CLASSES } from "@/lib/domain/mcintosh";
import { splitAtLastYear } from "@/server/verification-desk/holdout";
import { fitLogisticCandidate } from "@/server/verification-desk/logistic-candidate";
import { fitPoissonCandidate } from "@/server/verification-desk/poisson-candidate";
import { countRegionDayFlares, labelRegionDays } from "@/server/verification-desk/region-days";
import { parseModelParams, type LogisticParams } from "@/server/scoring/model-params";
import { compileModel } from "@/server/scoring/models";

const HOUR = 3_600_000;
const D = Date.parse("2031-03-10T00:00:00Z");

describe("the archive rule: flares from the region peaking in [D 00:00, D + 24 h)", () => {
  const days = [
    { region: "HR-0001", day: "2031-03-10" },
    { region: "HR-0001", day: "2031-03-11" },
    { region: "HR-0002", day: "2031-03-10" },
  ];
  const events = [
    { peakTimeMs: D, peakFluxTrue: 3e-6, regionNumber: "HR-0001" }, // C3 at 00:00 of day 10: day 10
    { peakTimeMs: D + 23 * HOUR, peakFluxTrue: 2e-5, regionNumber: "hr-0001" }, // M2 late on day 10
    { peakTimeMs: D + 24 * HOUR, peakFluxTrue: 1.5e-4, regionNumber: "HR-0001" }, // X1.5 at 00:00 of day 11: day 11 only
    { peakTimeMs: D + HOUR, peakFluxTrue: 5e-5, regionNumber: null }, // no region: no region-day
    { peakTimeMs: D + 2 * HOUR, peakFluxTrue: 5e-7, regionNumber: "HR-0002" }, // B5: below C, not counted
  ];

  it("counts flares per exclusive class for the right day and region only", () => {
    expect(countRegionDayFlares(days, events)).toEqual([
      { C: 1, M: 1, X: 0 },
      { C: 0, M: 0, X: 1 },
      { C: 0, M: 0, X: 0 },
    ]);
  });

  it("labels events per level from the same rule", () => {
    const o = labelRegionDays(days, events);
    expect([...o["C+"]]).toEqual([1, 1, 0]);
    expect([...o["M+"]]).toEqual([1, 1, 0]);
    expect([...o.X]).toEqual([0, 1, 0]);
    // With a 48 h window day 10 also sees day 11's X flare.
    expect([...labelRegionDays(days, events, 48).X]).toEqual([1, 1, 0]);
  });
});

describe("McIntosh–Poisson candidate", () => {
  // 30 Dkc region-days with 6 C, 3 M and 0 X flares → λ = 0.2, 0.1, 0 per day (λ̂ = n/N, common
  // practice); 2 Bxo region-days (below the minimum of 20) take the B Zurich pool: Bxo + Bxi.
  const days = [
    ...Array.from({ length: 30 }, (_, i) => ({
      mcintosh: "Dkc",
      counts: { C: i < 6 ? 1 : 0, M: i < 3 ? 1 : 0, X: 0 },
    })),
    ...Array.from({ length: 2 }, () => ({ mcintosh: "Bxo", counts: { C: 1, M: 0, X: 0 } })),
    ...Array.from({ length: 8 }, () => ({ mcintosh: "Bxi", counts: { C: 0, M: 0, X: 0 } })),
    { mcintosh: null, counts: { C: 5, M: 5, X: 5 } },
  ];
  const candidate = fitPoissonCandidate(days);

  it("fits rates per class and pools thin classes to their Zurich class", () => {
    expect(candidate.params.rates.Dkc).toEqual({ C: 0.2, M: 0.1, X: 0 });
    expect(candidate.params.rates.Bxo).toBeUndefined();
    expect(candidate.params.zurichRates?.B).toEqual({ C: 0.2, M: 0, X: 0 });
    expect(candidate.table.pooledClasses).toEqual(["Bxo", "Bxi"]);
    expect(candidate.skipped).toBe(1);
    expect(candidate.regionDays).toBe(40);
  });

  it("covers all 60 classes, so the registry accepts and the scorer uses the table", () => {
    expect(candidate.zurichFromArchive).toEqual(["A", "C", "E", "F", "H"]);
    const parsed = parseModelParams("mcintosh-poisson", candidate.params);
    expect(parsed.ok).toBe(true);
    const model = compileModel({
      key: "k",
      version: "v",
      kind: "mcintosh-poisson",
      name: "n",
      provenance: "p",
      params: candidate.params,
      active: false,
    });
    const input = (mcintosh: string): AssessmentInput => ({
      region: "HR-1",
      location: "N10E10",
      areaMsh: 100,
      spotCount: 5,
      mcintosh,
      mountWilson: "beta",
      flares24h: { C: 0, M: 0, X: 0 },
    });
    // P(M+ in 24 h) = 1 − exp(−(λ_M + λ_X)) = 1 − e^−0.1 (Gallagher et al. 2002).
    expect(model.score(input("Dkc")).probabilities?.["M+"]["24h"]).toBeCloseTo(
      1 - Math.exp(-0.1),
      12,
    );
    for (const cls of MCINTOSH_CLASSES)
      expect(model.score(input(cls)).probabilities).not.toBeNull();
  });

  it("refuses an archive without any valid McIntosh class", () => {
    expect(() => fitPoissonCandidate([{ mcintosh: "Zzz", counts: { C: 0, M: 0, X: 0 } }])).toThrow(
      /no region-day/,
    );
  });
});

// statsmodels Logit on synthetic two-predictor data (scripts/fixtures/make-sklearn-fixtures.py):
// column 0 is read as log10 of the unsigned flux, column 1 as the mean shear angle.
const fixture = JSON.parse(
  readFileSync(
    new URL("../../fixtures/verification/statsmodels-logit-generated.json", import.meta.url),
    "utf8",
  ),
) as { x: number[][]; y: number[]; params: number[]; bse: number[] };

describe("logistic candidate on the model's own predictors and transforms", () => {
  const level = {
    intercept: -20,
    predictors: [
      { input: "unsignedFluxMx" as const, transform: "log10" as const, coefficient: 1 },
      { input: "meanShearDeg" as const, transform: "identity" as const, coefficient: 0.01 },
    ],
  };
  const current: LogisticParams = {
    windowHours: 24,
    levels: { "C+": level, "M+": level, X: level },
  };
  const days = fixture.x.map(([logFlux, shear], i) => {
    const y = fixture.y[i] as 0 | 1;
    const input: AssessmentInput = {
      region: "HR-1",
      location: "N10E10",
      areaMsh: 100,
      spotCount: 5,
      mcintosh: "Dkc",
      mountWilson: "beta",
      unsignedFluxMx: 10 ** logFlux!,
      meanShearDeg: shear!,
      flares24h: { C: 0, M: 0, X: 0 },
    };
    return { input, outcomes: { "C+": y, "M+": y, X: y } };
  });

  it("matches statsmodels Logit coefficients and standard errors (relative 1e-7)", () => {
    const candidate = fitLogisticCandidate(current, days);
    const m = candidate.levels.find((l) => l.level === "M+")!;
    expect(m.converged).toBe(true);
    m.coefficients.forEach((c, j) => {
      expect(Math.abs(c.estimate! - fixture.params[j]!)).toBeLessThan(
        1e-7 * Math.abs(fixture.params[j]!),
      );
      expect(Math.abs(c.standardError! - fixture.bse[j]!)).toBeLessThan(
        1e-7 * Math.abs(fixture.bse[j]!),
      );
    });
    expect(m.coefficients.map((c) => c.term)).toEqual([
      "intercept",
      "log10(unsignedFluxMx)",
      "identity(meanShearDeg)",
    ]);
    expect(m.coefficients.map((c) => c.current)).toEqual([-20, 1, 0.01]);
    expect(candidate.params?.levels["M+"].predictors[1]).toMatchObject({
      input: "meanShearDeg",
      transform: "identity",
    });
    expect(parseModelParams("logistic", candidate.params).ok).toBe(true);
  });

  it("leaves out region-days outside a transform's domain and reports a level that cannot be fitted", () => {
    const withBad = [...days, { ...days[0]!, input: { ...days[0]!.input, unsignedFluxMx: 0 } }];
    const candidate = fitLogisticCandidate(
      current,
      withBad.map((d) => ({ ...d, outcomes: { ...d.outcomes, X: 0 as const } })),
    );
    expect(candidate.levels[0]?.skipped).toBe(1);
    const x = candidate.levels.find((l) => l.level === "X")!;
    expect(x.converged).toBe(false);
    expect(x.reason).toMatch(/no events/);
    expect(candidate.params).toBeNull();
  });
});

describe("held-out split", () => {
  it("tests on the last 365 days and trains on the days before", () => {
    expect(splitAtLastYear(["2030-01-01", "2031-06-30", "2030-07-01", "2031-12-31"])).toEqual({
      trainFrom: "2030-01-01",
      trainTo: "2030-12-31",
      testFrom: "2031-01-01",
      testTo: "2031-12-31",
    });
  });
  it("has nothing to train on within a single year", () => {
    expect(splitAtLastYear(["2031-01-01", "2031-12-31"])).toBeNull();
    expect(splitAtLastYear([])).toBeNull();
    expect(splitAtLastYear(["2030-12-31", "2031-12-31"])?.trainTo).toBe("2030-12-31");
  });
});
