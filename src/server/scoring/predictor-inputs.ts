// Reads model predictors from an assessment and flags regions whose metrics the limb distorts.

import type { AssessmentInput, PredictorInput } from "@/lib/domain/assessment-input";
import { hasDelta, isValidMountWilson } from "@/lib/domain/mount-wilson";
import {
  angularDistanceFromDiskCentreDeg,
  formatLocation,
  isBeyondLimbThreshold,
  parseLocation,
} from "@/lib/domain/location";

function readNumber(value: number | null | undefined): number | null {
  return typeof value === "number" && !Number.isNaN(value) ? value : null;
}

/** The raw value of a predictor, or null when the assessment does not provide it. */
export function readPredictor(input: AssessmentInput, name: PredictorInput): number | null {
  switch (name) {
    case "deltaIndicator":
      // 1 for a delta configuration, 0 for any other valid class; unknown classes are missing.
      return isValidMountWilson(input.mountWilson) ? (hasDelta(input.mountWilson) ? 1 : 0) : null;
    default:
      return readNumber(input[name]);
  }
}

/** Beyond about 60° from disk centre projection effects spoil magnetic metrics (common practice). */
export const LIMB_THRESHOLD_DEG = 60;

/** A flag for a region beyond the limb threshold or with an unreadable location, else null. */
export function explainLimbFlag(location: string, b0Deg: number): string | null {
  const parsed = parseLocation(location);
  if (!parsed.ok) return `location: ${parsed.error}; limb check skipped`;
  if (!isBeyondLimbThreshold(parsed.location, LIMB_THRESHOLD_DEG, b0Deg)) return null;
  const rho = angularDistanceFromDiskCentreDeg(parsed.location, b0Deg);
  return `limb: ${formatLocation(parsed.location)} is ${rho.toFixed(0)}° from disk centre (beyond ${LIMB_THRESHOLD_DEG}°); magnetic metrics suffer projection effects`;
}
