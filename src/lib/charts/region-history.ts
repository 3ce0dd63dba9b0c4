// Shapes a region's assessments across days into chart points (pure; the chart only draws).
export interface RegionHistoryItem {
  forecastDay: string;
  areaMsh: number | null;
  unsignedFluxMx: number | null;
  blended: Record<string, Record<string, number>> | null;
  finals: Record<string, Record<string, number>> | null;
}

export interface RegionChartPoint {
  day: string;
  areaMsh: number | null;
  /** Flux in units of 1e22 Mx so the axis reads simply. */
  flux22: number | null;
  finalC: number | null;
  finalM: number | null;
  finalX: number | null;
  guidanceM: number | null;
}

const percent = (p: number | undefined) => (p === undefined ? null : Math.round(p * 1000) / 10);

export function toRegionChartData(items: readonly RegionHistoryItem[]): RegionChartPoint[] {
  return [...items]
    .sort((a, b) => a.forecastDay.localeCompare(b.forecastDay))
    .map((a) => ({
      day: a.forecastDay,
      areaMsh: a.areaMsh,
      flux22: a.unsignedFluxMx === null ? null : Math.round((a.unsignedFluxMx / 1e22) * 1000) / 1000,
      finalC: percent(a.finals?.["C+"]?.["24h"]),
      finalM: percent(a.finals?.["M+"]?.["24h"]),
      finalX: percent(a.finals?.X?.["24h"]),
      guidanceM: percent(a.blended?.["M+"]?.["24h"]),
    }));
}
