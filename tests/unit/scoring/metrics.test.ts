import { describe, expect, it } from "vitest";
import { explainHardLimitError, hardLimitErrors, plausibilityWarnings } from "@/lib/domain/metrics";

describe("hard limits of region metrics", () => {
  it("keeps the mean shear angle within 0–90° (Bobra et al. 2014 define it as an angle ≤ 90°)", () => {
    expect(explainHardLimitError("meanShearDeg", 45)).toBeNull();
    expect(explainHardLimitError("meanShearDeg", 90)).toBeNull();
    expect(explainHardLimitError("meanShearDeg", 91)).toMatch(/cannot exceed 90/);
    expect(explainHardLimitError("meanShearDeg", -1)).toMatch(/cannot be below 0/);
  });

  it("rejects negative areas, fractional spot counts and non-finite values", () => {
    expect(explainHardLimitError("areaMsh", -5)).toMatch(/cannot be below 0/);
    expect(explainHardLimitError("areaMsh", 0)).toBeNull();
    expect(explainHardLimitError("spotCount", 2.5)).toMatch(/whole number/);
    expect(explainHardLimitError("spotCount", 12)).toBeNull();
    expect(explainHardLimitError("unsignedFluxMx", Number.POSITIVE_INFINITY)).toMatch(/finite/);
    expect(explainHardLimitError("logR", Number.NaN)).toMatch(/finite/);
    expect(explainHardLimitError("logR", undefined)).toBeNull();
  });

  it("lists every failing field", () => {
    const errors = hardLimitErrors({ meanShearDeg: 120, areaMsh: -1, logR: 3, spotCount: null });
    expect(errors.map((e) => e.field)).toEqual(["meanShearDeg", "areaMsh"]);
    expect(hardLimitErrors({ meanShearDeg: 30, areaMsh: 200 })).toEqual([]);
  });
});

describe("plausibility warnings", () => {
  it("warns an order of magnitude beyond the typical flux range 1e20–1e23 Mx (product brief)", () => {
    expect(plausibilityWarnings({ unsignedFluxMx: 1e22 })).toEqual([]);
    expect(plausibilityWarnings({ unsignedFluxMx: 5e24 })[0]?.message).toMatch(/unusually high/);
    expect(plausibilityWarnings({ unsignedFluxMx: 1e18 })[0]?.message).toMatch(/unusually low/);
  });

  it("warns for log R outside 0–6 and very large groups", () => {
    expect(plausibilityWarnings({ logR: 3.5 })).toEqual([]);
    expect(plausibilityWarnings({ logR: 7 }).map((w) => w.field)).toEqual(["logR"]);
    expect(plausibilityWarnings({ areaMsh: 8000 }).map((w) => w.field)).toEqual(["areaMsh"]);
    expect(plausibilityWarnings({ areaMsh: 800 })).toEqual([]);
  });

  it("warns when an area comes with no spots", () => {
    expect(plausibilityWarnings({ areaMsh: 100, spotCount: 0 })[0]?.message).toMatch(/spots is 0/);
    expect(plausibilityWarnings({ areaMsh: 100, spotCount: 3 })).toEqual([]);
  });

  it("leaves hard-limit failures to the errors instead of warning twice", () => {
    expect(plausibilityWarnings({ meanShearDeg: 120, areaMsh: -3 })).toEqual([]);
    expect(hardLimitErrors({ meanShearDeg: 120, areaMsh: -3 })).toHaveLength(2);
  });
});
