import { describe, expect, it } from "vitest";
import {
  buildIntervalTasks,
  INTERVAL_LEVEL,
  INTERVAL_SEED,
  skillAgainstReferenceInterval,
} from "@/server/verification-desk/interval-tasks";
import { runIntervalTasks } from "@/server/verification-desk/intervals.service";
import { brierSkillScore, createMulberry32 } from "@/server/verification/scores";

function sample(n: number, seed: number) {
  const random = createMulberry32(seed);
  const p = new Float64Array(n);
  const pRef = new Float64Array(n);
  const o = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const chance = random() ** 2;
    o[i] = random() < chance ? 1 : 0;
    p[i] = Math.min(1, chance * (0.8 + 0.4 * random()));
    pRef[i] = 0.5 * chance + 0.1;
  }
  return { p, pRef, o };
}

/** Type-7 sample quantile (Hyndman & Fan 1996), written out here independently of the desk. */
function quantile(sorted: number[], q: number): number {
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

describe("BSS against the reference, resampled by case position", () => {
  const { p, pRef, o } = sample(300, 5);
  const opts = { resamples: 200, seed: INTERVAL_SEED, level: INTERVAL_LEVEL };

  it("estimates the full-sample BSS against the reference", () => {
    const interval = skillAgainstReferenceInterval(p, pRef, o, opts);
    expect(interval.estimate.value).toBeCloseTo(brierSkillScore(p, o, pRef).value!, 14);
    expect(interval.lower.value!).toBeLessThan(interval.estimate.value!);
    expect(interval.upper.value!).toBeGreaterThan(interval.estimate.value!);
  });

  it("equals a percentile bootstrap written out directly on the same seeded draws (Efron & Tibshirani 1993, ch. 13)", () => {
    const random = createMulberry32(INTERVAL_SEED);
    const n = o.length;
    const values: number[] = [];
    for (let r = 0; r < opts.resamples; r++) {
      const idx = Array.from({ length: n }, () => Math.floor(random() * n));
      const score = brierSkillScore(
        idx.map((k) => p[k]!),
        idx.map((k) => o[k]!),
        idx.map((k) => pRef[k]!),
      );
      if (score.value !== null) values.push(score.value);
    }
    values.sort((a, b) => a - b);
    const interval = skillAgainstReferenceInterval(p, pRef, o, opts);
    expect(interval.lower.value).toBeCloseTo(quantile(values, 0.025), 12);
    expect(interval.upper.value).toBeCloseTo(quantile(values, 0.975), 12);
    // A different seed draws other cases: the same check with it must not hold exactly.
    const other = skillAgainstReferenceInterval(p, pRef, o, { ...opts, seed: INTERVAL_SEED + 1 });
    expect(other.lower.value).not.toBe(interval.lower.value);
  });

  it("maps every position i/(n − 1) back to i for a 66,000-case sample", () => {
    const n = 66_000;
    let mismatches = 0;
    for (let i = 0; i < n; i++) if (Math.round((i / (n - 1)) * (n - 1)) !== i) mismatches += 1;
    expect(mismatches).toBe(0);
  });
});

describe("the interval tasks of a report", () => {
  it("covers every score, and the reference scores only with a reference", async () => {
    const { p, pRef, o } = sample(120, 9);
    const without = buildIntervalTasks({ p, o, shared: null, threshold: 0.3 }, 200);
    expect(without.map((t) => t.key)).not.toContain("bssReference");
    const tasks = buildIntervalTasks({ p, o, shared: { p, pRef, o }, threshold: 0.3 }, 200);
    expect(tasks.map((t) => t.key)).toEqual(
      expect.arrayContaining([
        "brier",
        "bssClimatology",
        "rocArea",
        "contingency.tss",
        "contingency.apss",
        "bssReference",
        "skillDifference",
      ]),
    );
    const progress: number[] = [];
    const result = await runIntervalTasks(tasks, (done) => progress.push(done));
    expect(progress).toEqual(tasks.map((_, i) => i + 1));
    expect(result.skillDifference?.estimate.value).toBeCloseTo(
      brierSkillScore(p, o).value! - brierSkillScore(pRef, o).value!,
      12,
    );
    expect(result.intervals.brier?.lower.value).toBeLessThanOrEqual(
      result.intervals.brier!.upper.value!,
    );
  });

  it("says why an interval is undefined when the sample has no events", async () => {
    const tasks = buildIntervalTasks(
      { p: [0.1, 0.2, 0.3], o: [0, 0, 0], shared: null, threshold: 0.5 },
      200,
    );
    const result = await runIntervalTasks(tasks, () => undefined);
    expect(result.intervals.bssClimatology?.lower).toEqual({
      value: null,
      reason: "the score was undefined in 200 of 200 resamples",
    });
    expect(result.intervals.brier?.lower.value).not.toBeNull();
  });
});
