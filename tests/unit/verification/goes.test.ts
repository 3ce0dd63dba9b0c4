import { describe, expect, it } from "vitest";
import {
  formatGoesClass,
  fromTrueFlux,
  meetsLevel,
  parseGoesClass,
  toTrueFlux,
} from "@/server/verification/goes";

function fluxOf(text: string): number {
  const parsed = parseGoesClass(text);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.fluxWm2;
}

describe("parseGoesClass (NOAA X-ray flare class definition)", () => {
  it("multiplies the decade by the number", () => {
    expect(parseGoesClass("M2.5")).toEqual({
      ok: true,
      letter: "M",
      magnitude: 2.5,
      fluxWm2: 2.5e-5,
    });
    expect(fluxOf("A1.0")).toBe(1e-8);
    expect(fluxOf("B3")).toBe(3e-7);
    expect(fluxOf("C9.9")).toBe(9.9e-6);
    expect(fluxOf("X1.0")).toBe(1e-4);
    // X is open-ended: X28 = 2.8e-3 (NOAA class definition).
    expect(fluxOf("X28")).toBe(2.8e-3);
  });

  it("builds the flux from the decimal text, not from a product that can round low", () => {
    // 1.1 × 1e-5 evaluates to 1.1000000000000001e-5, not the double nearest 1.1e-5 (IEEE 754).
    expect(fluxOf("M1.1")).toBe(Number("1.1e-5"));
    expect(fluxOf("M1.1")).not.toBe(1.1 * 1e-5);
    expect(fluxOf("M1.0")).toBeGreaterThanOrEqual(1e-5);
  });

  it("rejects malformed classes with a message", () => {
    for (const bad of ["M", "Q1.0", "", "M-1", "M1.", "1.0M", "M1.0e2", "MM1", "M 2.5"]) {
      const parsed = parseGoesClass(bad);
      expect(parsed.ok, bad).toBe(false);
      if (!parsed.ok) expect(parsed.message).toContain("not a GOES class");
    }
  });

  it("rejects multipliers outside 1.0 ≤ m < 10 below X, and below 1 for X", () => {
    const m10 = parseGoesClass("M10.0");
    expect(m10.ok).toBe(false);
    if (!m10.ok) expect(m10.message).toContain("X1.0");
    expect(parseGoesClass("C0.5").ok).toBe(false);
    expect(parseGoesClass("X0.9").ok).toBe(false);
    expect(parseGoesClass("M9.99").ok).toBe(true);
    expect(parseGoesClass("X10.0").ok).toBe(true);
  });

  it("accepts a lower-case letter and surrounding space", () => {
    expect(fluxOf(" m2.5 ")).toBe(2.5e-5);
  });
});

describe("formatGoesClass", () => {
  it("writes one decimal", () => {
    expect(formatGoesClass(2.5e-5)).toBe("M2.5");
    expect(formatGoesClass(1e-6)).toBe("C1.0");
    expect(formatGoesClass(2.8e-3)).toBe("X28.0");
    expect(formatGoesClass(3.04e-8)).toBe("A3.0");
  });

  it("moves a magnitude that rounds to 10 to the next letter", () => {
    expect(formatGoesClass(9.96e-6)).toBe("M1.0");
    expect(formatGoesClass(9.94e-6)).toBe("C9.9");
  });

  it("round-trips through parseGoesClass", () => {
    for (const text of ["A1.0", "B4.7", "C1.0", "C9.9", "M1.0", "M5.5", "X1.0", "X17.2"]) {
      expect(formatGoesClass(fluxOf(text))).toBe(text);
    }
  });

  it("throws for fluxes without a class", () => {
    expect(() => formatGoesClass(5e-9)).toThrow(/below A1.0/);
    expect(() => formatGoesClass(0)).toThrow(RangeError);
    expect(() => formatGoesClass(Number.NaN)).toThrow(RangeError);
    expect(() => formatGoesClass(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});

describe("meetsLevel (C+ ≥ C1.0, M+ ≥ M1.0, X ≥ X1.0)", () => {
  it("includes the threshold and excludes the class below", () => {
    expect(meetsLevel(fluxOf("C1.0"), "C+")).toBe(true);
    expect(meetsLevel(fluxOf("B9.9"), "C+")).toBe(false);
    expect(meetsLevel(fluxOf("M1.0"), "M+")).toBe(true);
    expect(meetsLevel(fluxOf("C9.9"), "M+")).toBe(false);
    expect(meetsLevel(fluxOf("X1.0"), "X")).toBe(true);
    expect(meetsLevel(fluxOf("M9.9"), "X")).toBe(false);
    expect(meetsLevel(fluxOf("X28"), "C+")).toBe(true);
  });

  it("keeps a converted flux on its threshold despite rounding", () => {
    // Legacy M7.0 is true X1.0 (7e-5 / 0.7 = 1e-4), but the double division gives 9.999999999999999e-5.
    const converted = toTrueFlux(fluxOf("M7.0"), "legacy-scaled");
    expect(converted).toBeLessThan(1e-4);
    expect(meetsLevel(converted, "X")).toBe(true);
    expect(formatGoesClass(converted)).toBe("X1.0");
    // A flux a part in 10⁶ below M1.0 is a C9.9-class flux, not M.
    expect(meetsLevel(1e-5 * (1 - 1e-6), "M+")).toBe(false);
  });

  it("rejects an unknown level", () => {
    expect(() => meetsLevel(1e-5, "Z" as never)).toThrow(/Unknown flare level/);
  });
});

describe("legacy-scaled and true flux (NOAA GOES-R XRS L2 Users Guide, 2020: true = legacy / 0.7)", () => {
  it("divides legacy fluxes by 0.7", () => {
    // Legacy M1.0 → true 1.4286e-5 (1e-5 / 0.7).
    expect(toTrueFlux(1e-5, "legacy-scaled")).toBeCloseTo(1.4286e-5, 9);
    expect(formatGoesClass(toTrueFlux(1e-5, "legacy-scaled"))).toBe("M1.4");
    expect(fromTrueFlux(1e-5, "legacy-scaled")).toBeCloseTo(7e-6, 15);
  });

  it("leaves true fluxes alone", () => {
    expect(toTrueFlux(2.5e-5, "true")).toBe(2.5e-5);
    expect(fromTrueFlux(2.5e-5, "true")).toBe(2.5e-5);
    expect(toTrueFlux(2.5e-5, "legacy-scaled")).not.toBe(2.5e-5);
  });

  it("a legacy C9.9 becomes a true M1.4 and crosses the M+ threshold", () => {
    const legacy = fluxOf("C9.9");
    expect(meetsLevel(legacy, "M+")).toBe(false);
    expect(meetsLevel(toTrueFlux(legacy, "legacy-scaled"), "M+")).toBe(true);
  });

  it("rejects an unknown convention and invalid fluxes", () => {
    expect(() => toTrueFlux(1e-5, "scaled" as never)).toThrow(/convention/);
    expect(() => fromTrueFlux(-1e-5, "true")).toThrow(RangeError);
  });
});
