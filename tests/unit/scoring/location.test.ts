import { describe, expect, it } from "vitest";
import {
  angularDistanceFromDiskCentreDeg,
  formatLocation,
  isBeyondLimbThreshold,
  parseLocation,
  type HeliographicLocation,
} from "@/lib/domain/location";
import reference from "./fixtures/reference-values.json";

function parsed(s: string): HeliographicLocation {
  const result = parseLocation(s);
  if (!result.ok) throw new Error(`expected ${s} to parse: ${result.error}`);
  return result.location;
}

describe("parseLocation", () => {
  // Sign convention: north and west positive, east negative, longitude from the central meridian
  // (common practice).
  it("reads N/S latitude and E/W longitude (N positive, W positive)", () => {
    expect(parsed("N12E34")).toEqual({ latitudeDeg: 12, longitudeDeg: -34 });
    expect(parsed("S05W61")).toEqual({ latitudeDeg: -5, longitudeDeg: 61 });
    expect(parsed("N5W7")).toEqual({ latitudeDeg: 5, longitudeDeg: 7 });
    expect(parsed(" n90e90 ")).toEqual({ latitudeDeg: 90, longitudeDeg: -90 });
  });

  it("gives plain zero, not −0, at the equator and central meridian", () => {
    const loc = parsed("S00E00");
    expect(Object.is(loc.latitudeDeg, 0)).toBe(true);
    expect(Object.is(loc.longitudeDeg, 0)).toBe(true);
  });

  it.each([
    ["N95E10", /95° is beyond the pole/],
    ["N12E91", /91° is beyond the limb/],
    ["X12E34", /must start with N or S/],
    ["N12E", /Longitude needs one or two digits/],
    ["N123E10", /Latitude needs one or two digits/],
    ["N12Q10", /E or W/],
    ["N12.5E10", /Write the location as N12E34/],
    ["", /Write the location as N12E34/],
  ])("rejects %s", (text, message) => {
    const result = parseLocation(text);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error).toMatch(message);
  });
});

describe("formatLocation", () => {
  it("writes two-digit degrees and round-trips", () => {
    expect(formatLocation({ latitudeDeg: -5, longitudeDeg: -7 })).toBe("S05E07");
    expect(formatLocation(parsed("N12E34"))).toBe("N12E34");
    expect(formatLocation({ latitudeDeg: 0, longitudeDeg: 0 })).toBe("N00W00");
    expect(formatLocation({ latitudeDeg: 12.4, longitudeDeg: 33.6 })).toBe("N12W34");
  });

  it("refuses locations off the visible hemisphere", () => {
    expect(() => formatLocation({ latitudeDeg: 0, longitudeDeg: 120 })).toThrow(RangeError);
    expect(() => formatLocation({ latitudeDeg: Number.NaN, longitudeDeg: 0 })).toThrow(RangeError);
  });
});

describe("angular distance from disk centre", () => {
  // cos ρ = sin B0 sin φ + cos B0 cos φ cos L (spherical law of cosines; common spherical trigonometry).
  it("is 0° at centre, L on the equator, and 60° at N45W45 (cos ρ = cos²45° = ½)", () => {
    expect(angularDistanceFromDiskCentreDeg(parsed("N00E00"))).toBeCloseTo(0, 9);
    expect(angularDistanceFromDiskCentreDeg(parsed("N00W60"))).toBeCloseTo(60, 9);
    expect(angularDistanceFromDiskCentreDeg(parsed("N00E60"))).toBeCloseTo(60, 9);
    expect(angularDistanceFromDiskCentreDeg(parsed("N45W45"))).toBeCloseTo(60, 9);
    // Negative case: the distance is not the sum |φ| + |L| of the offsets.
    expect(angularDistanceFromDiskCentreDeg(parsed("N45W45"))).not.toBeCloseTo(90, 1);
  });

  it("shifts with B0: the centre region is B0 away from the sub-observer point", () => {
    expect(angularDistanceFromDiskCentreDeg(parsed("N00W00"), 7.25)).toBeCloseTo(7.25, 9);
    expect(angularDistanceFromDiskCentreDeg(parsed("N07W00"), 7)).toBeCloseTo(0, 9);
  });

  it("matches NumPy's vector-angle computation", () => {
    // Source: tests/unit/scoring/fixtures/make-reference-values.py (NumPy atan2 of cross and dot).
    for (const c of reference.greatCircle) {
      const rho = angularDistanceFromDiskCentreDeg(
        { latitudeDeg: c.latitudeDeg, longitudeDeg: c.longitudeDeg },
        c.b0Deg,
      );
      expect(rho, JSON.stringify(c)).toBeCloseTo(c.rhoDeg, 9);
    }
    expect(reference.greatCircle.length).toBeGreaterThan(3);
  });

  it("flags regions beyond 60° (common practice), not those at or inside it", () => {
    expect(isBeyondLimbThreshold(parsed("N00W60"))).toBe(false);
    expect(isBeyondLimbThreshold(parsed("N00W61"))).toBe(true);
    // cos ρ = cos 30° cos 55° ≈ 0.4967 → ρ ≈ 60.2°, beyond though neither offset reaches 60°.
    expect(isBeyondLimbThreshold(parsed("N30W55"))).toBe(true);
    expect(isBeyondLimbThreshold(parsed("S10E45"))).toBe(false);
    expect(isBeyondLimbThreshold(parsed("S10E45"), 40)).toBe(true);
  });
});
