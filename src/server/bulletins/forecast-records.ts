// The forecast records an issued bulletin leaves for verification (pure): the issued
// probabilities as source "forecaster", and each model's stored guidance as "model:<key>@<version>",
// per region × level × window, with the full disk as region null.
import {
  FLARE_LEVELS,
  WINDOW_HOURS,
  WINDOW_KEYS,
  type ProbabilityGrid,
} from "@/lib/domain/flare-levels";
import { combineFullDisk } from "@/server/scoring/full-disk";
import type { StoredGuidance } from "./day-guidance.db";
import type { IssuedBulletin } from "./issued-bulletin";

export interface ForecastRecordRow {
  source: string;
  issueTime: Date;
  regionNumber: string | null;
  level: string;
  windowHours: number;
  probability: number;
  bulletinId: number;
  isDemo: boolean;
}

export function modelSource(key: string, version: string): string {
  return `model:${key}@${version}`;
}

function gridRows(
  source: string,
  region: string | null,
  grid: ProbabilityGrid,
  b: IssuedBulletin,
): ForecastRecordRow[] {
  return FLARE_LEVELS.flatMap((level) =>
    WINDOW_KEYS.map((w) => ({
      source,
      issueTime: b.issueTime,
      regionNumber: region,
      level,
      windowHours: WINDOW_HOURS[w],
      probability: grid[level][w],
      bulletinId: b.id,
      isDemo: b.isDemo,
    })),
  );
}

/**
 * A model's full disk is 1 − Π(1 − Pᵢ) over its regions (independent regions, common practice),
 * kept only when the model scored every region of the bulletin: leaving a region out would make
 * the model look less confident than it was.
 */
export function buildForecastRecords(
  bulletin: IssuedBulletin,
  stored: readonly StoredGuidance[],
): ForecastRecordRow[] {
  const rows = gridRows("forecaster", null, bulletin.fullDisk, bulletin);
  for (const r of bulletin.regions)
    rows.push(...gridRows("forecaster", r.region, r.probabilities, bulletin));
  const issuedRegions = new Set(bulletin.regions.map((r) => r.region));
  const byModel = new Map<string, ProbabilityGrid[]>();
  for (const g of stored) {
    if (!g.probabilities || !issuedRegions.has(g.region)) continue;
    const source = modelSource(g.modelKey, g.modelVersion);
    rows.push(...gridRows(source, g.region, g.probabilities, bulletin));
    byModel.set(source, [...(byModel.get(source) ?? []), g.probabilities]);
  }
  for (const [source, grids] of byModel) {
    if (grids.length === issuedRegions.size)
      rows.push(...gridRows(source, null, combineFullDisk(grids), bulletin));
  }
  return rows;
}
