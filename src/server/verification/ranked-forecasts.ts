// Forecasts split by outcome and sorted once, for the ROC curve and the threshold sweep.

import type { NumberList } from "./forecast-input";

export interface SplitForecasts {
  /** Forecasts of the cases that were events, ascending. */
  events: Float64Array;
  /** Forecasts of the cases that were not events, ascending. */
  nonEvents: Float64Array;
}

/**
 * Sorting the two groups separately with the typed-array numeric sort (no comparator) is the
 * O(n log n) step; every threshold afterwards is a binary search or a linear merge.
 * Inputs must already be validated.
 */
export function splitSortedForecasts(p: NumberList, o: NumberList): SplitForecasts {
  let eventCount = 0;
  for (let i = 0; i < o.length; i++) eventCount += o[i] as number;
  const events = new Float64Array(eventCount);
  const nonEvents = new Float64Array(p.length - eventCount);
  let e = 0;
  let ne = 0;
  for (let i = 0; i < p.length; i++) {
    if (o[i] === 1) events[e++] = p[i] as number;
    else nonEvents[ne++] = p[i] as number;
  }
  events.sort();
  nonEvents.sort();
  return { events, nonEvents };
}

/** How many values of an ascending array are ≥ t (one binary search). */
export function countAtOrAbove(sorted: Float64Array, t: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((sorted[mid] as number) < t) lo = mid + 1;
    else hi = mid;
  }
  return sorted.length - lo;
}
