// Seeded percentile-bootstrap confidence intervals of a score, alone or as a paired difference.

import { assertForecastPairs, type NumberList } from "./forecast-input";
import { createMulberry32 } from "./prng";
import { defineScore, undefinedScore, type ScoreValue } from "./score-value";

/** Any score of (forecasts, outcomes), e.g. brierScore or (p, o) => rocCurve(p, o).auc. */
export type Statistic = (p: NumberList, o: NumberList) => ScoreValue;

export interface BootstrapOptions {
  resamples: number;
  seed: number;
  /** Central coverage, e.g. 0.95. */
  level: number;
}

export interface BootstrapInterval {
  estimate: ScoreValue;
  lower: ScoreValue;
  upper: ScoreValue;
  level: number;
  resamples: number;
  /** Resamples whose score was undefined (e.g. no events drawn); they are left out. */
  undefinedResamples: number;
}

function assertOptions({ resamples, seed, level }: BootstrapOptions): void {
  if (!Number.isInteger(resamples) || resamples < 2) {
    throw new Error(`Bootstrap resamples must be a whole number ≥ 2; got ${String(resamples)}`);
  }
  if (!Number.isInteger(seed)) {
    throw new Error(`Bootstrap seed must be an integer; got ${String(seed)}`);
  }
  if (!(level > 0 && level < 1)) {
    throw new Error(`Confidence level must lie in (0, 1); got ${String(level)}`);
  }
}

/** Sample quantile by linear interpolation, type 7 of Hyndman & Fan 1996 (Amer. Statist. 50, 361). */
function quantileOfSorted(sorted: Float64Array, q: number): number {
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return (sorted[lo] as number) + (h - lo) * ((sorted[hi] as number) - (sorted[lo] as number));
}

/**
 * Calls `scoreResample` once per resample with a seeded index source (one stream, so the same
 * seed gives the same interval); the callback draws n indices with replacement while it fills its
 * buffers. The interval is the percentile interval (Efron & Tibshirani 1993, An Introduction to
 * the Bootstrap, ch. 13).
 */
function runBootstrap(
  n: number,
  estimate: ScoreValue,
  opts: BootstrapOptions,
  scoreResample: (drawIndex: () => number) => ScoreValue,
): BootstrapInterval {
  assertOptions(opts);
  const { resamples, level } = opts;
  const base = { estimate, level, resamples };
  if (n === 0) {
    const empty = undefinedScore("the sample is empty");
    return { ...base, lower: empty, upper: empty, undefinedResamples: resamples };
  }
  const random = createMulberry32(opts.seed);
  const drawIndex = () => Math.floor(random() * n);
  const values = new Float64Array(resamples);
  let used = 0;
  for (let r = 0; r < resamples; r++) {
    const score = scoreResample(drawIndex);
    if (score.value !== null) values[used++] = score.value;
  }
  const undefinedResamples = resamples - used;
  if (used < 2) {
    const reason = `the score was undefined in ${undefinedResamples} of ${resamples} resamples`;
    return {
      ...base,
      lower: undefinedScore(reason),
      upper: undefinedScore(reason),
      undefinedResamples,
    };
  }
  const sorted = values.subarray(0, used).sort();
  const tail = (1 - level) / 2;
  return {
    ...base,
    lower: defineScore(quantileOfSorted(sorted, tail)),
    upper: defineScore(quantileOfSorted(sorted, 1 - tail)),
    undefinedResamples,
  };
}

/** Percentile bootstrap interval of statFn over cases resampled with replacement. */
export function bootstrapInterval(
  p: NumberList,
  o: NumberList,
  statFn: Statistic,
  opts: BootstrapOptions,
): BootstrapInterval {
  assertForecastPairs(p, o);
  const pBuffer = new Float64Array(p.length);
  const oBuffer = new Uint8Array(p.length);
  return runBootstrap(p.length, statFn(p, o), opts, (drawIndex) => {
    for (let i = 0; i < pBuffer.length; i++) {
      const k = drawIndex();
      pBuffer[i] = p[k] as number;
      oBuffer[i] = o[k] as number;
    }
    return statFn(pBuffer, oBuffer);
  });
}

function subtractScores(a: ScoreValue, b: ScoreValue): ScoreValue {
  if (a.value === null) return a;
  if (b.value === null) return b;
  return defineScore(a.value - b.value);
}

/**
 * Interval of statFn(pA) − statFn(pB) with both forecast sets scored on the same resampled cases,
 * so case-to-case difficulty cancels (paired bootstrap; Hamill 1999, Wea. Forecasting 14, 155).
 */
export function pairedBootstrapDifference(
  pA: NumberList,
  pB: NumberList,
  o: NumberList,
  statFn: Statistic,
  opts: BootstrapOptions,
): BootstrapInterval {
  assertForecastPairs(pA, o);
  assertForecastPairs(pB, o);
  const n = o.length;
  const aBuffer = new Float64Array(n);
  const bBuffer = new Float64Array(n);
  const oBuffer = new Uint8Array(n);
  const estimate = subtractScores(statFn(pA, o), statFn(pB, o));
  return runBootstrap(n, estimate, opts, (drawIndex) => {
    for (let i = 0; i < n; i++) {
      const k = drawIndex();
      aBuffer[i] = pA[k] as number;
      bBuffer[i] = pB[k] as number;
      oBuffer[i] = o[k] as number;
    }
    return subtractScores(statFn(aBuffer, oBuffer), statFn(bBuffer, oBuffer));
  });
}
