// Rules for the forecaster's final probabilities (isomorphic: the form shows the same messages
// the server enforces). Finals must respect the order rules; a final that differs from the
// blended guidance by more than the office margin needs a reason.
import {
  FLARE_LEVELS,
  WINDOW_KEYS,
  type FlareLevel,
  type ProbabilityGrid,
  type WindowKey,
} from "./flare-levels";

export type CellKey = `${FlareLevel}.${WindowKey}`;

export function cellKey(level: FlareLevel, window: WindowKey): CellKey {
  return `${level}.${window}`;
}

/** Cells whose final differs from guidance by more than `marginPoints` percentage points. */
export function cellsNeedingReason(
  finals: ProbabilityGrid,
  blended: ProbabilityGrid | null,
  marginPoints: number,
): CellKey[] {
  if (!blended) return [];
  const out: CellKey[] = [];
  for (const level of FLARE_LEVELS) {
    for (const window of WINDOW_KEYS) {
      // Compare in whole hundredths so 0.1 + float noise is not a 10.0000001-point difference.
      const diff =
        Math.abs(
          Math.round(finals[level][window] * 1e4) - Math.round(blended[level][window] * 1e4),
        ) / 100;
      if (diff > marginPoints) out.push(cellKey(level, window));
    }
  }
  return out;
}

/** Field errors (keyed finals.M+.24h) for finals breaking P(X) ≤ P(M+) ≤ P(C+) or P(24h) ≤ P(48h) ≤ P(72h). */
export function finalsOrderErrors(finals: ProbabilityGrid): Record<string, string> {
  const errors: Record<string, string> = {};
  const eps = 1e-9;
  for (const window of WINDOW_KEYS) {
    if (finals["M+"][window] > finals["C+"][window] + eps)
      errors[`finals.M+.${window}`] =
        `M+ cannot exceed C+ at ${window}: every M flare is also a C+ flare.`;
    if (finals.X[window] > finals["M+"][window] + eps)
      errors[`finals.X.${window}`] =
        `X cannot exceed M+ at ${window}: every X flare is also an M+ flare.`;
  }
  for (const level of FLARE_LEVELS) {
    if (finals[level]["24h"] > finals[level]["48h"] + eps)
      errors[`finals.${level}.48h`] =
        `${level} at 48 h cannot be below 24 h: the longer window contains the shorter.`;
    if (finals[level]["48h"] > finals[level]["72h"] + eps)
      errors[`finals.${level}.72h`] =
        `${level} at 72 h cannot be below 48 h: the longer window contains the shorter.`;
  }
  return errors;
}

/** Field errors for cells missing their reason. */
export function missingReasonErrors(
  finals: ProbabilityGrid,
  blended: ProbabilityGrid | null,
  reasons: Record<string, string>,
  marginPoints: number,
): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const key of cellsNeedingReason(finals, blended, marginPoints)) {
    if (!reasons[key]?.trim())
      errors[`finalReasons.${key}`] =
        `Give a reason: this differs from guidance by more than ${marginPoints} points.`;
  }
  return errors;
}
