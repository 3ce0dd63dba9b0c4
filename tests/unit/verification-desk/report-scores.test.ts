import { describe, expect, it } from "vitest";
import {
  scoreSample,
  scoreSide,
  skillAgainstReference,
} from "@/server/verification-desk/report-scores";
import { rollingBrier } from "@/server/verification-desk/rolling-brier";

// Four cases worked by hand from the definitions (Wilks, Statistical Methods in the Atmospheric
// Sciences, forecast verification chapter):
//   p = 0.9, 0.6, 0.3, 0.1 and o = 1, 0, 1, 0.
//   BS = (0.01 + 0.36 + 0.49 + 0.01) / 4 = 0.2175; ō = 0.5, UNC = 0.25; BSS = 1 − 0.2175/0.25 = 0.13.
//   ROC area: event forecasts {0.9, 0.3} above non-event forecasts {0.6, 0.1} in 3 of 4 pairs → 0.75.
//   Warning at p ≥ 0.5: hit (0.9), false alarm (0.6), miss (0.3), correct negative (0.1).
const p = [0.9, 0.6, 0.3, 0.1];
const o = [1, 0, 1, 0];

describe("scores of a hand-checkable sample", () => {
  const report = scoreSample(p, o, 0.5);

  it("has the Brier score, climatological skill and ROC area worked by hand", () => {
    expect(report.scores.brier.value).toBeCloseTo(0.2175, 12);
    expect(report.scores.uncertainty.value).toBeCloseTo(0.25, 12);
    expect(report.scores.bssClimatology.value).toBeCloseTo(0.13, 12);
    expect(report.scores.rocArea.value).toBeCloseTo(0.75, 12);
  });

  it("keeps the binned identity BS = REL − RES + UNC + WBV − WBC (Stephenson et al. 2008, eq. 7)", () => {
    const s = report.scores;
    const sum =
      s.reliability.value! -
      s.resolution.value! +
      s.uncertainty.value! +
      s.withinBinVariance.value! -
      s.withinBinCovariance.value!;
    expect(sum).toBeCloseTo(s.brier.value!, 12);
  });

  it("has the 2×2 table at 0.5 with its scores", () => {
    expect(report.contingency.table).toEqual({
      hits: 1,
      falseAlarms: 1,
      misses: 1,
      correctNegatives: 1,
    });
    const c = report.contingency.scores;
    expect([
      c.pod.value,
      c.far.value,
      c.pofd.value,
      c.bias.value,
      c.pc.value,
      c.tss.value,
      c.hss.value,
    ]).toEqual([0.5, 0.5, 0.5, 1, 0.5, 0, 0]);
    expect(c.csi.value).toBeCloseTo(1 / 3, 12);
  });

  it("changes when one outcome changes (the checks can fail)", () => {
    const other = scoreSample(p, [1, 1, 1, 0], 0.5);
    expect(other.scores.brier.value).not.toBeCloseTo(0.2175, 6);
    expect(other.contingency.table.hits).toBe(2);
  });

  it("sweeps 99 thresholds, TSS at 0.5 equal to the table's", () => {
    expect(report.sweep).toHaveLength(99);
    expect(report.sweep.find((r) => r.threshold === 0.5)?.tss).toEqual(
      report.contingency.scores.tss,
    );
  });
});

describe("a sample with no events", () => {
  const report = scoreSample([0.2, 0.1, 0.05], [0, 0, 0], 0.5);

  it("keeps the Brier score but says why skill, ROC area and POD are undefined", () => {
    expect(report.scores.brier.value).toBeCloseTo((0.04 + 0.01 + 0.0025) / 3, 12);
    expect(report.scores.bssClimatology).toEqual({
      value: null,
      reason: expect.stringContaining("no observed events"),
    });
    expect(report.scores.rocArea.value).toBeNull();
    expect(report.contingency.scores.pod).toEqual({
      value: null,
      reason: expect.stringContaining("no observed events"),
    });
  });

  it("never produces NaN or Infinity anywhere in the report", () => {
    const text = JSON.stringify(report, (_k, v) =>
      typeof v === "number" && !Number.isFinite(v) ? "NOT-FINITE" : v,
    );
    expect(text).not.toContain("NOT-FINITE");
    const empty = JSON.stringify(scoreSample([], [], 0.5), (_k, v) =>
      typeof v === "number" && !Number.isFinite(v) ? "NOT-FINITE" : v,
    );
    expect(empty).not.toContain("NOT-FINITE");
    expect(scoreSample([], [], 0.5).scores.brier).toEqual({
      value: null,
      reason: "the sample is empty",
    });
  });
});

describe("skill against a reference", () => {
  it("is 1 − BS/BS_ref (Wilks): against p_ref = 0.5 everywhere, BS_ref = 0.25, so BSS = 0.13", () => {
    expect(skillAgainstReference(p, o, [0.5, 0.5, 0.5, 0.5]).value).toBeCloseTo(0.13, 12);
    expect(skillAgainstReference(p, o, p).value).toBe(0);
  });
  it("is undefined without a reference or without shared cases", () => {
    expect(skillAgainstReference(p, o, null)).toEqual({
      value: null,
      reason: "no reference forecast chosen",
    });
    expect(skillAgainstReference([], [], []).value).toBeNull();
    expect(scoreSide(p, o).brier.value).toBeCloseTo(0.2175, 12);
  });
});

describe("rolling Brier score", () => {
  const day = (d: number, h = 0) => Date.UTC(2031, 0, d, h);
  // Day 1: (0.5−1)² = 0.25; day 2: (0.1−0)² = 0.01 and (0.9−1)² = 0.01; day 5: (0.2−0)² = 0.04.
  const cases = {
    issueTimeMs: [day(1, 6), day(2, 1), day(2, 23), day(5, 12)],
    p: [0.5, 0.1, 0.9, 0.2],
    pRef: [0.3, Number.NaN, Number.NaN, 0.4],
    o: [1, 0, 1, 0],
  };

  it("averages the trailing window of days ending on each day with cases (hand-worked)", () => {
    const points = rollingBrier(cases, 2);
    expect(points.map((pt) => pt.day)).toEqual(["2031-01-01", "2031-01-02", "2031-01-05"]);
    expect(points.map((pt) => pt.count)).toEqual([1, 3, 1]);
    expect(points[0]?.source).toBeCloseTo(0.25, 12);
    expect(points[1]?.source).toBeCloseTo(0.27 / 3, 12);
    // Day 5's window (days 4 and 5) has dropped days 1 and 2.
    expect(points[2]?.source).toBeCloseTo(0.04, 12);
  });

  it("scores the reference on its own cases and is null where it has none", () => {
    const points = rollingBrier(cases, 2);
    expect(points[0]?.reference).toBeCloseTo(0.49, 12);
    expect(points[1]?.reference).toBeCloseTo(0.49, 12);
    expect(points[2]?.reference).toBeCloseTo(0.16, 12);
    expect(
      rollingBrier({ ...cases, pRef: [Number.NaN, Number.NaN, Number.NaN, Number.NaN] }, 2).every(
        (pt) => pt.reference === null,
      ),
    ).toBe(true);
    expect(() => rollingBrier(cases, 0)).toThrow(/whole number/);
  });
});

describe("a report's computing on 66,000 pairs", () => {
  it("matches, scores and draws the timeline within the one-second budget (database read aside)", async () => {
    const { buildCases } = await import("@/server/verification-desk/cases");
    const { createMulberry32 } = await import("@/server/verification/prng");
    const random = createMulberry32(21);
    const start = Date.UTC(2030, 0, 1);
    const rows = Array.from({ length: 66_000 }, (_, i) => ({
      source: "forecaster",
      issueTimeMs: start + Math.floor(i / 90) * 86_400_000,
      regionNumber: `HR-${1000 + (i % 90)}`,
      probability: random() ** 2,
    }));
    const events = Array.from({ length: 6000 }, () => ({
      peakTimeMs: start + Math.floor(random() * 733 * 86_400_000),
      peakFluxTrue: 1e-5 * (1 + 9 * random()),
      regionNumber: `HR-${1000 + Math.floor(random() * 90)}`,
    }));
    const t0 = performance.now();
    const cases = buildCases(
      rows,
      { source: "forecaster", reference: null, level: "M+", windowHours: 24, convention: "true" },
      events,
    );
    const report = scoreSample(cases.p, cases.o, 0.3);
    const timeline = rollingBrier(cases, 30);
    const elapsed = performance.now() - t0;
    expect(cases.p).toHaveLength(66_000);
    expect(report.scores.brier.value).not.toBeNull();
    expect(timeline).toHaveLength(734);
    expect(elapsed).toBeLessThan(1000);
  });
});
