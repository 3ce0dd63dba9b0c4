// Where a demo sunspot group is on the disk and how large it is at a given time (demo — invented).

import type { SpotGroup } from "./groups";

/**
 * Synodic rotation of the Carrington frame, 360°/27.2753 d ≈ 13.2°/day (common practice); the
 * archive ignores differential rotation and proper motions.
 */
export const SYNODIC_DEG_PER_DAY = 13.2;

/** Groups below this area show no spots and are left out of the day's assessments. */
export const MIN_VISIBLE_AREA_MSH = 3;

/** Central-meridian distance at time t (days), west positive, wrapped into (−180°, 180°]. */
export function centralMeridianDistanceDeg(group: SpotGroup, t: number): number {
  const raw = group.emergenceLongitudeDeg + SYNODIC_DEG_PER_DAY * (t - group.emergedAt);
  const wrapped = ((((raw + 180) % 360) + 360) % 360) - 180;
  return wrapped === -180 ? 180 : wrapped;
}

export function isOnVisibleDisk(longitudeDeg: number): boolean {
  return longitudeDeg >= -90 && longitudeDeg <= 90;
}

/**
 * Area without the day-to-day noise: a linear rise to the peak, then the linear decay of the
 * Gnevyshev–Waldmeier picture (area falling at a constant rate until the group is gone; from
 * memory). Zero before emergence and after the end of life.
 */
export function computeSmoothArea(group: SpotGroup, t: number): number {
  const age = t - group.emergedAt;
  if (age < 0 || age > group.lifetimeDays) return 0;
  if (age <= group.riseDays) return group.peakAreaMsh * (age / group.riseDays);
  return (group.peakAreaMsh * (group.lifetimeDays - age)) / (group.lifetimeDays - group.riseDays);
}

export function isDecaying(group: SpotGroup, t: number): boolean {
  return t - group.emergedAt > group.riseDays;
}

/**
 * Complexity as seen on the day: the group's trait, strongest near its peak area and halved in
 * its earliest and latest days, so delta spots and compactness come and go with the area.
 */
export function computeEffectiveComplexity(group: SpotGroup, smoothArea: number): number {
  return group.complexity * (0.5 + (0.5 * smoothArea) / group.peakAreaMsh);
}
