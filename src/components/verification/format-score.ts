// How the verification desk writes scores and intervals: a number, or "undefined" with its reason.
import type { IntervalJson, ScoreJson } from "@/lib/query/verification";

/** toFixed without "-0.000" for a value that rounds to zero from below. */
function fixed(value: number, digits: number): string {
  const text = value.toFixed(digits);
  return Number(text) === 0 ? (0).toFixed(digits) : text;
}

/** "0.132", or "undefined" when the score is undefined for the sample (never NaN). */
export function formatScore(score: ScoreJson | undefined, digits = 3): string {
  if (!score || score.value === null) return "undefined";
  return fixed(score.value, digits);
}

/** "[0.101, 0.164]", "undefined" with no bounds, or "" before the intervals are computed. */
export function formatInterval(interval: IntervalJson | undefined, digits = 3): string {
  if (!interval) return "";
  if (interval.lower.value === null || interval.upper.value === null) return "undefined";
  return `[${fixed(interval.lower.value, digits)}, ${fixed(interval.upper.value, digits)}]`;
}

/** The reason shown beside an undefined score or interval, or null when it is defined. */
export function undefinedReason(
  score: ScoreJson | undefined,
  interval?: IntervalJson,
): string | null {
  if (score && score.value === null) return score.reason;
  if (interval && interval.lower.value === null) return interval.lower.reason;
  return null;
}
