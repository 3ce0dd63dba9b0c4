import { describe, expect, it } from "vitest";
import {
  explainMountWilsonError,
  hasDelta,
  isValidMountWilson,
  MOUNT_WILSON_CLASSES,
  MOUNT_WILSON_SYMBOLS,
} from "@/lib/domain/mount-wilson";

describe("Mount Wilson classes", () => {
  it("has the eight classes of the trade (product brief)", () => {
    expect([...MOUNT_WILSON_CLASSES].sort()).toEqual([
      "alpha",
      "beta",
      "beta-delta",
      "beta-gamma",
      "beta-gamma-delta",
      "delta",
      "gamma",
      "gamma-delta",
    ]);
    for (const cls of MOUNT_WILSON_CLASSES) expect(MOUNT_WILSON_SYMBOLS[cls]).toBeTruthy();
    expect(MOUNT_WILSON_SYMBOLS["beta-gamma-delta"]).toBe("β-γ-δ");
  });

  it("finds the delta configuration only where the class names it", () => {
    const withDelta = MOUNT_WILSON_CLASSES.filter(hasDelta);
    expect(withDelta.sort()).toEqual(["beta-delta", "beta-gamma-delta", "delta", "gamma-delta"]);
    expect(hasDelta("beta-gamma")).toBe(false);
    expect(hasDelta("alpha")).toBe(false);
  });

  it("rejects other spellings and hints at case", () => {
    expect(isValidMountWilson("beta-delta-gamma")).toBe(false);
    expect(isValidMountWilson("Beta")).toBe(false);
    expect(isValidMountWilson(null)).toBe(false);
    expect(explainMountWilsonError("Beta")).toMatch(/lower case: beta/);
    expect(explainMountWilsonError("epsilon")).toMatch(/must be one of/);
    expect(explainMountWilsonError("beta")).toBeNull();
  });
});
