import { describe, expect, it } from "vitest";
import {
  bootstrapInterval,
  brierScore,
  brierSkillScore,
  createMulberry32,
  pairedBootstrapDifference,
  type ScoreValue,
} from "@/server/verification/scores";

function valueOf(score: ScoreValue): number {
  if (score.value === null) throw new Error(`undefined score: ${score.reason}`);
  return score.value;
}

function sample(seed: number, n: number): { p: number[]; o: number[] } {
  const random = createMulberry32(seed);
  const p = Array.from({ length: n }, () => random());
  const o = p.map((pi) => (random() < pi ? 1 : 0));
  return { p, o };
}

const OPTIONS = { resamples: 400, seed: 12345, level: 0.95 };

describe("createMulberry32", () => {
  it("repeats for a seed, differs between seeds and stays in [0, 1)", () => {
    const a = createMulberry32(42);
    const b = createMulberry32(42);
    const c = createMulberry32(43);
    const first = Array.from({ length: 5 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c())).not.toEqual(first);
    const draws = Array.from({ length: 100_000 }, createMulberry32(7));
    expect(Math.min(...draws)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...draws)).toBeLessThan(1);
    // Mean of U(0, 1) is 1/2 with standard error 1/√(12·10⁵) ≈ 0.0009 (common practice).
    expect(Math.abs(draws.reduce((s, x) => s + x, 0) / draws.length - 0.5)).toBeLessThan(0.004);
    expect(() => createMulberry32(1.5)).toThrow(/integer/);
  });
});

describe("bootstrapInterval", () => {
  const { p, o } = sample(1, 500);

  it("gives the same interval for the same seed and another for another seed", () => {
    const first = bootstrapInterval(p, o, brierScore, OPTIONS);
    expect(bootstrapInterval(p, o, brierScore, OPTIONS)).toEqual(first);
    const other = bootstrapInterval(p, o, brierScore, { ...OPTIONS, seed: 54321 });
    expect(other.lower.value).not.toBe(first.lower.value);
    expect(other.upper.value).not.toBe(first.upper.value);
  });

  it("contains the point estimate and has about the width the central limit theorem gives", () => {
    const ci = bootstrapInterval(p, o, brierScore, { ...OPTIONS, resamples: 2000 });
    const estimate = valueOf(ci.estimate);
    expect(estimate).toBe(valueOf(brierScore(p, o)));
    expect(valueOf(ci.lower)).toBeLessThan(estimate);
    expect(valueOf(ci.upper)).toBeGreaterThan(estimate);
    // BS is a mean of (p − o)²: its 95 % interval is about ±1.96·sd/√n (Efron & Tibshirani 1993).
    const squares = p.map((pi, i) => (pi - (o[i] as number)) ** 2);
    const mean = squares.reduce((s, x) => s + x, 0) / squares.length;
    const sd = Math.sqrt(squares.reduce((s, x) => s + (x - mean) ** 2, 0) / (squares.length - 1));
    const expectedWidth = 2 * 1.96 * (sd / Math.sqrt(squares.length));
    const width = valueOf(ci.upper) - valueOf(ci.lower);
    expect(width / expectedWidth).toBeGreaterThan(0.85);
    expect(width / expectedWidth).toBeLessThan(1.15);
    // Negative case: a 50 % interval is clearly narrower than the 95 % one.
    const narrow = bootstrapInterval(p, o, brierScore, { ...OPTIONS, resamples: 2000, level: 0.5 });
    expect(valueOf(narrow.upper) - valueOf(narrow.lower)).toBeLessThan(width * 0.5);
  });

  it("leaves out resamples where the score is undefined, and says so when all are", () => {
    // One event in 30 cases: some resamples draw none, so climatological skill is undefined there.
    const rareO = Array.from({ length: 30 }, (_, i) => (i === 0 ? 1 : 0));
    const rareP = rareO.map((oi) => (oi === 1 ? 0.6 : 0.1));
    const ci = bootstrapInterval(rareP, rareO, (a, b) => brierSkillScore(a, b), OPTIONS);
    expect(ci.undefinedResamples).toBeGreaterThan(0);
    expect(ci.undefinedResamples).toBeLessThan(OPTIONS.resamples);
    expect(ci.lower.value).not.toBeNull();
    const none = bootstrapInterval([0.1, 0.2], [0, 0], (a, b) => brierSkillScore(a, b), OPTIONS);
    expect(none.estimate.value).toBeNull();
    expect(none.lower.value).toBeNull();
    expect(none.lower.reason).toMatch(/undefined in 400 of 400/);
    expect(bootstrapInterval([], [], brierScore, OPTIONS).upper.reason).toBe("the sample is empty");
  });

  it("rejects bad options and bad data", () => {
    expect(() => bootstrapInterval(p, o, brierScore, { ...OPTIONS, resamples: 1 })).toThrow(
      /resamples/,
    );
    expect(() => bootstrapInterval(p, o, brierScore, { ...OPTIONS, level: 1 })).toThrow(/level/);
    expect(() => bootstrapInterval(p, o, brierScore, { ...OPTIONS, seed: 0.5 })).toThrow(/seed/);
    expect(() => bootstrapInterval([0.2], [3], brierScore, OPTIONS)).toThrow(/0 or 1/);
  });
});

describe("pairedBootstrapDifference", () => {
  const { p: truth, o } = sample(2, 600);
  const random = createMulberry32(99);
  // A sharper forecaster (the probabilities the outcomes were drawn from) against a blurred model.
  const model = truth.map((pi) =>
    Math.min(1, Math.max(0, 0.5 + 0.3 * (pi - 0.5) + 0.2 * (random() - 0.5))),
  );

  it("is exactly zero when both sides are the same forecast", () => {
    const ci = pairedBootstrapDifference(truth, truth, o, brierScore, OPTIONS);
    expect(ci.estimate).toEqual({ value: 0 });
    expect(ci.lower).toEqual({ value: 0 });
    expect(ci.upper).toEqual({ value: 0 });
  });

  it("excludes zero when one forecast is clearly better, with the sign of A − B", () => {
    const ci = pairedBootstrapDifference(truth, model, o, brierScore, OPTIONS);
    expect(valueOf(ci.estimate)).toBeCloseTo(
      valueOf(brierScore(truth, o)) - valueOf(brierScore(model, o)),
      14,
    );
    expect(valueOf(ci.upper)).toBeLessThan(0);
    const reversed = pairedBootstrapDifference(model, truth, o, brierScore, OPTIONS);
    expect(valueOf(reversed.lower)).toBeGreaterThan(0);
  });

  it("rejects forecast sets of different lengths", () => {
    expect(() => pairedBootstrapDifference(truth, model.slice(1), o, brierScore, OPTIONS)).toThrow(
      /equal length/,
    );
  });
});
