// Emergence of the demo archive's sunspot groups and their fixed traits (demo — invented).

import { drawExponential, drawNormal, drawUniform, type Random } from "./random";

/** One sunspot group over its whole life, on the visible disk or not. Times in days from the archive start (00:00 UTC). */
export interface SpotGroup {
  id: number;
  emergedAt: number;
  /** Central-meridian distance at emergence, degrees, west positive, in (−180, 180]. */
  emergenceLongitudeDeg: number;
  latitudeDeg: number;
  peakAreaMsh: number;
  riseDays: number;
  lifetimeDays: number;
  /** 0–1: how magnetically complex the group becomes (drives compactness, delta spots, shear). */
  complexity: number;
  /** Whether the leading spot's penumbra is asymmetric (McIntosh p = a or k when large enough). */
  isAsymmetric: boolean;
}

export const GROUP_PARAMETERS = {
  /** Emergences per day over the whole Sun; about half happen on the far side. */
  emergencePerDay: 0.8,
  /** Groups emerge this long before the archive starts, so the disk is populated on day 0. */
  burnInDays: 120,
  /** Peak area is log-normal: median and σ of ln(area). */
  peakAreaMedianMsh: 90,
  peakAreaSigmaLn: 1.0,
  peakAreaRangeMsh: [6, 3000] as const,
  /** Gnevyshev–Waldmeier rule A_max ≈ W·T with W ≈ 10 MSH/day (from memory). */
  waldmeierMshPerDay: 10,
  lifetimeRangeDays: [2, 120] as const,
  /** |latitude| ~ N(15°, 7°) kept in the activity belts 2°–40° (belts: common practice). */
  latitudeMeanDeg: 15,
  latitudeSdDeg: 7,
  latitudeRangeDeg: [2, 40] as const,
} as const;

const P = GROUP_PARAMETERS;

function clamp(x: number, low: number, high: number): number {
  return Math.min(high, Math.max(low, x));
}

function drawLatitude(random: Random): number {
  const [low, high] = P.latitudeRangeDeg;
  let magnitude = drawNormal(random, P.latitudeMeanDeg, P.latitudeSdDeg);
  while (magnitude < low || magnitude > high) {
    magnitude = drawNormal(random, P.latitudeMeanDeg, P.latitudeSdDeg);
  }
  return random() < 0.5 ? -magnitude : magnitude;
}

function drawGroup(id: number, emergedAt: number, random: Random): SpotGroup {
  const [aLow, aHigh] = P.peakAreaRangeMsh;
  const peakAreaMsh = clamp(
    P.peakAreaMedianMsh * Math.exp(drawNormal(random, 0, P.peakAreaSigmaLn)),
    aLow,
    aHigh,
  );
  const [tLow, tHigh] = P.lifetimeRangeDays;
  const lifetimeDays = clamp(peakAreaMsh / P.waldmeierMshPerDay, tLow, tHigh);
  // Growth is fast and decay slow (common practice): the peak comes within the first third.
  const riseDays = Math.min(lifetimeDays / 3, drawUniform(random, 1.5, 7));
  // Squaring a uniform makes most groups simple and a few very complex.
  const complexity = random() ** 2;
  return {
    id,
    emergedAt,
    emergenceLongitudeDeg: drawUniform(random, -180, 180),
    latitudeDeg: drawLatitude(random),
    peakAreaMsh,
    riseDays,
    lifetimeDays,
    complexity,
    isAsymmetric: random() < 0.25 + 0.6 * complexity,
  };
}

/** Groups emerging as a Poisson process over [−burn-in, days). */
export function generateGroups(days: number, random: Random): SpotGroup[] {
  const groups: SpotGroup[] = [];
  let t = -P.burnInDays + drawExponential(random, P.emergencePerDay);
  while (t < days) {
    groups.push(drawGroup(groups.length, t, random));
    t += drawExponential(random, P.emergencePerDay);
  }
  return groups;
}
