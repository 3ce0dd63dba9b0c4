// Owns when a failed delivery is tried again: exponential backoff with a cap, never sooner than
// the provider's Retry-After, and a last attempt after which the delivery counts as failed.

export const RETRY_BASE_MS = 15_000;
export const RETRY_CAP_MS = 30 * 60_000;
/** Ten attempts span about 1.5 hours of retrying (15 s, 30 s, … capped at 30 min). */
export const MAX_ATTEMPTS = 10;

/**
 * Delay before attempt `attempts + 1`: base × 2^(attempts − 1), capped (exponential backoff,
 * common practice, e.g. AWS Architecture Blog "Exponential Backoff and Jitter", 2015). No jitter:
 * one worker per office sends, so there is no herd to spread, and a batch must stay together.
 * A Retry-After given in seconds (RFC 9110 §10.2.3) is a lower bound.
 */
export function retryDelayMs(attempts: number, retryAfterSeconds?: number): number {
  const exponent = Math.max(0, Math.min(attempts - 1, 20));
  const backoff = Math.min(RETRY_CAP_MS, RETRY_BASE_MS * 2 ** exponent);
  const floor =
    retryAfterSeconds !== undefined && retryAfterSeconds > 0 ? retryAfterSeconds * 1000 : 0;
  return Math.max(backoff, floor);
}

export type FailureStep = { next: "retry"; at: Date } | { next: "give-up" };

/** What to do after a failed attempt number `attempts` (already counted). */
export function planAfterFailure(
  attempts: number,
  isRetryable: boolean,
  now: Date,
  retryAfterSeconds?: number,
): FailureStep {
  if (!isRetryable || attempts >= MAX_ATTEMPTS) return { next: "give-up" };
  return { next: "retry", at: new Date(now.getTime() + retryDelayMs(attempts, retryAfterSeconds)) };
}
