// The shapes every guidance model returns when it scores one region.

import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import type { AssessmentInput } from "@/lib/domain/assessment-input";

/** Conditions of the forecast day that come in as arguments, never from a clock. */
export interface ScoreContext {
  /** Heliographic latitude of the disk centre on the day, degrees (±7.25°); 0 when unknown. */
  b0Deg?: number;
}

/** What a model's scorer finds: probabilities, or null with the reason. */
export interface ScoreOutcome {
  probabilities: ProbabilityGrid | null;
  missingInputs: string[];
  flags: string[];
  /** Why `probabilities` is null; null when they are present. */
  reason: string | null;
}

export interface ScoreResult extends ScoreOutcome {
  key: string;
  version: string;
  provenance: string;
}

export type Scorer = (input: AssessmentInput, context: ScoreContext) => ScoreOutcome;

export function buildUndefinedOutcome(
  reason: string,
  missingInputs: string[] = [],
  flags: string[] = [],
): ScoreOutcome {
  return { probabilities: null, missingInputs, flags, reason };
}
