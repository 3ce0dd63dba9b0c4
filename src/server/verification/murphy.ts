// Murphy (1973) decomposition of the Brier score, exact or binned with the Stephenson et al. terms.

import { assertForecastPairs, countEvents, type NumberList } from "./forecast-input";
import { findBinIndex, resolveBinEdges, type BinSpec } from "./forecast-bins";
import { REASON_EMPTY, defineScore, undefinedScore, type ScoreValue } from "./score-value";

export interface MurphyDecomposition {
  n: number;
  /** Number of distinct forecast values (exact) or non-empty bins (binned). */
  groups: number;
  isBinned: boolean;
  brier: ScoreValue;
  reliability: ScoreValue;
  resolution: ScoreValue;
  uncertainty: ScoreValue;
  /** Zero when exact; (1/n) Σₖ Σᵢ (pᵢ − p̄ₖ)² when binned. */
  withinBinVariance: ScoreValue;
  /** Zero when exact; (2/n) Σₖ Σᵢ (oᵢ − ōₖ)(pᵢ − p̄ₖ) when binned. */
  withinBinCovariance: ScoreValue;
}

/** Group index of every case: distinct forecast values when exact, bins otherwise. */
function groupCases(
  p: NumberList,
  bins: BinSpec | undefined,
): { index: Int32Array; groups: number } {
  const index = new Int32Array(p.length);
  if (bins === undefined) {
    const seen = new Map<number, number>();
    for (let i = 0; i < p.length; i++) {
      const pi = p[i] as number;
      let g = seen.get(pi);
      if (g === undefined) seen.set(pi, (g = seen.size));
      index[i] = g;
    }
    return { index, groups: seen.size };
  }
  const edges = resolveBinEdges(bins);
  for (let i = 0; i < p.length; i++) index[i] = findBinIndex(p[i] as number, edges);
  return { index, groups: edges.length - 1 };
}

/**
 * BS = REL − RES + UNC (Murphy 1973, J. Appl. Meteor. 12, 595), exact when the groups are the
 * distinct forecast values. With binned forecasts the identity needs the within-bin variance and
 * covariance: BS = REL − RES + UNC + WBV − WBC (Stephenson, Coelho & Jolliffe 2008, Wea.
 * Forecasting 23, 752, eq. 7), where REL uses the bin-mean forecast p̄ₖ.
 */
export function murphyDecomposition(
  p: NumberList,
  o: NumberList,
  bins?: BinSpec,
): MurphyDecomposition {
  assertForecastPairs(p, o);
  const n = p.length;
  const isBinned = bins !== undefined;
  if (n === 0) {
    const empty = undefinedScore(REASON_EMPTY);
    return {
      n,
      groups: 0,
      isBinned,
      brier: empty,
      reliability: empty,
      resolution: empty,
      uncertainty: empty,
      withinBinVariance: empty,
      withinBinCovariance: empty,
    };
  }
  const { index, groups } = groupCases(p, bins);
  const count = new Float64Array(groups);
  const sumP = new Float64Array(groups);
  const sumO = new Float64Array(groups);
  let squaredErrors = 0;
  for (let i = 0; i < n; i++) {
    const g = index[i] as number;
    const pi = p[i] as number;
    const oi = o[i] as number;
    count[g]! += 1;
    sumP[g]! += pi;
    sumO[g]! += oi;
    squaredErrors += (pi - oi) * (pi - oi);
  }
  const baseRate = countEvents(o) / n;
  let wbv = 0;
  let wbc = 0;
  if (isBinned) {
    for (let i = 0; i < n; i++) {
      const g = index[i] as number;
      const dp = (p[i] as number) - sumP[g]! / count[g]!;
      wbv += dp * dp;
      wbc += 2 * ((o[i] as number) - sumO[g]! / count[g]!) * dp;
    }
  }
  let rel = 0;
  let res = 0;
  let used = 0;
  for (let g = 0; g < groups; g++) {
    const nk = count[g]!;
    if (nk === 0) continue;
    used += 1;
    const meanP = sumP[g]! / nk;
    const freq = sumO[g]! / nk;
    rel += nk * (meanP - freq) * (meanP - freq);
    res += nk * (freq - baseRate) * (freq - baseRate);
  }
  return {
    n,
    groups: used,
    isBinned,
    brier: defineScore(squaredErrors / n),
    reliability: defineScore(rel / n),
    resolution: defineScore(res / n),
    uncertainty: defineScore(baseRate * (1 - baseRate)),
    withinBinVariance: defineScore(wbv / n),
    withinBinCovariance: defineScore(wbc / n),
  };
}
