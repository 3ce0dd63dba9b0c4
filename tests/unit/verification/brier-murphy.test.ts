import { describe, expect, it } from "vitest";
import {
  brierScore,
  brierSkillScore,
  murphyDecomposition,
  type ScoreValue,
} from "@/server/verification/scores";
import { readFixture, type SklearnSet } from "./fixture-loader";

function valueOf(score: ScoreValue): number {
  if (score.value === null) throw new Error(`undefined score: ${score.reason}`);
  return score.value;
}

const repeat = <T>(value: T, times: number): T[] => Array.from({ length: times }, () => value);

// Hand-worked example: forecast 0.2 five times (1 event), 0.8 five times (3 events); n = 10, ō = 0.4.
// BS = (0.64 + 4·0.04 + 3·0.04 + 2·0.64)/10 = 0.22; REL = 5·0.2²/10 = 0.02;
// RES = (5·0.2² + 5·0.2²)/10 = 0.04; UNC = 0.4·0.6 = 0.24 (Murphy 1973 terms, hand-derived).
const HAND_P = [...repeat(0.2, 5), ...repeat(0.8, 5)];
const HAND_O = [1, 0, 0, 0, 0, 1, 1, 1, 0, 0];

const { sets } = readFixture<{ sets: SklearnSet[] }>("sklearn.json");

describe("murphyDecomposition (Murphy 1973, J. Appl. Meteor. 12, 595)", () => {
  it("reproduces the hand-worked example", () => {
    const d = murphyDecomposition(HAND_P, HAND_O);
    expect(valueOf(d.brier)).toBeCloseTo(0.22, 14);
    expect(valueOf(d.reliability)).toBeCloseTo(0.02, 14);
    expect(valueOf(d.resolution)).toBeCloseTo(0.04, 14);
    expect(valueOf(d.uncertainty)).toBeCloseTo(0.24, 14);
    expect(d.groups).toBe(2);
    expect(valueOf(d.withinBinVariance)).toBe(0);
  });

  it.each(sets.map((s) => [s.name, s] as const))(
    "BS = REL − RES + UNC exactly on set %s",
    (_, set) => {
      const d = murphyDecomposition(set.p, set.o);
      const sum = valueOf(d.reliability) - valueOf(d.resolution) + valueOf(d.uncertainty);
      expect(Math.abs(sum - valueOf(d.brier))).toBeLessThan(1e-14);
      expect(valueOf(d.brier)).toBeCloseTo(set.brier_score_loss, 13);
    },
  );

  it("needs the within-bin terms when continuous forecasts are binned (Stephenson et al. 2008)", () => {
    const set = sets.find((s) => s.name === "continuous") as SklearnSet;
    const d = murphyDecomposition(set.p, set.o, 10);
    const threeTerms = valueOf(d.reliability) - valueOf(d.resolution) + valueOf(d.uncertainty);
    const fiveTerms = threeTerms + valueOf(d.withinBinVariance) - valueOf(d.withinBinCovariance);
    expect(Math.abs(fiveTerms - valueOf(d.brier))).toBeLessThan(1e-14);
    // Negative case: the three-term sum is off once forecasts inside a bin differ.
    expect(Math.abs(threeTerms - valueOf(d.brier))).toBeGreaterThan(1e-5);
    expect(d.isBinned).toBe(true);
  });

  it("reproduces a hand-worked binned example", () => {
    // p = 0.1 (o = 0) and 0.3 (o = 1) share the bin [0, 0.5): p̄ = 0.2, ō = 0.5, n = 2.
    // BS = 0.25, REL = 0.09, RES = 0, UNC = 0.25, WBV = 0.01,
    // WBC = (2/2)[(−0.5)(−0.1) + (0.5)(0.1)] = 0.1; 0.09 − 0 + 0.25 + 0.01 − 0.1 = 0.25 (hand-derived).
    const d = murphyDecomposition([0.1, 0.3], [0, 1], 2);
    expect(valueOf(d.brier)).toBeCloseTo(0.25, 14);
    expect(valueOf(d.reliability)).toBeCloseTo(0.09, 14);
    expect(valueOf(d.resolution)).toBeCloseTo(0, 14);
    expect(valueOf(d.withinBinVariance)).toBeCloseTo(0.01, 14);
    expect(valueOf(d.withinBinCovariance)).toBeCloseTo(0.1, 14);
  });

  it("stays defined without events, but says why on an empty sample", () => {
    const quiet = murphyDecomposition([0.1, 0.2], [0, 0]);
    expect(valueOf(quiet.uncertainty)).toBe(0);
    expect(valueOf(quiet.brier)).toBeCloseTo(0.025, 14);
    const empty = murphyDecomposition([], []);
    expect(empty.brier).toEqual({ value: null, reason: "the sample is empty" });
    expect(empty.reliability.value).toBeNull();
  });
});

describe("brierScore and brierSkillScore", () => {
  it("gives BSS = 0 to the sample-climatology forecast and 1 to a perfect one", () => {
    const rate = 4 / 10;
    expect(valueOf(brierSkillScore(repeat(rate, 10), HAND_O))).toBeCloseTo(0, 14);
    expect(valueOf(brierSkillScore(HAND_O, HAND_O))).toBe(1);
    // BSS = (RES − REL)/UNC for exact groups (Murphy 1973): (0.04 − 0.02)/0.24.
    expect(valueOf(brierSkillScore(HAND_P, HAND_O))).toBeCloseTo(1 / 12, 14);
    // A worse-than-climatology forecast has negative skill.
    expect(valueOf(brierSkillScore(repeat(0.9, 10), HAND_O))).toBeLessThan(0);
  });

  it("scores against a reference forecast: BSS = 1 − BS/BS_ref", () => {
    const reference = repeat(0.5, 10); // BS_ref = 0.25 on any binary sample
    expect(valueOf(brierSkillScore(HAND_P, HAND_O, reference))).toBeCloseTo(1 - 0.22 / 0.25, 14);
    const perfectReference = brierSkillScore(HAND_P, HAND_O, HAND_O);
    expect(perfectReference.value).toBeNull();
    expect(perfectReference.reason).toMatch(/reference forecast is perfect/);
  });

  it("says why skill is undefined for no events, all events and an empty sample", () => {
    const none = brierSkillScore([0.1, 0.3], [0, 0]);
    expect(none.value).toBeNull();
    expect(none.reason).toMatch(/no observed events/);
    const all = brierSkillScore([0.7, 0.9], [1, 1]);
    expect(all.value).toBeNull();
    expect(all.reason).toMatch(/no non-events/);
    expect(brierSkillScore([], []).reason).toBe("the sample is empty");
    expect(brierScore([], []).value).toBeNull();
    // The Brier score itself is defined without events: (0.01 + 0.09)/2.
    expect(valueOf(brierScore([0.1, 0.3], [0, 0]))).toBeCloseTo(0.05, 14);
  });

  it("rejects malformed input with a clear message", () => {
    expect(() => brierScore([0.1, 0.2], [0])).toThrow(/equal length/);
    expect(() => brierScore([1.2], [1])).toThrow(/index 0 must lie in \[0, 1\]/);
    expect(() => brierScore([Number.NaN], [1])).toThrow(/\[0, 1\]/);
    expect(() => brierScore([0.5, 0.5], [0, 2])).toThrow(/index 1 must be 0 or 1/);
    expect(() => brierSkillScore([0.5], [1], [0.5, 0.5])).toThrow(/Reference/);
    expect(() => murphyDecomposition([0.5], [1], 0)).toThrow(/bins/);
    expect(() => murphyDecomposition([0.5], [1], [0, 0.6, 0.5, 1])).toThrow(/increasing/);
  });
});
