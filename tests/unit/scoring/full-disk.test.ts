import { describe, expect, it } from "vitest";
import { buildGrid } from "@/lib/domain/flare-levels";
import { combineFullDisk, combineIndependent } from "@/server/scoring/full-disk";
import {
  buildPoissonGrid,
  cumulativeLevelRates,
  probabilityOfAtLeastOne,
} from "@/server/scoring/poisson";
import reference from "./fixtures/reference-values.json";

// A small seeded generator (mulberry32) so the property check is repeatable.
function createRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe("full disk P = 1 − Π(1 − Pᵢ) for independent regions (common practice)", () => {
  it("matches NumPy's 1 − prod(1 − p)", () => {
    // Source: tests/unit/scoring/fixtures/make-reference-values.py (NumPy).
    for (const c of reference.fullDisk) {
      expect(combineIndependent(c.regions), JSON.stringify(c)).toBeCloseTo(c.p, 15);
    }
  });

  it("combines 0.1, 0.2, 0.3 into 0.496 (1 − 0.9·0.8·0.7; common mathematics), not their sum", () => {
    expect(combineIndependent([0.1, 0.2, 0.3])).toBeCloseTo(0.496, 12);
    expect(combineIndependent([0.1, 0.2, 0.3])).not.toBeCloseTo(0.6, 2);
    expect(combineIndependent([])).toBe(0);
    expect(combineIndependent([0.3, 1])).toBe(1);
  });

  it("equals the Poisson probability of the summed rates for Poisson regions", () => {
    // 1 − Π exp(−λᵢT) = 1 − exp(−ΣλᵢT) (product of exponentials; common mathematics).
    const random = createRandom(20240611);
    for (let trial = 0; trial < 200; trial++) {
      const rates = Array.from({ length: 1 + Math.floor(random() * 8) }, () => random() * 2);
      const days = 1 + Math.floor(random() * 3);
      const combined = combineIndependent(rates.map((r) => probabilityOfAtLeastOne(r, days)));
      const summed = probabilityOfAtLeastOne(
        rates.reduce((s, r) => s + r, 0),
        days,
      );
      expect(Math.abs(combined - summed)).toBeLessThan(1e-12);
    }
  });

  it("combines every level × window of the region grids", () => {
    const a = buildPoissonGrid(cumulativeLevelRates({ C: 0.8, M: 0.1, X: 0.01 }));
    const b = buildPoissonGrid(cumulativeLevelRates({ C: 0.4, M: 0.05, X: 0.002 }));
    const disk = combineFullDisk([a, b]);
    const fromRates = buildPoissonGrid(cumulativeLevelRates({ C: 1.2, M: 0.15, X: 0.012 }));
    for (const level of ["C+", "M+", "X"] as const) {
      for (const window of ["24h", "48h", "72h"] as const) {
        expect(disk[level][window]).toBeCloseTo(fromRates[level][window], 12);
      }
    }
    expect(combineFullDisk([])).toEqual(buildGrid(() => 0));
    expect(combineFullDisk([a])["M+"]["48h"]).toBeCloseTo(a["M+"]["48h"], 15);
  });

  it("refuses probabilities outside [0, 1]", () => {
    expect(() => combineIndependent([0.2, 1.5])).toThrow(RangeError);
    expect(() => combineIndependent([Number.NaN])).toThrow(RangeError);
  });
});
