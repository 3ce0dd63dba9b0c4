import { describe, expect, it } from "vitest";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import { createStream, shuffleCopy } from "@/server/demo/archive/random";
import { GENERATING_COEFFICIENTS, toGeneratingPredictors } from "@/server/demo/archive/truth";
import { decomposeCholesky, solveCholesky } from "@/server/verification/dense-cholesky";
import { fitLogistic, type LogisticFit } from "@/server/verification/logistic-fit";
import { fitMcIntoshRates } from "@/server/verification/poisson-fit";
import { getArchive, hasEvent } from "./archive-fixture";

const archive = getArchive();
const predictors = archive.regionDays.map((r) => toGeneratingPredictors(r.latent));
type Converged = Extract<LogisticFit, { converged: true }>;

/** 99.9 % quantile of χ² with 5 degrees of freedom: 20.515 (standard tables, from memory). */
const CHI2_5DF_999 = 20.515;
/** Each coefficient must lie within this many of its standard errors of the generating value. */
const SE_LIMIT = 3;

function truthOf(level: FlareLevel): number[] {
  const { intercept, slopes } = GENERATING_COEFFICIENTS[level];
  return [intercept, ...slopes];
}

function fitOutcomes(outcomes: number[]): Converged {
  const result = fitLogistic(predictors, outcomes);
  if (!result.converged) throw new Error(`fit did not converge: ${result.reason}`);
  return result;
}

/** Wald statistic (β̂ − β)ᵀ Σ⁻¹ (β̂ − β), χ² with k degrees of freedom under the truth (common statistics). */
function computeWald(f: Converged, truth: number[]): number {
  const d = f.coefficients.map((b, j) => b - (truth[j] as number));
  const factor = decomposeCholesky(f.covariance);
  if (!factor.ok) throw new Error(factor.message);
  const solved = solveCholesky(factor.lower, d);
  return d.reduce((s, x, j) => s + x * (solved[j] as number), 0);
}

const outcomesOf = (level: FlareLevel): number[] =>
  archive.regionDays.map((r) => (hasEvent(level, r.counts) ? 1 : 0));

describe("a maximum-likelihood refit of the archive (fitLogistic)", () => {
  for (const level of ["C+", "M+", "X"] as const) {
    it(`recovers the generating ${level} coefficients within ${SE_LIMIT} standard errors`, () => {
      const f = fitOutcomes(outcomesOf(level));
      const truth = truthOf(level);
      f.coefficients.forEach((b, j) => {
        const z = (b - (truth[j] as number)) / (f.standardErrors[j] as number);
        expect(Math.abs(z), `coefficient ${j}: ${b} vs ${truth[j]}`).toBeLessThan(SE_LIMIT);
      });
      expect(computeWald(f, truth)).toBeLessThan(CHI2_5DF_999);
    });
  }

  it("does not recover them from shuffled outcomes", () => {
    const shuffled = shuffleCopy(outcomesOf("M+"), createStream(1, "refit-shuffle"));
    const f = fitOutcomes(shuffled);
    const truth = truthOf("M+");
    const zs = f.coefficients.map((b, j) =>
      Math.abs((b - (truth[j] as number)) / (f.standardErrors[j] as number)),
    );
    expect(Math.max(...zs)).toBeGreaterThan(SE_LIMIT);
    expect(computeWald(f, truth)).toBeGreaterThan(10 * CHI2_5DF_999);
  });

  it("finds far fewer M+ events than region-days, as flares are rare", () => {
    const events = outcomesOf("M+").reduce((s, y) => s + y, 0);
    expect(events).toBeGreaterThan(100);
    expect(events / archive.regionDays.length).toBeLessThan(0.1);
  });
});

describe("McIntosh–Poisson rates refitted from the archive (fitMcIntoshRates)", () => {
  const rateBy = (
    days: { mcintosh: string; counts: { C: number; M: number; X: number } }[],
    key: (cls: string) => string | null,
  ) => {
    const table = fitMcIntoshRates(days, { minRegionDays: 1 });
    const sums = new Map<string, { flares: number; days: number }>();
    for (const row of table.rows) {
      const k = key(row.mcintosh);
      if (k === null) continue;
      const s = sums.get(k) ?? { flares: 0, days: 0 };
      s.flares += row.rates.C.flares + row.rates.M.flares + row.rates.X.flares;
      s.days += row.regionDays;
      sums.set(k, s);
    }
    return (k: string) => sums.get(k)!.flares / sums.get(k)!.days;
  };
  const days = archive.regionDays.map((r) => ({ mcintosh: r.input.mcintosh!, counts: r.counts }));

  it("grow with group size (Zurich class A < B < C < D < E < F)", () => {
    const rate = rateBy(days, (cls) => cls.charAt(0));
    const order = ["A", "B", "C", "D", "E", "F"].map(rate);
    for (let i = 1; i < order.length; i++) expect(order[i]).toBeGreaterThan(order[i - 1]!);
  });

  it("grow with compactness in D, E and F groups (distribution o < i < c)", () => {
    const rate = rateBy(days, (cls) => ("DEF".includes(cls.charAt(0)) ? cls.charAt(2) : null));
    expect(rate("i")).toBeGreaterThan(rate("o"));
    expect(rate("c")).toBeGreaterThan(rate("i"));
  });

  it("lose that order when the classes are shuffled across region-days", () => {
    const labels = shuffleCopy(
      days.map((d) => d.mcintosh),
      createStream(2, "class-shuffle"),
    );
    const rate = rateBy(
      days.map((d, i) => ({ ...d, mcintosh: labels[i]! })),
      (cls) => cls.charAt(0),
    );
    expect(rate("F") / rate("A")).toBeLessThan(2);
    const real = rateBy(days, (cls) => cls.charAt(0));
    expect(real("F") / real("A")).toBeGreaterThan(10);
  });
});
