import { describe, expect, it } from "vitest";
import {
  DEFAULT_SWEEP_THRESHOLDS,
  contingencyFromProbabilities,
  createMulberry32,
  rocCurve,
  thresholdSweep,
} from "@/server/verification/scores";

/** AUC from its definition: P(event forecast > non-event forecast), ties one half (Hanley & McNeil 1982). */
function bruteForceAuc(p: number[], o: number[]): number {
  let wins = 0;
  let pairs = 0;
  p.forEach((pe, i) => {
    if (o[i] !== 1) return;
    p.forEach((pn, j) => {
      if (o[j] !== 0) return;
      pairs += 1;
      wins += pe > pn ? 1 : pe === pn ? 0.5 : 0;
    });
  });
  return wins / pairs;
}

function syntheticSample(seed: number, n: number): { p: number[]; o: number[] } {
  const random = createMulberry32(seed);
  const p: number[] = [];
  const o: number[] = [];
  for (let i = 0; i < n; i++) {
    const chance = Math.round(random() * 20) / 20; // steps of 0.05: many ties
    p.push(chance);
    o.push(random() < chance ? 1 : 0);
  }
  return { p, o };
}

describe("rocCurve", () => {
  it("reproduces a hand-counted area", () => {
    // Events forecast 0.9, 0.7; non-events 0.8, 0.6: 3 of 4 pairs ranked right → 0.75.
    expect(rocCurve([0.9, 0.8, 0.7, 0.6], [1, 0, 1, 0]).auc).toEqual({ value: 0.75 });
  });

  it("equals the Mann–Whitney statistic with ties counted half", () => {
    for (const seed of [1, 2, 3]) {
      const { p, o } = syntheticSample(seed, 300);
      expect(rocCurve(p, o).auc.value).toBeCloseTo(bruteForceAuc(p, o), 14);
    }
  });

  it("gives 1 to a perfect ranking, 0 to a reversed one and 0.5 to a constant forecast", () => {
    expect(rocCurve([0.9, 0.8, 0.2], [1, 1, 0]).auc.value).toBe(1);
    expect(rocCurve([0.1, 0.2, 0.8], [1, 1, 0]).auc.value).toBe(0);
    expect(rocCurve([0.3, 0.3, 0.3], [1, 0, 0]).auc.value).toBe(0.5);
  });

  it("runs from (0, 0) to (1, 1) with POD and POFD never decreasing", () => {
    const { p, o } = syntheticSample(9, 200);
    const { points } = rocCurve(p, o);
    expect(points[0]).toEqual({ threshold: null, pod: 0, pofd: 0 });
    expect(points.at(-1)).toMatchObject({ pod: 1, pofd: 1 });
    points.slice(1).forEach((pt, i) => {
      const before = points[i]!;
      expect(pt.pod).toBeGreaterThanOrEqual(before.pod);
      expect(pt.pofd).toBeGreaterThanOrEqual(before.pofd);
    });
    expect(new Set(points.map((pt) => pt.threshold)).size).toBe(points.length);
  });

  it("is undefined without events or non-events, and on an empty sample", () => {
    const none = rocCurve([0.2, 0.4], [0, 0]);
    expect(none).toEqual({
      points: [],
      auc: { value: null, reason: "no observed events in the sample" },
    });
    expect(rocCurve([0.2, 0.4], [1, 1]).auc.reason).toMatch(/non-events/);
    expect(rocCurve([], []).auc.reason).toBe("the sample is empty");
  });
});

describe("contingencyFromProbabilities and thresholdSweep", () => {
  it("warns when p ≥ threshold", () => {
    expect(contingencyFromProbabilities([0.1, 0.5, 0.5, 0.9], [0, 1, 0, 1], 0.5)).toEqual({
      hits: 2,
      falseAlarms: 1,
      misses: 0,
      correctNegatives: 1,
    });
    expect(contingencyFromProbabilities([0.1, 0.5, 0.5, 0.9], [0, 1, 0, 1], 0.51)).toEqual({
      hits: 1,
      falseAlarms: 0,
      misses: 1,
      correctNegatives: 2,
    });
  });

  it("agrees with a direct count at every threshold, forecast values included", () => {
    const { p, o } = syntheticSample(4, 500);
    const thresholds = [0, 0.05, 0.1, 0.125, 0.35, 0.5, 0.95, 1];
    thresholdSweep(p, o, thresholds).forEach((row) => {
      expect(row.table).toEqual(contingencyFromProbabilities(p, o, row.threshold));
    });
  });

  it("matches the ROC points at the same thresholds", () => {
    const { p, o } = syntheticSample(5, 400);
    const roc = rocCurve(p, o).points.slice(1);
    const rows = thresholdSweep(
      p,
      o,
      roc.map((pt) => pt.threshold as number),
    );
    rows.forEach((row, i) => {
      expect(row.scores.pod.value).toBeCloseTo(roc[i]!.pod, 14);
      expect(row.scores.pofd.value).toBeCloseTo(roc[i]!.pofd, 14);
    });
  });

  it("sweeps 0.01 … 0.99 by default", () => {
    expect(DEFAULT_SWEEP_THRESHOLDS).toHaveLength(99);
    expect(DEFAULT_SWEEP_THRESHOLDS[0]).toBe(0.01);
    expect(DEFAULT_SWEEP_THRESHOLDS[98]).toBe(0.99);
    expect(DEFAULT_SWEEP_THRESHOLDS[6]).toBe(0.07); // 7/100 is the double nearest 0.07
    const rows = thresholdSweep([0.3, 0.6], [0, 1]);
    expect(rows).toHaveLength(99);
  });

  it("rejects thresholds outside [0, 1]", () => {
    expect(() => contingencyFromProbabilities([0.5], [1], 1.5)).toThrow(/threshold/);
    expect(() => thresholdSweep([0.5], [1], [0.2, Number.NaN])).toThrow(/threshold/);
  });
});
