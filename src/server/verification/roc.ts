// ROC curve (POD against POFD over every distinct forecast threshold) and the area under it.

import { assertForecastPairs, type NumberList } from "./forecast-input";
import { splitSortedForecasts } from "./ranked-forecasts";
import {
  REASON_EMPTY,
  REASON_NO_EVENTS,
  defineScore,
  undefinedScore,
  type ScoreValue,
} from "./score-value";

export interface RocPoint {
  /** Warn when p ≥ threshold; null for the origin, a threshold above every forecast. */
  threshold: number | null;
  pod: number;
  pofd: number;
}

export interface RocCurve {
  /** From (0, 0) at the strictest threshold to (1, 1); empty when the curve is undefined. */
  points: RocPoint[];
  auc: ScoreValue;
}

/**
 * One point per distinct forecast value, warning when p ≥ threshold (Mason 1982, Aust. Meteor.
 * Mag. 30, 291; Wilks, forecast verification). The area is the trapezoid rule over all points,
 * which equals the Mann–Whitney U / (n₁ n₀) with tied pairs counted one half (Hanley & McNeil
 * 1982, Radiology 143, 29). Areas are summed in integer counts so the result is exact to one
 * final division.
 */
export function rocCurve(p: NumberList, o: NumberList): RocCurve {
  assertForecastPairs(p, o);
  if (p.length === 0) return { points: [], auc: undefinedScore(REASON_EMPTY) };
  const { events, nonEvents } = splitSortedForecasts(p, o);
  const nEvents = events.length;
  const nNon = nonEvents.length;
  if (nEvents === 0) return { points: [], auc: undefinedScore(REASON_NO_EVENTS) };
  if (nNon === 0) {
    return {
      points: [],
      auc: undefinedScore("no observed non-events in the sample: POFD is undefined"),
    };
  }
  const points: RocPoint[] = [{ threshold: null, pod: 0, pofd: 0 }];
  let i = nEvents - 1;
  let j = nNon - 1;
  let hits = 0;
  let falseAlarms = 0;
  let doubleArea = 0; // Σ Δ(false alarms) · (hits + previous hits)
  while (i >= 0 || j >= 0) {
    const e = i >= 0 ? (events[i] as number) : -1;
    const ne = j >= 0 ? (nonEvents[j] as number) : -1;
    const t = e > ne ? e : ne;
    const previousHits = hits;
    const previousFalseAlarms = falseAlarms;
    while (i >= 0 && events[i] === t) {
      hits += 1;
      i -= 1;
    }
    while (j >= 0 && nonEvents[j] === t) {
      falseAlarms += 1;
      j -= 1;
    }
    doubleArea += (falseAlarms - previousFalseAlarms) * (hits + previousHits);
    points.push({ threshold: t, pod: hits / nEvents, pofd: falseAlarms / nNon });
  }
  return { points, auc: defineScore(doubleArea / (2 * nEvents * nNon)) };
}
