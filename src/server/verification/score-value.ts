// The one shape of every verification score: a finite number, or null with the reason it is undefined.

/**
 * A score is `{ value: number }` when it is defined for the sample, and `{ value: null, reason }`
 * when it is not (no events, no non-events, empty sample, zero denominator). NaN and Infinity never
 * leave this module family: every division goes through `divideScore`.
 */
export type ScoreValue = { value: number; reason?: undefined } | { value: null; reason: string };

export function defineScore(value: number): ScoreValue {
  if (!Number.isFinite(value)) {
    return { value: null, reason: `the score is not a finite number (${String(value)})` };
  }
  return { value };
}

export function undefinedScore(reason: string): ScoreValue {
  return { value: null, reason };
}

/** numerator / denominator, or null with `reasonIfZero` when the denominator is 0. */
export function divideScore(
  numerator: number,
  denominator: number,
  reasonIfZero: string,
): ScoreValue {
  if (denominator === 0) return undefinedScore(reasonIfZero);
  return defineScore(numerator / denominator);
}

export const REASON_EMPTY = "the sample is empty";
export const REASON_NO_EVENTS = "no observed events in the sample";
export const REASON_ALL_EVENTS = "every case in the sample is an observed event (no non-events)";
