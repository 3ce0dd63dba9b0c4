// Validation of paired probability forecasts and binary outcomes before any score is computed.

/** Probabilities and outcomes as plain arrays or typed arrays (the bootstrap reuses typed buffers). */
export type NumberList = ArrayLike<number>;

/**
 * Throws a clear Error unless p and o have equal length, every p is a finite number in [0, 1]
 * and every o is exactly 0 or 1. An empty pair of arrays is valid input: scores then say why
 * they are undefined.
 */
export function assertForecastPairs(p: NumberList, o: NumberList): void {
  if (p.length !== o.length) {
    throw new Error(
      `Forecasts and outcomes must have equal length; got ${p.length} forecasts and ${o.length} outcomes`,
    );
  }
  for (let i = 0; i < p.length; i++) {
    const pi = p[i] as number;
    // The negated comparison also rejects NaN.
    if (!(pi >= 0 && pi <= 1)) {
      throw new Error(`Forecast probability at index ${i} must lie in [0, 1]; got ${String(pi)}`);
    }
    const oi = o[i] as number;
    if (oi !== 0 && oi !== 1) {
      throw new Error(`Outcome at index ${i} must be 0 or 1; got ${String(oi)}`);
    }
  }
}

/** Number of observed events (o = 1) in a validated outcome list. */
export function countEvents(o: NumberList): number {
  let events = 0;
  for (let i = 0; i < o.length; i++) events += o[i] as number;
  return events;
}
