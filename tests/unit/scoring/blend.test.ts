import { describe, expect, it } from "vitest";
import { buildGrid, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import { blendGuidance } from "@/server/scoring/blend";

const LEVEL_SCALE = { "C+": 1, "M+": 0.3, X: 0.05 } as const;
const WINDOW_SCALE = { "24h": 0.5, "48h": 0.7, "72h": 0.8 } as const;

// Ordered grids: p = base × level scale × window scale.
function buildOrderedGrid(base: number): ProbabilityGrid {
  return buildGrid((level, window) => base * LEVEL_SCALE[level] * WINDOW_SCALE[window]);
}

describe("blended guidance", () => {
  it("takes the equal-weight mean and the max − min spread per cell", () => {
    const blend = blendGuidance([
      { key: "a", probabilities: buildOrderedGrid(0.4) },
      { key: "b", probabilities: buildOrderedGrid(0.8) },
    ]);
    // C+ 24 h: mean of 0.2 and 0.4 = 0.3; spread 0.2 (hand-computed).
    expect(blend.probabilities?.["C+"]["24h"]).toBeCloseTo(0.3, 12);
    expect(blend.spread?.["C+"]["24h"]).toBeCloseTo(0.2, 12);
    expect(blend.probabilities?.["C+"]["24h"]).not.toBeCloseTo(0.4, 3);
    expect(blend.usedKeys).toEqual(["a", "b"]);
    expect(blend.flags).toEqual([]);
  });

  it("applies optional weights, normalised by their sum", () => {
    const blend = blendGuidance(
      [
        { key: "a", probabilities: buildOrderedGrid(0.4) },
        { key: "b", probabilities: buildOrderedGrid(0.8) },
      ],
      { a: 3, b: 1 },
    );
    // (3·0.2 + 1·0.4)/4 = 0.25 (hand-computed).
    expect(blend.probabilities?.["C+"]["24h"]).toBeCloseTo(0.25, 12);
    expect(blend.probabilities?.["C+"]["24h"]).not.toBeCloseTo(0.3, 3);
  });

  it("leaves out models without probabilities or with weight 0", () => {
    const blend = blendGuidance(
      [
        { key: "a", probabilities: buildOrderedGrid(0.4) },
        { key: "b", probabilities: null },
        { key: "c", probabilities: buildOrderedGrid(1) },
      ],
      { c: 0 },
    );
    expect(blend.usedKeys).toEqual(["a"]);
    expect(blend.skippedKeys).toEqual(["b", "c"]);
    expect(blend.probabilities).toEqual(buildOrderedGrid(0.4));
    expect(blend.spread).toEqual(buildGrid(() => 0));
  });

  it("is null with a reason when no model contributes", () => {
    const none = blendGuidance([{ key: "a", probabilities: null }]);
    expect(none.probabilities).toBeNull();
    expect(none.spread).toBeNull();
    expect(none.reason).toBe("no model gave probabilities");
    expect(blendGuidance([]).reason).toBe("no guidance to blend");
  });

  it("flags a blend that breaks an order rule and refuses negative weights", () => {
    const broken = buildOrderedGrid(0.4);
    broken.X["24h"] = 0.9;
    const blend = blendGuidance([
      { key: "a", probabilities: broken },
      { key: "b", probabilities: buildOrderedGrid(0.4) },
    ]);
    // X 24 h: (0.9 + 0.01)/2 = 0.455 against M+ 24 h 0.06 and X 48 h 0.014 (hand-computed).
    expect(blend.flags).toEqual([
      "blend: order: X > M+ at 24h (0.455 > 0.060)",
      "blend: order: X at 24h > 48h (0.455 > 0.014)",
    ]);
    expect(blend.probabilities?.X["24h"]).toBeCloseTo(0.455, 12);
    expect(() => blendGuidance([{ key: "a", probabilities: broken }], { a: -1 })).toThrow(
      RangeError,
    );
  });
});
