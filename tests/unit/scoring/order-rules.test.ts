import { describe, expect, it } from "vitest";
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import { checkGrid, checkOrderRules, checkProbabilityRange } from "@/server/scoring/order-rules";

function buildValidGrid(): ProbabilityGrid {
  return {
    "C+": { "24h": 0.6, "48h": 0.8, "72h": 0.9 },
    "M+": { "24h": 0.15, "48h": 0.25, "72h": 0.35 },
    X: { "24h": 0.02, "48h": 0.04, "72h": 0.06 },
  };
}

describe("order rules P(X) ≤ P(M+) ≤ P(C+) and P(24 h) ≤ P(48 h) ≤ P(72 h) (product brief)", () => {
  it("pass a consistent grid", () => {
    expect(checkGrid(buildValidGrid())).toEqual([]);
  });

  it("flag X above M+ and say where", () => {
    const grid = buildValidGrid();
    grid.X = { "24h": 0.2, "48h": 0.22, "72h": 0.3 };
    expect(checkOrderRules(grid)).toEqual(["order: X > M+ at 24h (0.200 > 0.150)"]);
  });

  it("flag M+ above C+", () => {
    const grid = buildValidGrid();
    grid["M+"]["72h"] = 0.95;
    expect(checkOrderRules(grid)).toEqual(["order: M+ > C+ at 72h (0.950 > 0.900)"]);
  });

  it("flag a shorter window above a longer one", () => {
    const grid = buildValidGrid();
    grid["C+"]["48h"] = 0.95;
    expect(checkOrderRules(grid)).toEqual(["order: C+ at 48h > 72h (0.950 > 0.900)"]);
  });

  it("ignore floating-point noise but not real breaks", () => {
    const grid = buildValidGrid();
    grid.X = { "24h": 0.15 + 1e-12, "48h": 0.2, "72h": 0.3 };
    expect(checkOrderRules(grid)).toEqual([]);
    grid.X["24h"] = 0.151;
    expect(checkOrderRules(grid)).toHaveLength(1);
  });

  it("never change the values they check", () => {
    const grid = buildValidGrid();
    grid.X["24h"] = 0.9;
    const before = structuredClone(grid);
    checkGrid(grid);
    expect(grid).toEqual(before);
  });
});

describe("probability range", () => {
  it("flags values outside [0, 1] and non-finite values", () => {
    const grid = buildValidGrid();
    grid["C+"]["72h"] = 1.2;
    grid.X["48h"] = Number.NaN;
    expect(checkProbabilityRange(grid)).toEqual([
      "range: C+ at 72h is 1.2, outside [0, 1]",
      "range: X at 48h is not a finite number",
    ]);
    expect(checkProbabilityRange(buildValidGrid())).toEqual([]);
  });
});
