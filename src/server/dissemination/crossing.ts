// Owns the rule that decides whether an issued bulletin raises an alert for one threshold.
//
// A contact's threshold (level, window, probability T) is crossed by a bulletin whose full-disk
// probability p for that level and window is at or above T. An alert is raised when
//   1. p ≥ T, and
//   2. either there is no previous issued bulletin, or the previous bulletin had p < T (a rise
//      across the threshold), or — the previous bulletin was already at or above T — the contact
//      has no alert for that level and window still in force.
// An alert is "in force" until its validity window ends (issue time of its bulletin + window
// hours). So a correction issued an hour later does not alert again, an acknowledged alert is not
// repeated while its window runs, and when risk stays high past the end of the window, the new
// window gets one new alert. A newly added or lowered threshold already exceeded alerts at once.

/** Probabilities are stored as doubles from percentages; 1e-9 absorbs 0.4 vs 0.39999999999 (common practice). */
const TOLERANCE = 1e-9;

export function isAtOrAbove(probability: number, threshold: number): boolean {
  return probability >= threshold - TOLERANCE;
}

export interface CrossingInput {
  /** This bulletin's full-disk probability for the threshold's level and window. */
  probability: number;
  threshold: number;
  /** The previous issued bulletin's probability for the same cell; null when there is none. */
  previousProbability: number | null;
  /** The contact has an alert for this level and window whose window has not ended yet. */
  hasAlertInForce: boolean;
}

export type CrossingDecision =
  | { alert: true; reason: "first-bulletin" | "rose-across" | "still-above-new-window" }
  | { alert: false; reason: "below" | "still-above-in-force" };

export function decideCrossing(input: CrossingInput): CrossingDecision {
  if (!Number.isFinite(input.probability) || !isAtOrAbove(input.probability, input.threshold)) {
    return { alert: false, reason: "below" };
  }
  if (input.previousProbability === null) return { alert: true, reason: "first-bulletin" };
  if (!isAtOrAbove(input.previousProbability, input.threshold))
    return { alert: true, reason: "rose-across" };
  return input.hasAlertInForce
    ? { alert: false, reason: "still-above-in-force" }
    : { alert: true, reason: "still-above-new-window" };
}

/** True while an alert's window (from its bulletin's issue time) has not ended at `at`. */
export function isAlertInForce(alert: { issueTime: Date; windowHours: number }, at: Date): boolean {
  return at.getTime() < alert.issueTime.getTime() + alert.windowHours * 3600_000;
}
