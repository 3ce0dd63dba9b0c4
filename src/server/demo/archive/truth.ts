// The generating model of the demo archive: the true daily flare probabilities of a region-day
// and the flare counts drawn from them (demo — invented coefficients).

import type { FlareCounts } from "@/lib/domain/assessment-input";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import { sigmoid } from "@/server/scoring/logistic";
import type { LatentMetrics } from "./magnetic-metrics";
import { drawPoisson, type Random } from "./random";

/** Coefficients on [log10 Φ (Mx), log R, mean shear (°), PIL length (Mm)]: the transforms of the demo logistic model. */
export interface GeneratingLevel {
  intercept: number;
  slopes: readonly [number, number, number, number];
}

/**
 * Invented. They differ from the demo logistic model (demo-models.ts) on purpose — steeper in
 * log R and shear, flatter in flux — so the demo model is mis-calibrated in the way a model
 * fitted on another period would be, and a refit of the archive has something to correct.
 */
export const GENERATING_COEFFICIENTS: Readonly<Record<FlareLevel, GeneratingLevel>> = {
  "C+": { intercept: -20.13, slopes: [0.75, 0.85, 0.03, 0.005] },
  "M+": { intercept: -23.9, slopes: [0.7, 1.15, 0.045, 0.006] },
  X: { intercept: -31.07, slopes: [0.9, 1.1, 0.045, 0.007] },
};

export const GENERATING_PREDICTOR_NAMES = [
  "log10(unsignedFluxMx)",
  "logR",
  "meanShearDeg",
  "pilLengthMm",
] as const;

export function toGeneratingPredictors(m: LatentMetrics): [number, number, number, number] {
  return [Math.log10(m.unsignedFluxMx), m.logR, m.meanShearDeg, m.pilLengthMm];
}

/** True P(at least one flare of the level in the 24 h window): p = 1/(1 + e^−(β₀ + Σβᵢxᵢ)). */
export function computeTrueProbabilities(m: LatentMetrics): Record<FlareLevel, number> {
  const x = toGeneratingPredictors(m);
  const p = (level: FlareLevel) => {
    const { intercept, slopes } = GENERATING_COEFFICIENTS[level];
    return sigmoid(intercept + slopes.reduce((z, b, i) => z + b * (x[i] as number), 0));
  };
  return { "C+": p("C+"), "M+": p("M+"), X: p("X") };
}

/**
 * Counts of exclusive GOES classes in the window. With λ_L = −ln(1 − p_L) for each cumulative
 * level, X ~ Poisson(λ_X), M ~ Poisson(λ_M+ − λ_X), C ~ Poisson(λ_C+ − λ_M+) are independent and
 * P(at least one flare ≥ level) = 1 − e^−λ_L = p_L exactly (Poisson superposition; Gallagher et
 * al. 2002, Solar Phys. 209, 171). Needs p_X ≤ p_M+ ≤ p_C+, which the coefficients keep over
 * the metric ranges of the archive; a break throws rather than bending the truth.
 */
export function drawFlareCounts(truth: Record<FlareLevel, number>, random: Random): FlareCounts {
  const rate = (p: number) => -Math.log1p(-p);
  const [c, m, x] = [rate(truth["C+"]), rate(truth["M+"]), rate(truth.X)];
  if (!(x <= m && m <= c)) {
    throw new Error(`Generating probabilities break the level order: ${JSON.stringify(truth)}`);
  }
  return {
    X: drawPoisson(random, x),
    M: drawPoisson(random, m - x),
    C: drawPoisson(random, c - m),
  };
}
