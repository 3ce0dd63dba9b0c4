// Brier score, Brier skill score and log-loss of probability forecasts of a binary event.

import { assertForecastPairs, countEvents, type NumberList } from "./forecast-input";
import {
  REASON_ALL_EVENTS,
  REASON_EMPTY,
  REASON_NO_EVENTS,
  defineScore,
  undefinedScore,
  type ScoreValue,
} from "./score-value";

/**
 * Σ (pᵢ − oᵢ)², validating in the same pass: the bootstrap calls this once per resample, so a
 * separate validation sweep would double the work. A bad value defers to assertForecastPairs
 * for the message.
 */
function sumSquaredErrors(p: NumberList, o: NumberList): number {
  if (p.length !== o.length) assertForecastPairs(p, o);
  let sum = 0;
  for (let i = 0; i < p.length; i++) {
    const pi = p[i] as number;
    const oi = o[i] as number;
    if (!(pi >= 0 && pi <= 1) || (oi !== 0 && oi !== 1)) assertForecastPairs(p, o);
    const d = pi - oi;
    sum += d * d;
  }
  return sum;
}

/** BS = (1/n) Σ (pᵢ − oᵢ)² (Brier 1950, Mon. Wea. Rev. 78, 1; Wilks, forecast verification). */
export function brierScore(p: NumberList, o: NumberList): ScoreValue {
  const sum = sumSquaredErrors(p, o);
  if (p.length === 0) return undefinedScore(REASON_EMPTY);
  return defineScore(sum / p.length);
}

/**
 * BSS = 1 − BS / BS_ref (Wilks, forecast verification). Without a reference the sample
 * climatology ō is the reference, whose Brier score is ō(1 − ō), the uncertainty term of
 * Murphy (1973); it is 0 when the sample has no events or only events, so skill is undefined.
 */
export function brierSkillScore(p: NumberList, o: NumberList, reference?: NumberList): ScoreValue {
  assertForecastPairs(p, o);
  const n = p.length;
  if (n === 0) return undefinedScore(REASON_EMPTY);
  let referenceBrier: number;
  if (reference === undefined) {
    const events = countEvents(o);
    if (events === 0) {
      return undefinedScore(`${REASON_NO_EVENTS}: skill against climatology is undefined`);
    }
    if (events === n) {
      return undefinedScore(`${REASON_ALL_EVENTS}: skill against climatology is undefined`);
    }
    const baseRate = events / n;
    referenceBrier = baseRate * (1 - baseRate);
  } else {
    if (reference.length !== n) {
      throw new Error(
        `Reference forecasts must match the sample length ${n}; got ${reference.length}`,
      );
    }
    referenceBrier = sumSquaredErrors(reference, o) / n;
    if (referenceBrier === 0) {
      return undefinedScore("the reference forecast is perfect on this sample (Brier score 0)");
    }
  }
  return defineScore(1 - sumSquaredErrors(p, o) / n / referenceBrier);
}

/**
 * Log-loss (ignorance in nats) = −(1/n) Σ [oᵢ ln pᵢ + (1 − oᵢ) ln(1 − pᵢ)] (Good 1952, J. R. Stat.
 * Soc. B 14, 107; Roulston & Smith 2002, Mon. Wea. Rev. 130, 1653, use log base 2). A forecast of
 * 0 for an event that happened (or 1 for one that did not) makes it infinite, so it is undefined.
 */
export function logLoss(p: NumberList, o: NumberList): ScoreValue {
  assertForecastPairs(p, o);
  if (p.length === 0) return undefinedScore(REASON_EMPTY);
  let sum = 0;
  for (let i = 0; i < p.length; i++) {
    const pi = p[i] as number;
    const chance = o[i] === 1 ? pi : 1 - pi;
    if (chance === 0) {
      return undefinedScore(
        `forecast at index ${i} gave probability 0 to what happened: log-loss is infinite`,
      );
    }
    sum -= Math.log(chance);
  }
  return defineScore(sum / p.length);
}
