// Contingency tables from probability forecasts at one warning threshold or a sweep of them.

import { contingencyScores, type ContingencyScores, type ContingencyTable } from "./contingency";
import { assertForecastPairs, type NumberList } from "./forecast-input";
import { countAtOrAbove, splitSortedForecasts, type SplitForecasts } from "./ranked-forecasts";

export interface ThresholdRow {
  threshold: number;
  table: ContingencyTable;
  scores: ContingencyScores;
}

/** 0.01, 0.02, …, 0.99, written as k/100 so each is the nearest double to the decimal. */
export const DEFAULT_SWEEP_THRESHOLDS: readonly number[] = Object.freeze(
  Array.from({ length: 99 }, (_, k) => (k + 1) / 100),
);

function assertThreshold(t: number): void {
  if (!(t >= 0 && t <= 1)) {
    throw new Error(`A warning threshold must lie in [0, 1]; got ${String(t)}`);
  }
}

function tableAt(split: SplitForecasts, threshold: number): ContingencyTable {
  const hits = countAtOrAbove(split.events, threshold);
  const falseAlarms = countAtOrAbove(split.nonEvents, threshold);
  return {
    hits,
    falseAlarms,
    misses: split.events.length - hits,
    correctNegatives: split.nonEvents.length - falseAlarms,
  };
}

/** A warning is issued when p ≥ threshold (common practice; the same rule as the ROC curve). */
export function contingencyFromProbabilities(
  p: NumberList,
  o: NumberList,
  threshold: number,
): ContingencyTable {
  assertForecastPairs(p, o);
  assertThreshold(threshold);
  let hits = 0;
  let falseAlarms = 0;
  let misses = 0;
  let correctNegatives = 0;
  for (let i = 0; i < p.length; i++) {
    const isWarned = (p[i] as number) >= threshold;
    if (o[i] === 1) {
      if (isWarned) hits += 1;
      else misses += 1;
    } else if (isWarned) falseAlarms += 1;
    else correctNegatives += 1;
  }
  return { hits, falseAlarms, misses, correctNegatives };
}

/** Tables and scores at many thresholds after one sort, O(n log n + m log n). */
export function thresholdSweep(
  p: NumberList,
  o: NumberList,
  thresholds: readonly number[] = DEFAULT_SWEEP_THRESHOLDS,
): ThresholdRow[] {
  assertForecastPairs(p, o);
  thresholds.forEach(assertThreshold);
  const split = splitSortedForecasts(p, o);
  return thresholds.map((threshold) => {
    const table = tableAt(split, threshold);
    return { threshold, table, scores: contingencyScores(table) };
  });
}
