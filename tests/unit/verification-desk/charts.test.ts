import { describe, expect, it } from "vitest";
import {
  thinRocPoints,
  toReliabilityChartData,
  toRocChartData,
  toSweepChartData,
  toTimelineChartData,
} from "@/lib/charts/verification";
import type { ReliabilityBinJson, RocPointJson } from "@/lib/query/verification";

const roc = (n: number): RocPointJson[] =>
  Array.from({ length: n }, (_, i) => ({
    threshold: i === 0 ? null : 1 - i / n,
    pod: Math.sqrt(i / (n - 1)),
    pofd: i / (n - 1),
  }));

describe("ROC chart data", () => {
  it("keeps short curves whole and thins long ones to at most the limit, keeping both ends", () => {
    expect(thinRocPoints(roc(50), 201)).toHaveLength(50);
    const thin = thinRocPoints(roc(5000), 201);
    expect(thin.length).toBeLessThanOrEqual(201);
    expect(thin.length).toBeGreaterThan(150);
    expect(thin[0]).toEqual({ threshold: null, pod: 0, pofd: 0 });
    expect(thin[thin.length - 1]).toMatchObject({ pod: 1, pofd: 1 });
    // Still a curve from (0, 0) to (1, 1) that never goes back.
    for (let i = 1; i < thin.length; i++)
      expect(thin[i]!.pofd).toBeGreaterThanOrEqual(thin[i - 1]!.pofd);
    expect(() => thinRocPoints(roc(10), 1)).toThrow();
  });
  it("plots POFD on x and POD on y", () => {
    expect(toRocChartData([{ threshold: 0.3, pod: 0.8, pofd: 0.1 }])).toEqual([{ x: 0.1, y: 0.8 }]);
  });
});

describe("reliability chart data", () => {
  const bins: ReliabilityBinJson[] = [
    {
      lower: 0,
      upper: 0.1,
      count: 80,
      events: 2,
      meanForecast: { value: 0.04 },
      observedFrequency: { value: 0.025 },
    },
    {
      lower: 0.1,
      upper: 0.2,
      count: 0,
      events: 0,
      meanForecast: { value: null, reason: "no forecasts fell in this bin" },
      observedFrequency: { value: null, reason: "no forecasts fell in this bin" },
    },
    {
      lower: 0.2,
      upper: 0.3,
      count: 5,
      events: 1,
      meanForecast: { value: 0.24 },
      observedFrequency: { value: 0.2 },
    },
  ];
  it("draws a point per non-empty bin and a bar for every bin", () => {
    const { points, counts } = toReliabilityChartData(bins);
    expect(points).toEqual([
      { x: 0.04, y: 0.025, count: 80, bin: "0.0–0.1" },
      { x: 0.24, y: 0.2, count: 5, bin: "0.2–0.3" },
    ]);
    expect(counts.map((c) => c.count)).toEqual([80, 0, 5]);
  });
});

describe("sweep and timeline data", () => {
  it("turns undefined scores into gaps, never into numbers", () => {
    const rows = toSweepChartData([
      { threshold: 0.1, tss: { value: 0.4 }, hss: { value: null, reason: "x" } },
    ]);
    expect(rows).toEqual([{ threshold: 0.1, tss: 0.4, hss: null }]);
  });
  it("says whether the reference has any point", () => {
    expect(
      toTimelineChartData([{ day: "2031-01-01", source: 0.1, reference: null, count: 3 }])
        .hasReference,
    ).toBe(false);
    expect(
      toTimelineChartData([{ day: "2031-01-01", source: 0.1, reference: 0.2, count: 3 }]),
    ).toEqual({ rows: [{ day: "2031-01-01", source: 0.1, reference: 0.2 }], hasReference: true });
  });
});
