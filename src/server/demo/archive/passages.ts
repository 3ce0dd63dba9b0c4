// Disk passages of the demo groups: the forecast days on which each group shows spots on the
// visible disk, one office region number per passage (a group back from the far side is renumbered).

import { ISSUE_MINUTES_AFTER_MIDNIGHT } from "./calendar";
import {
  centralMeridianDistanceDeg,
  computeSmoothArea,
  isOnVisibleDisk,
  MIN_VISIBLE_AREA_MSH,
} from "./evolution";
import type { SpotGroup } from "./groups";

/** Time of the issue of forecast day d, in days from the archive start. */
export function computeIssueOffsetDays(dayIndex: number): number {
  return dayIndex + ISSUE_MINUTES_AFTER_MIDNIGHT / 1440;
}

export interface Visit {
  dayIndex: number;
  t: number;
  longitudeDeg: number;
  smoothArea: number;
}

export interface Passage {
  group: SpotGroup;
  number: number;
  visits: Visit[];
}

function listVisits(group: SpotGroup, days: number): Visit[] {
  const visits: Visit[] = [];
  const first = Math.max(0, Math.floor(group.emergedAt));
  const last = Math.min(days - 1, Math.ceil(group.emergedAt + group.lifetimeDays));
  for (let d = first; d <= last; d++) {
    const t = computeIssueOffsetDays(d);
    const smoothArea = computeSmoothArea(group, t);
    const longitudeDeg = centralMeridianDistanceDeg(group, t);
    if (smoothArea >= MIN_VISIBLE_AREA_MSH && isOnVisibleDisk(longitudeDeg)) {
      visits.push({ dayIndex: d, t, longitudeDeg, smoothArea });
    }
  }
  return visits;
}

function splitRuns(visits: Visit[]): Visit[][] {
  const runs: Visit[][] = [];
  for (const v of visits) {
    const run = runs[runs.length - 1];
    const previous = run?.[run.length - 1];
    if (run && previous && previous.dayIndex === v.dayIndex - 1) run.push(v);
    else runs.push([v]);
  }
  return runs;
}

/**
 * Numbers follow the order regions are first seen; among regions first seen on the same day
 * (the disk on the archive's first day), the one furthest west came onto the disk first.
 */
export function listPassages(
  groups: readonly SpotGroup[],
  days: number,
  firstNumber: number,
): Passage[] {
  const unnumbered = groups.flatMap((group) =>
    splitRuns(listVisits(group, days)).map((visits) => ({ group, visits })),
  );
  const firstOf = (p: { visits: Visit[] }) => p.visits[0] as Visit;
  unnumbered.sort(
    (a, b) =>
      firstOf(a).dayIndex - firstOf(b).dayIndex ||
      firstOf(b).longitudeDeg - firstOf(a).longitudeDeg ||
      a.group.id - b.group.id,
  );
  return unnumbered.map((p, i) => ({ ...p, number: firstNumber + i }));
}

/** HR-0412 style: the office prefix and at least four digits. */
export function formatRegionNumber(n: number): string {
  return `HR-${String(n).padStart(4, "0")}`;
}
