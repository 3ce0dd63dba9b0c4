// Reliability diagram data: per forecast bin, the mean forecast, observed frequency and count.

import { assertForecastPairs, type NumberList } from "./forecast-input";
import { findBinIndex, resolveBinEdges, type BinSpec } from "./forecast-bins";
import { defineScore, undefinedScore, type ScoreValue } from "./score-value";

export interface ReliabilityBin {
  lower: number;
  upper: number;
  count: number;
  events: number;
  /** Mean of the forecasts in the bin; null for an empty bin. */
  meanForecast: ScoreValue;
  /** Fraction of the bin's cases that were events; null for an empty bin. */
  observedFrequency: ScoreValue;
}

const REASON_EMPTY_BIN = "no forecasts fell in this bin";

/**
 * Observed frequency against mean forecast per bin (Wilks, forecast verification: reliability
 * diagram; Murphy & Winkler 1977, Appl. Statist. 26, 41). Counts are kept so a reader can see how
 * thin the rare-event bins are. Empty bins are returned, with null values and a reason; the
 * non-empty ones match scikit-learn's calibration_curve(strategy="uniform") except for forecasts
 * lying exactly on an interior edge (see findBinIndex).
 */
export function reliabilityCurve(
  p: NumberList,
  o: NumberList,
  bins: BinSpec = 10,
): ReliabilityBin[] {
  assertForecastPairs(p, o);
  const edges = resolveBinEdges(bins);
  const k = edges.length - 1;
  const count = new Float64Array(k);
  const events = new Float64Array(k);
  const sumP = new Float64Array(k);
  for (let i = 0; i < p.length; i++) {
    const pi = p[i] as number;
    const j = findBinIndex(pi, edges);
    count[j]! += 1;
    events[j]! += o[i] as number;
    sumP[j]! += pi;
  }
  return Array.from({ length: k }, (_, j) => {
    const nj = count[j]!;
    const isEmpty = nj === 0;
    return {
      lower: edges[j] as number,
      upper: edges[j + 1] as number,
      count: nj,
      events: events[j]!,
      meanForecast: isEmpty ? undefinedScore(REASON_EMPTY_BIN) : defineScore(sumP[j]! / nj),
      observedFrequency: isEmpty ? undefinedScore(REASON_EMPTY_BIN) : defineScore(events[j]! / nj),
    };
  });
}
