import { describe, expect, it } from "vitest";
import { buildForecastRecords, modelSource } from "@/server/bulletins/forecast-records";
import type { StoredGuidance } from "@/server/bulletins/day-guidance.db";
import { gridOf, issued } from "./bulletin-fixture";

const guidance = (
  region: string,
  key: string,
  p: ReturnType<typeof gridOf> | null,
): StoredGuidance => ({
  region,
  modelKey: key,
  modelVersion: "2031.1",
  modelName: key,
  probabilities: p,
  flags: [],
  missingInputs: [],
});

describe("buildForecastRecords", () => {
  const b = issued();

  it("writes the forecaster's full disk (region null) and every issued region, 9 cells each", () => {
    const rows = buildForecastRecords(b, []);
    expect(rows).toHaveLength(9 * 3);
    expect(rows.every((r) => r.source === "forecaster" && r.bulletinId === 7 && r.isDemo)).toBe(
      true,
    );
    expect(rows.every((r) => r.issueTime.toISOString() === "2031-05-06T00:30:00.000Z")).toBe(true);
    const fullDisk = rows.filter((r) => r.regionNumber === null);
    expect(fullDisk.map((r) => [r.level, r.windowHours, r.probability])).toContainEqual([
      "M+",
      24,
      0.25,
    ]);
    expect(new Set(rows.map((r) => r.windowHours))).toEqual(new Set([24, 48, 72]));
    expect(new Set(rows.map((r) => r.level))).toEqual(new Set(["C+", "M+", "X"]));
  });

  it("adds each model per region, and its full disk as 1 − Π(1 − Pᵢ) when it scored every region", () => {
    // Full disk of independent regions (common practice): 1 − (1 − 0.2)(1 − 0.5) = 0.6.
    const a = gridOf(0.5, 0.2, 0.02);
    const c = gridOf(0.8, 0.5, 0.05);
    const rows = buildForecastRecords(b, [
      guidance("HR-0412", "mcintosh-poisson", a),
      guidance("HR-0413", "mcintosh-poisson", c),
    ]);
    const source = modelSource("mcintosh-poisson", "2031.1");
    expect(source).toBe("model:mcintosh-poisson@2031.1");
    const model = rows.filter((r) => r.source === source);
    expect(model).toHaveLength(9 * 3);
    const m24 = model.find(
      (r) => r.regionNumber === null && r.level === "M+" && r.windowHours === 24,
    );
    expect(m24?.probability).toBeCloseTo(0.6, 12);
    expect(m24?.probability).not.toBeCloseTo(0.7, 6);
  });

  it("keeps a model's region rows but no full disk when it could not score a region", () => {
    const rows = buildForecastRecords(b, [
      guidance("HR-0412", "logistic", gridOf(0.5, 0.2, 0.02)),
      guidance("HR-0413", "logistic", null),
    ]);
    const model = rows.filter((r) => r.source === "model:logistic@2031.1");
    expect(model).toHaveLength(9);
    expect(model.every((r) => r.regionNumber === "HR-0412")).toBe(true);
  });

  it("ignores guidance of a region the bulletin does not carry", () => {
    const rows = buildForecastRecords(b, [guidance("HR-0999", "logistic", gridOf(0.5, 0.2, 0.02))]);
    expect(rows.filter((r) => r.source !== "forecaster")).toEqual([]);
  });
});
