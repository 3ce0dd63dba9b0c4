// Heliographic locations of active regions as written in the trade: N12E34, S05W61.
// Latitude is north/south of the solar equator; longitude east/west of the central meridian.

export interface HeliographicLocation {
  /** Degrees, north positive. */
  latitudeDeg: number;
  /** Degrees from the central meridian, west positive, east negative. */
  longitudeDeg: number;
}

export type ParseLocationResult =
  { ok: true; location: HeliographicLocation } | { ok: false; error: string };

const LOCATION_PATTERN = /^([NS])(\d{1,2})([EW])(\d{1,2})$/;
const LOOSE_PATTERN = /^([A-Z])(\d*)([A-Z]?)(\d*)$/;

function explainMalformed(text: string): string {
  const loose = LOOSE_PATTERN.exec(text);
  if (!loose)
    return `Write the location as N12E34 (latitude N/S, then longitude E/W); got "${text}"`;
  const [, ns = "", lat = "", ew = "", lon = ""] = loose;
  if (ns !== "N" && ns !== "S") return `Latitude must start with N or S; got "${ns}"`;
  if (lat === "" || lat.length > 2) return "Latitude needs one or two digits of degrees, e.g. N05";
  if (ew !== "E" && ew !== "W") return "Longitude must follow the latitude as E or W, e.g. N05W12";
  if (lon === "" || lon.length > 2) return "Longitude needs one or two digits of degrees, e.g. W12";
  return `Write the location as N12E34; got "${text}"`;
}

/** Parses N12E34-style text (case-insensitive, surrounding blanks ignored). */
export function parseLocation(s: string): ParseLocationResult {
  const text = s.trim().toUpperCase();
  const match = LOCATION_PATTERN.exec(text);
  if (!match) return { ok: false, error: explainMalformed(text) };
  const [, ns, latText = "", ew, lonText = ""] = match;
  const lat = Number(latText);
  const lon = Number(lonText);
  if (lat > 90) return { ok: false, error: `Latitude ${lat}° is beyond the pole (at most 90°)` };
  if (lon > 90) {
    return {
      ok: false,
      error: `Longitude ${lon}° is beyond the limb (at most 90° from central meridian)`,
    };
  }
  // `|| 0` turns −0 (S00, E00) into 0 so that equality checks and formatting stay simple.
  return {
    ok: true,
    location: {
      latitudeDeg: (ns === "S" ? -lat : lat) || 0,
      longitudeDeg: (ew === "E" ? -lon : lon) || 0,
    },
  };
}

/** Formats to N12E34 with whole degrees; zero latitude is N00 and zero longitude W00. */
export function formatLocation(loc: HeliographicLocation): string {
  const lat = Math.round(loc.latitudeDeg);
  const lon = Math.round(loc.longitudeDeg);
  if (!Number.isFinite(lat) || Math.abs(lat) > 90 || !Number.isFinite(lon) || Math.abs(lon) > 90) {
    throw new RangeError(
      `Location out of range: latitude ${loc.latitudeDeg}, longitude ${loc.longitudeDeg}`,
    );
  }
  const pad = (n: number) => String(Math.abs(n)).padStart(2, "0");
  return `${lat < 0 ? "S" : "N"}${pad(lat)}${lon < 0 ? "E" : "W"}${pad(lon)}`;
}

const RAD = Math.PI / 180;

/**
 * Great-circle distance ρ from the sub-observer point (B0, central meridian), from the spherical
 * law of cosines cos ρ = sin B0 sin φ + cos B0 cos φ cos L (common spherical trigonometry),
 * evaluated in its haversine form sin²(ρ/2) = sin²((φ − B0)/2) + cos φ cos B0 sin²(L/2), which is
 * the same identity but keeps precision near disk centre, where acos of a value close to 1 loses
 * half the digits. B0, the heliographic latitude of the disk centre, stays within ±7.25°.
 */
export function angularDistanceFromDiskCentreDeg(loc: HeliographicLocation, b0Deg = 0): number {
  const phi = loc.latitudeDeg * RAD;
  const b0 = b0Deg * RAD;
  const sinHalfDLat = Math.sin((phi - b0) / 2);
  const sinHalfLon = Math.sin((loc.longitudeDeg * RAD) / 2);
  const h = sinHalfDLat ** 2 + Math.cos(phi) * Math.cos(b0) * sinHalfLon ** 2;
  // Clamp: rounding can push h a hair past 1, where asin would return NaN.
  return (2 * Math.asin(Math.sqrt(Math.min(1, Math.max(0, h))))) / RAD;
}

/** Beyond about 60° from disk centre, projection effects spoil magnetic metrics (common practice). */
export function isBeyondLimbThreshold(
  loc: HeliographicLocation,
  thresholdDeg = 60,
  b0Deg = 0,
): boolean {
  // The tolerance keeps a region exactly at the threshold (N00W60) inside despite rounding in acos.
  return angularDistanceFromDiskCentreDeg(loc, b0Deg) > thresholdDeg + 1e-9;
}
