import { describe, expect, it } from "vitest";
import { cellsNeedingReason, finalsOrderErrors } from "@/lib/domain/finals";
import {
  FLARE_LEVELS,
  WINDOW_KEYS,
  type FlareLevel,
  type ProbabilityGrid,
} from "@/lib/domain/flare-levels";
import { DEFAULT_FORECASTER } from "@/server/demo/archive/forecaster";
import { generateDemoArchive } from "@/server/demo/archive/generate";
import { listForecastRecords } from "@/server/demo/archive/day-forecasts";
import { DEMO_MODELS } from "@/server/scoring/demo-models";
import { compileModel } from "@/server/scoring/models";
import { DAYS, getArchive, hasEvent, SEED, START_DAY } from "./archive-fixture";

const archive = getArchive();

function brier(pairs: { p: number; o: boolean }[]): number {
  return pairs.reduce((s, { p, o }) => s + (p - (o ? 1 : 0)) ** 2, 0) / pairs.length;
}

/** Brier scores (Brier 1950) of the forecaster and each model, 24 h, on region-days every model scored. */
function scoreSources(a: typeof archive, level: FlareLevel) {
  const rows = a.regionDays.filter((r) => r.guidance.every((g) => g.probabilities !== null));
  const o = (r: (typeof rows)[number]) => hasEvent(level, r.counts);
  return {
    n: rows.length,
    forecaster: brier(rows.map((r) => ({ p: r.finals[level]["24h"], o: o(r) }))),
    models: a.regionDays[0]!.guidance.map((g, k) => ({
      key: g.key,
      brier: brier(rows.map((r) => ({ p: r.guidance[k]!.probabilities![level]["24h"], o: o(r) }))),
    })),
  };
}

describe("forecasts of the demo archive", () => {
  it("keep every finals grid and every full disk within the order rules (product brief)", () => {
    for (const r of archive.regionDays)
      expect(finalsOrderErrors(r.finals), `${r.regionNumber} ${r.day}`).toEqual({});
    for (const d of archive.dayRecords)
      for (const f of d.fullDisk) expect(finalsOrderErrors(f.probabilities)).toEqual({});
    // The check can fail: a grid with X above M+ is caught.
    const broken: ProbabilityGrid = structuredClone(archive.regionDays[0]!.finals);
    broken.X["24h"] = broken["M+"]["24h"] + 0.05;
    expect(Object.keys(finalsOrderErrors(broken))).toContain("finals.X.24h");
  });

  it("give finals as whole percentages between 1 % and 99 %", () => {
    const bad: string[] = [];
    for (const r of archive.regionDays) {
      for (const level of FLARE_LEVELS) {
        for (const w of WINDOW_KEYS) {
          const p = r.finals[level][w];
          if (Math.round(p * 100) / 100 !== p || p < 0.01 || p > 0.99)
            bad.push(`${r.regionNumber} ${r.day} ${level} ${w} ${p}`);
        }
      }
    }
    expect(bad).toEqual([]);
    expect(new Set(archive.regionDays.map((r) => r.finals["M+"]["24h"])).size).toBeGreaterThan(20);
  });

  it("carry a reason exactly where finals leave the guidance by more than the office margin", () => {
    let withReasons = 0;
    for (const r of archive.regionDays) {
      const needed = cellsNeedingReason(r.finals, r.blended, DEFAULT_FORECASTER.marginPoints);
      expect(Object.keys(r.finalReasons).sort()).toEqual([...needed].sort());
      if (needed.length > 0) withReasons++;
    }
    expect(withReasons).toBeGreaterThan(0);
    expect(withReasons).toBeLessThan(archive.regionDays.length);
  });

  it("store the guidance the compiled demo models give for the stored input", () => {
    const models = DEMO_MODELS.filter((m) => m.active).map(compileModel);
    for (const r of archive.regionDays) {
      models.forEach((m, k) =>
        expect(r.guidance[k]!.probabilities).toEqual(m.score(r.input).probabilities),
      );
    }
    const nulls = archive.regionDays.filter((r) =>
      r.guidance.some((g) => g.probabilities === null),
    );
    expect(nulls.length).toBeGreaterThan(0);
    expect(
      nulls.every(
        (r) => r.guidance.find((g) => g.key === "logistic-magnetic")!.missingInputs.length > 0,
      ),
    ).toBe(true);
  });

  it("derive the full disk as 1 − Π(1 − Pᵢ) (common practice), omitting a model that missed a region", () => {
    for (const d of archive.dayRecords) {
      const rows = archive.regionDays.filter((r) => r.day === d.day);
      const forecaster = d.fullDisk.find((f) => f.source === "forecaster")!;
      const product = rows.reduce((q, r) => q * (1 - r.finals["M+"]["24h"]), 1);
      expect(forecaster.probabilities["M+"]["24h"]).toBeCloseTo(1 - product, 12);
      const logisticMissed = rows.some((r) => r.guidance[1]!.probabilities === null);
      expect(d.fullDisk.some((f) => f.source === "model:logistic-magnetic@demo-1")).toBe(
        !logisticMissed,
      );
    }
  });

  it("list nine forecast records per source and region-day, and per source and full disk", () => {
    const records = listForecastRecords(archive);
    const regionGrids = archive.regionDays.reduce(
      (s, r) => s + 1 + r.guidance.filter((g) => g.probabilities).length,
      0,
    );
    const diskGrids = archive.dayRecords.reduce((s, d) => s + d.fullDisk.length, 0);
    expect(records).toHaveLength(9 * (regionGrids + diskGrids));
    expect(new Set(records.map((r) => r.source))).toEqual(
      new Set([
        "forecaster",
        "model:mcintosh-poisson@demo-1",
        "model:logistic-magnetic@demo-1",
        "model:flare-history@demo-1",
      ]),
    );
    expect(records.every((r) => r.issueTime.endsWith("T00:30:00.000Z"))).toBe(true);
    expect(records.filter((r) => r.regionNumber === null)).toHaveLength(9 * diskGrids);
  });

  it("keep the true probabilities in level order, so the counts follow them exactly", () => {
    for (const r of archive.regionDays) {
      expect(r.truth.X).toBeLessThanOrEqual(r.truth["M+"]);
      expect(r.truth["M+"]).toBeLessThanOrEqual(r.truth["C+"]);
    }
  });

  it("give the forecaster modest skill over every model for C+ and M+ (Brier score)", () => {
    for (const level of ["C+", "M+"] as const) {
      const s = scoreSources(archive, level);
      const best = Math.min(...s.models.map((m) => m.brier));
      expect(s.forecaster, level).toBeLessThan(best);
      // Modest: a skill score 1 − BS/BS_best below 0.2.
      expect(1 - s.forecaster / best, level).toBeLessThan(0.2);
    }
  });

  it("lose that skill when the forecaster does not move toward the truth", () => {
    const blind = generateDemoArchive({
      seed: SEED,
      startDay: START_DAY,
      days: DAYS,
      forecaster: { ...DEFAULT_FORECASTER, nudge: 0 },
    });
    const s = scoreSources(blind, "M+");
    expect(s.forecaster).toBeGreaterThan(Math.min(...s.models.map((m) => m.brier)));
  });
});
