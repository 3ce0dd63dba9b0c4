// Shapes verification results into chart data (pure; the chart components only draw).
import type {
  ReliabilityBinJson,
  RocPointJson,
  ScoreJson,
  SweepRowJson,
  TimelinePointJson,
} from "@/lib/query/verification";

export interface XY {
  x: number;
  y: number;
}

/** The no-skill diagonal of the reliability diagram and the ROC curve. */
export const DIAGONAL: readonly XY[] = [
  { x: 0, y: 0 },
  { x: 1, y: 1 },
];

const valueOf = (s: ScoreJson): number | null => s.value;

/**
 * At most `max` points, evenly spaced by index, always keeping both ends. The ROC curve has one
 * point per distinct forecast value (thousands for a model); drawing a few hundred loses nothing
 * visible, and the area is computed on the full curve before thinning.
 */
export function thinRocPoints(points: readonly RocPointJson[], max = 201): RocPointJson[] {
  if (max < 2) throw new Error(`Keep at least 2 points; got ${max}`);
  if (points.length <= max) return [...points];
  const last = points.length - 1;
  const picked: RocPointJson[] = [];
  let previous = -1;
  for (let k = 0; k < max; k++) {
    const i = Math.round((k * last) / (max - 1));
    if (i !== previous) picked.push(points[i] as RocPointJson);
    previous = i;
  }
  return picked;
}

export function toRocChartData(points: readonly RocPointJson[]): XY[] {
  return points.map((p) => ({ x: p.pofd, y: p.pod }));
}

export interface ReliabilityPoint {
  /** Mean forecast of the bin. */
  x: number;
  /** Observed frequency of the bin. */
  y: number;
  count: number;
  bin: string;
}

export interface CountBar {
  bin: string;
  count: number;
  events: number;
}

const binLabel = (b: ReliabilityBinJson) => `${b.lower.toFixed(1)}–${b.upper.toFixed(1)}`;

/** Points for the non-empty bins (empty ones have no mean forecast) and a bar per bin. */
export function toReliabilityChartData(bins: readonly ReliabilityBinJson[]): {
  points: ReliabilityPoint[];
  counts: CountBar[];
} {
  const points: ReliabilityPoint[] = [];
  for (const b of bins) {
    const x = valueOf(b.meanForecast);
    const y = valueOf(b.observedFrequency);
    if (x !== null && y !== null) points.push({ x, y, count: b.count, bin: binLabel(b) });
  }
  return {
    points,
    counts: bins.map((b) => ({ bin: binLabel(b), count: b.count, events: b.events })),
  };
}

export interface SweepPoint {
  threshold: number;
  tss: number | null;
  hss: number | null;
}

export function toSweepChartData(rows: readonly SweepRowJson[]): SweepPoint[] {
  return rows.map((r) => ({ threshold: r.threshold, tss: valueOf(r.tss), hss: valueOf(r.hss) }));
}

export interface TimelinePoint {
  day: string;
  source: number | null;
  reference: number | null;
}

/** Timeline rows; the reference line only when the reference has any point. */
export function toTimelineChartData(points: readonly TimelinePointJson[]): {
  rows: TimelinePoint[];
  hasReference: boolean;
} {
  return {
    rows: points.map((p) => ({ day: p.day, source: p.source, reference: p.reference })),
    hasReference: points.some((p) => p.reference !== null),
  };
}
