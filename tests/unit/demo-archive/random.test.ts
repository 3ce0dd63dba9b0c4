import { describe, expect, it } from "vitest";
import {
  createStream,
  drawNormal,
  drawPoisson,
  drawPowerLaw,
  shuffleCopy,
} from "@/server/demo/archive/random";

const N = 20_000;

function meanAndVariance(xs: number[]): { mean: number; variance: number } {
  const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
  const variance = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (xs.length - 1);
  return { mean, variance };
}

describe("the archive's random draws", () => {
  it("give Poisson counts with mean and variance λ (Knuth's method)", () => {
    const random = createStream(1, "poisson-test");
    const { mean, variance } = meanAndVariance(
      Array.from({ length: N }, () => drawPoisson(random, 2.5)),
    );
    const se = Math.sqrt(2.5 / N); // standard error of the sample mean of Poisson(λ): √(λ/N)
    expect(Math.abs(mean - 2.5)).toBeLessThan(4 * se);
    expect(Math.abs(mean - 3)).toBeGreaterThan(4 * se);
    expect(variance).toBeGreaterThan(2.3);
    expect(variance).toBeLessThan(2.7);
    expect(drawPoisson(random, 0)).toBe(0);
    expect(() => drawPoisson(random, -1)).toThrow(RangeError);
  });

  it("give normal draws with the requested mean and standard deviation (Box–Muller)", () => {
    const random = createStream(1, "normal-test");
    const { mean, variance } = meanAndVariance(
      Array.from({ length: N }, () => drawNormal(random, 10, 2)),
    );
    expect(Math.abs(mean - 10)).toBeLessThan(4 * (2 / Math.sqrt(N)));
    expect(Math.sqrt(variance)).toBeCloseTo(2, 1);
    expect(Math.abs(mean - 10.2)).toBeGreaterThan(4 * (2 / Math.sqrt(N)));
  });

  it("give power-law values whose maximum-likelihood slope is α (Clauset et al. 2009, eq. 3.1)", () => {
    const random = createStream(1, "power-law-test");
    // xmax = 1e9 leaves a negligible truncation (P(x > 1e9) = 1e9^−0.8 ≈ 6e-8) for the unbounded estimator.
    const slope = (alpha: number) => {
      const xs = Array.from({ length: N }, () => drawPowerLaw(random, 1, 1e9, alpha));
      return 1 + N / xs.reduce((s, x) => s + Math.log(x), 0); // α̂ = 1 + n / Σ ln(x/xmin)
    };
    const se = 0.8 / Math.sqrt(N); // (α − 1)/√n, Clauset et al. 2009, eq. 3.2
    expect(Math.abs(slope(1.8) - 1.8)).toBeLessThan(4 * se);
    expect(Math.abs(slope(2.2) - 1.8)).toBeGreaterThan(20 * se);
    const bounded = Array.from({ length: 1000 }, () => drawPowerLaw(random, 1e-6, 1e-5, 1.8));
    expect(Math.min(...bounded)).toBeGreaterThanOrEqual(1e-6);
    expect(Math.max(...bounded)).toBeLessThanOrEqual(1e-5);
  });

  it("shuffle without losing or inventing items", () => {
    const items = Array.from({ length: 100 }, (_, i) => i);
    const shuffled = shuffleCopy(items, createStream(1, "shuffle-test"));
    expect(shuffled).not.toEqual(items);
    expect([...shuffled].sort((a, b) => a - b)).toEqual(items);
  });
});
