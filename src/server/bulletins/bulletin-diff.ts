// What changed from the last issued bulletin to this one (pure): full-disk cells old → new,
// regions added, removed or with changed probabilities, and whether the discussion changed.
import {
  FLARE_LEVELS,
  WINDOW_KEYS,
  type FlareLevel,
  type ProbabilityGrid,
  type WindowKey,
} from "@/lib/domain/flare-levels";
import type { IssuedBulletin } from "./issued-bulletin";

export interface CellChange {
  level: FlareLevel;
  window: WindowKey;
  before: number | null;
  after: number;
  isChanged: boolean;
}

export interface BulletinChanges {
  previous: { id: number; version: number; forecastDay: string; issueTime: Date } | null;
  fullDisk: CellChange[];
  regionsAdded: string[];
  regionsRemoved: string[];
  regionsChanged: { region: string; cells: CellChange[] }[];
  isDiscussionChanged: boolean;
  hasChanges: boolean;
}

// Finals are typed to 0.1 percentage point; anything smaller is rounding, not a change.
const TOLERANCE = 0.0005;

export function diffGrids(before: ProbabilityGrid | null, after: ProbabilityGrid): CellChange[] {
  return FLARE_LEVELS.flatMap((level) =>
    WINDOW_KEYS.map((window) => {
      const old = before ? before[level][window] : null;
      const now = after[level][window];
      return {
        level,
        window,
        before: old,
        after: now,
        isChanged: old === null || Math.abs(old - now) > TOLERANCE,
      };
    }),
  );
}

export function diffBulletins(
  previous: IssuedBulletin | null,
  current: IssuedBulletin,
): BulletinChanges {
  const oldRegions = new Map((previous?.regions ?? []).map((r) => [r.region, r]));
  const newRegions = new Set(current.regions.map((r) => r.region));
  const regionsAdded = current.regions
    .filter((r) => !oldRegions.has(r.region))
    .map((r) => r.region);
  const regionsRemoved = [...oldRegions.keys()].filter((r) => !newRegions.has(r));
  const regionsChanged = current.regions.flatMap((r) => {
    const old = oldRegions.get(r.region);
    if (!old) return [];
    const cells = diffGrids(old.probabilities, r.probabilities).filter((c) => c.isChanged);
    return cells.length ? [{ region: r.region, cells }] : [];
  });
  const fullDisk = diffGrids(previous?.fullDisk ?? null, current.fullDisk);
  const isDiscussionChanged = (previous?.discussion.trim() ?? "") !== current.discussion.trim();
  return {
    previous: previous && {
      id: previous.id,
      version: previous.version,
      forecastDay: previous.forecastDay,
      issueTime: previous.issueTime,
    },
    fullDisk,
    regionsAdded,
    regionsRemoved,
    regionsChanged,
    isDiscussionChanged,
    hasChanges:
      fullDisk.some((c) => c.isChanged) ||
      regionsAdded.length > 0 ||
      regionsRemoved.length > 0 ||
      regionsChanged.length > 0 ||
      isDiscussionChanged,
  };
}
