// Full-disk forecasts of one archive day and the flat forecast records of the whole archive.

import {
  FLARE_LEVELS,
  WINDOW_HOURS,
  WINDOW_KEYS,
  type FlareLevel,
  type ProbabilityGrid,
} from "@/lib/domain/flare-levels";
import { combineFullDisk } from "@/server/scoring/full-disk";
import type { ArchiveDay, ArchiveRegionDay, DemoArchive, FullDiskForecast } from "./archive-types";
import { formatModelSource, listDemoScorers } from "./guidance";

export const FORECASTER_SOURCE = "forecaster";

/**
 * Full disk by 1 − Π(1 − Pᵢ) over the day's regions (combineFullDisk; common practice). A model
 * that could not score some region that day gets no full-disk forecast, since leaving the region
 * out would understate the disk's probability.
 */
export function summariseDay(
  day: string,
  issueTime: string,
  rows: readonly ArchiveRegionDay[],
): ArchiveDay {
  const fullDisk: FullDiskForecast[] = [
    { source: FORECASTER_SOURCE, probabilities: combineFullDisk(rows.map((r) => r.finals)) },
  ];
  for (const model of listDemoScorers()) {
    const grids = rows.map(
      (r) => r.guidance.find((g) => g.key === model.key)?.probabilities ?? null,
    );
    if (grids.some((g) => g === null)) continue;
    fullDisk.push({
      source: formatModelSource(model.key, model.version),
      probabilities: combineFullDisk(grids as ProbabilityGrid[]),
    });
  }
  return { day, issueTime, regionNumbers: rows.map((r) => r.regionNumber), fullDisk };
}

export interface ArchiveForecastRecord {
  source: string;
  issueTime: string;
  /** null for the full disk. */
  regionNumber: string | null;
  level: FlareLevel;
  windowHours: number;
  probability: number;
}

function pushGrid(
  out: ArchiveForecastRecord[],
  source: string,
  issueTime: string,
  regionNumber: string | null,
  grid: ProbabilityGrid,
): void {
  for (const level of FLARE_LEVELS) {
    for (const window of WINDOW_KEYS) {
      out.push({
        source,
        issueTime,
        regionNumber,
        level,
        windowHours: WINDOW_HOURS[window],
        probability: grid[level][window],
      });
    }
  }
}

/** Nine records (3 levels × 24/48/72 h) per source for every region-day and every day's full disk. */
export function listForecastRecords(archive: DemoArchive): ArchiveForecastRecord[] {
  const out: ArchiveForecastRecord[] = [];
  for (const r of archive.regionDays) {
    pushGrid(out, FORECASTER_SOURCE, r.issueTime, r.regionNumber, r.finals);
    for (const g of r.guidance) {
      if (g.probabilities)
        pushGrid(
          out,
          formatModelSource(g.key, g.version),
          r.issueTime,
          r.regionNumber,
          g.probabilities,
        );
    }
  }
  for (const d of archive.dayRecords) {
    for (const f of d.fullDisk) pushGrid(out, f.source, d.issueTime, null, f.probabilities);
  }
  return out;
}
