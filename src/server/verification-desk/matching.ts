// Matches forecast records to observed flares: o = 1 when a flare at or above the level peaks
// inside the validity window (pure; sorted peak times and binary search).
import { FLARE_LEVELS, type FlareLevel } from "@/lib/domain/flare-levels";
import { fromTrueFlux, meetsLevel } from "@/server/verification/goes";

/**
 * "true": level thresholds apply to the true flux (GOES-16 onward, reprocessed GOES 13–15).
 * "legacy": they apply to the legacy-scaled flux (true × 0.7) so scores compare with tables
 * derived from operational GOES 8–15 lists (NOAA GOES-R XRS L2 Users Guide, 2020).
 */
export type MatchConvention = "true" | "legacy";

export interface MatchForecast {
  issueTimeMs: number;
  /** null for a full-disk forecast. */
  regionNumber: string | null;
  level: FlareLevel;
  windowHours: number;
}

export interface MatchEvent {
  peakTimeMs: number;
  /** Normalised true peak flux, W m⁻². */
  peakFluxTrue: number;
  regionNumber: string | null;
}

const HOUR_MS = 3_600_000;

/** Region numbers compare case-blind and without surrounding spaces ("hr-0412 " = "HR-0412"). */
export function normaliseRegion(region: string | null | undefined): string | null {
  const text = (region ?? "").trim().toUpperCase();
  return text === "" ? null : text;
}

/** Whether an event's peak flux meets a level in the chosen convention. */
export function eventMeetsLevel(
  peakFluxTrue: number,
  level: FlareLevel,
  convention: MatchConvention,
): boolean {
  const flux = convention === "legacy" ? fromTrueFlux(peakFluxTrue, "legacy-scaled") : peakFluxTrue;
  return meetsLevel(flux, level);
}

interface LevelIndex {
  fullDisk: Float64Array;
  byRegion: Map<string, Float64Array>;
}

const EMPTY = new Float64Array(0);

function sortedTimes(times: number[]): Float64Array {
  // The typed-array sort is numeric without a comparator.
  return Float64Array.from(times).sort();
}

/** Peak times of the events meeting a level, sorted, for the full disk and per region. */
function indexLevel(
  events: readonly MatchEvent[],
  level: FlareLevel,
  convention: MatchConvention,
): LevelIndex {
  const all: number[] = [];
  const perRegion = new Map<string, number[]>();
  for (const e of events) {
    if (!eventMeetsLevel(e.peakFluxTrue, level, convention)) continue;
    all.push(e.peakTimeMs);
    const region = normaliseRegion(e.regionNumber);
    if (region === null) continue;
    const list = perRegion.get(region);
    if (list) list.push(e.peakTimeMs);
    else perRegion.set(region, [e.peakTimeMs]);
  }
  const byRegion = new Map<string, Float64Array>();
  for (const [region, times] of perRegion) byRegion.set(region, sortedTimes(times));
  return { fullDisk: sortedTimes(all), byRegion };
}

/** Index of the first value ≥ t in an ascending array (its length when none is). */
export function lowerBound(sorted: Float64Array, t: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((sorted[mid] as number) < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * o = 1 when a flare meeting the forecast's level peaks in [issue time, issue time + window):
 * the window opens at the issue time and excludes its end, so back-to-back windows never share a
 * flare (windows start at the bulletin's issue time: product rule). Region forecasts count only
 * flares attributed to that region; full-disk forecasts count every flare. Sorting the events of
 * each level once costs O(m log m); each forecast is one binary search, O(n log m) in all.
 */
export function matchForecasts(
  forecasts: readonly MatchForecast[],
  events: readonly MatchEvent[],
  convention: MatchConvention = "true",
): Uint8Array {
  const indexes = new Map<FlareLevel, LevelIndex>();
  const outcomes = new Uint8Array(forecasts.length);
  for (let i = 0; i < forecasts.length; i++) {
    const f = forecasts[i] as MatchForecast;
    if (!FLARE_LEVELS.includes(f.level))
      throw new Error(`Forecast ${i}: unknown level "${String(f.level)}"`);
    if (!(f.windowHours > 0) || !Number.isFinite(f.issueTimeMs)) {
      throw new Error(`Forecast ${i}: the issue time and a window > 0 h are required`);
    }
    let index = indexes.get(f.level);
    if (!index) {
      index = indexLevel(events, f.level, convention);
      indexes.set(f.level, index);
    }
    const region = normaliseRegion(f.regionNumber);
    const times = region === null ? index.fullDisk : (index.byRegion.get(region) ?? EMPTY);
    const first = lowerBound(times, f.issueTimeMs);
    outcomes[i] =
      first < times.length && (times[first] as number) < f.issueTimeMs + f.windowHours * HOUR_MS
        ? 1
        : 0;
  }
  return outcomes;
}
