// Flare-history (persistence) guidance: recent flare counts of a region become Poisson rates.

import type { FlareCounts } from "@/lib/domain/assessment-input";
import type { PersistenceParams } from "./model-params";
import { buildPoissonGrid, cumulativeLevelRates, type ClassRates } from "./poisson";
import { buildUndefinedOutcome, type Scorer } from "./score-result";

/**
 * A simple persistence model: a region keeps flaring at the rate it showed in the last 24 h,
 * shrunk towards a prior rate. λ = (count + prior·w)/(1 + w), where w is the number of days of
 * observation the prior is worth; this is the posterior mean of a Poisson rate under a
 * Gamma(prior·w, w) prior after one day of counts (conjugate gamma–Poisson; common statistics).
 * The rates then give probabilities by P = 1 − exp(−λT) (Gallagher et al. 2002).
 */
export function estimatePersistenceRates(
  counts: FlareCounts,
  params: PersistenceParams,
): ClassRates {
  const w = params.priorWeight;
  const prior = params.priorRatesPerDay;
  return {
    C: (counts.C + prior.C * w) / (1 + w),
    M: (counts.M + prior.M * w) / (1 + w),
    X: (counts.X + prior.X * w) / (1 + w),
  };
}

function isCount(n: unknown): n is number {
  return typeof n === "number" && Number.isInteger(n) && n >= 0;
}

/** Why the counts cannot be used, or null when they are whole numbers ≥ 0. */
export function explainFlareCountError(counts: FlareCounts | null | undefined): string | null {
  if (!counts) return "flares in the last 24 h are missing";
  for (const cls of ["C", "M", "X"] as const) {
    if (!isCount(counts[cls]))
      return `flares24h.${cls} must be a whole number ≥ 0; got ${counts[cls]}`;
  }
  return null;
}

export function compilePersistence(params: PersistenceParams): Scorer {
  return (input) => {
    const counts = input.flares24h as FlareCounts | null | undefined;
    if (!counts) return buildUndefinedOutcome("missing inputs: flares24h", ["flares24h"]);
    const error = explainFlareCountError(counts);
    if (error) return buildUndefinedOutcome(error);
    const rates = estimatePersistenceRates(counts, params);
    return {
      probabilities: buildPoissonGrid(cumulativeLevelRates(rates)),
      missingInputs: [],
      flags: [],
      reason: null,
    };
  };
}
