// Labels archived region-days with what the region then did: flares per GOES class and, per
// level, whether an event occurred, by one stated rule (pure).
import type { FlareCounts } from "@/lib/domain/assessment-input";
import { FLARE_LEVELS, type FlareLevel } from "@/lib/domain/flare-levels";
import { meetsLevel } from "@/server/verification/goes";
import { lowerBound, matchForecasts, normaliseRegion, type MatchEvent } from "./matching";

const DAY_MS = 86_400_000;

/**
 * The archive rule: a region-day (region R assessed on UTC day D) is an event for level L when a
 * flare ≥ L attributed to R peaks in [D 00:00 UTC, D 00:00 UTC + window), the window 24 h unless
 * a model was fitted for another; thresholds on true flux. Flares with no region never count
 * for a region-day. The 24 h flare counts use the same interval.
 */
export const ARCHIVE_RULE =
  "A region-day (region R assessed on UTC day D) is an event for level L when a flare at or above L, attributed to R, peaks in [D 00:00 UTC, D 00:00 UTC + 24 h) (or the model's own window); thresholds apply to true flux. Flares without a region never count for a region-day.";

export interface RegionDayKey {
  region: string;
  /** YYYY-MM-DD (UTC). */
  day: string;
}

export function dayStartMs(day: string): number {
  return Date.parse(`${day}T00:00:00Z`);
}

/** The exclusive GOES class of a true peak flux for the rate fits; below C1.0 is not counted. */
function classOf(fluxTrue: number): keyof FlareCounts | null {
  if (meetsLevel(fluxTrue, "X")) return "X";
  if (meetsLevel(fluxTrue, "M+")) return "M";
  if (meetsLevel(fluxTrue, "C+")) return "C";
  return null;
}

/** Flares of each exclusive class from the region peaking in [D, D + 24 h), by binary search. */
export function countRegionDayFlares(
  days: readonly RegionDayKey[],
  events: readonly MatchEvent[],
): FlareCounts[] {
  const byRegionClass = new Map<string, number[]>();
  for (const e of events) {
    const region = normaliseRegion(e.regionNumber);
    const cls = classOf(e.peakFluxTrue);
    if (region === null || cls === null) continue;
    const key = `${region}|${cls}`;
    const list = byRegionClass.get(key);
    if (list) list.push(e.peakTimeMs);
    else byRegionClass.set(key, [e.peakTimeMs]);
  }
  const sorted = new Map([...byRegionClass].map(([k, v]) => [k, Float64Array.from(v).sort()]));
  const empty = new Float64Array(0);
  return days.map((d) => {
    const start = dayStartMs(d.day);
    const region = normaliseRegion(d.region) ?? "";
    const countIn = (cls: keyof FlareCounts) => {
      const times = sorted.get(`${region}|${cls}`) ?? empty;
      return lowerBound(times, start + DAY_MS) - lowerBound(times, start);
    };
    return { C: countIn("C"), M: countIn("M"), X: countIn("X") };
  });
}

/** Per level, o = 1 when the region-day is an event under the archive rule. */
export function labelRegionDays(
  days: readonly RegionDayKey[],
  events: readonly MatchEvent[],
  windowHours = 24,
): Record<FlareLevel, Uint8Array> {
  const out = {} as Record<FlareLevel, Uint8Array>;
  for (const level of FLARE_LEVELS) {
    const forecasts = days.map((d) => ({
      issueTimeMs: dayStartMs(d.day),
      regionNumber: d.region,
      level,
      windowHours,
    }));
    out[level] = matchForecasts(forecasts, events, "true");
  }
  return out;
}
