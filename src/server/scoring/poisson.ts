// Poisson flare statistics: rates per day to probabilities of at least one flare, and back.

import type { FlareLevel, ProbabilityGrid, WindowKey } from "@/lib/domain/flare-levels";
import type { FlareCounts } from "@/lib/domain/assessment-input";

/** Mean flare rates (flares/day) of the exclusive GOES classes C, M and X. */
export type ClassRates = FlareCounts;
export type LevelRates = Record<FlareLevel, number>;

function assertRate(ratePerDay: number): void {
  if (!Number.isFinite(ratePerDay) || ratePerDay < 0) {
    throw new RangeError(`A flare rate must be a finite number ≥ 0; got ${ratePerDay}`);
  }
}

/**
 * P(at least one flare in T days) = 1 − exp(−λT) (Gallagher et al. 2002, Solar Phys. 209, 171;
 * Bloomfield et al. 2012, ApJ 747, L41). −expm1 keeps precision when λT is small; `0 −` rather
 * than a unary minus keeps a zero probability +0 instead of −0.
 */
export function probabilityOfAtLeastOne(ratePerDay: number, days: number): number {
  assertRate(ratePerDay);
  if (!Number.isFinite(days) || days < 0)
    throw new RangeError(`Window must be ≥ 0 days; got ${days}`);
  return 0 - Math.expm1(-ratePerDay * days);
}

/**
 * The Poisson rate behind a probability: λ = −ln(1 − p)/T, the inverse of 1 − exp(−λT).
 * Returns null for p = 1, whose rate is unbounded.
 */
export function rateFromProbability(p: number, days: number): number | null {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`Probability must lie in [0, 1]; got ${p}`);
  if (!(days > 0) || !Number.isFinite(days))
    throw new RangeError(`Window must be > 0 days; got ${days}`);
  if (p === 1) return null;
  return -Math.log1p(-p) / days;
}

/**
 * Probability for another window under the Poisson assumption: P_T = 1 − (1 − P_W)^(T/W)
 * (follows from 1 − exp(−λT); Gallagher et al. 2002). The default source window is 24 h.
 */
export function convertWindow(p: number, toHours: number, fromHours = 24): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`Probability must lie in [0, 1]; got ${p}`);
  if (
    !(toHours >= 0) ||
    !(fromHours > 0) ||
    !Number.isFinite(toHours) ||
    !Number.isFinite(fromHours)
  ) {
    throw new RangeError(`Windows must be finite with the source window > 0 h`);
  }
  // (1 − p)^(T/W) = exp((T/W)·ln(1 − p)); log1p/expm1 keep precision for small p.
  return 0 - Math.expm1((toHours / fromHours) * Math.log1p(-p));
}

/**
 * Rates of the cumulative levels from the exclusive classes: λ_C+ = λ_C + λ_M + λ_X,
 * λ_M+ = λ_M + λ_X (independent Poisson processes add; Bloomfield et al. 2012). The correction
 * factor scales every rate for a rate table taken from another solar cycle (McCloskey et al.
 * 2018, JSWSC 8, A34).
 */
export function cumulativeLevelRates(rates: ClassRates, correctionFactor = 1): LevelRates {
  assertRate(rates.C);
  assertRate(rates.M);
  assertRate(rates.X);
  if (!Number.isFinite(correctionFactor) || correctionFactor < 0) {
    throw new RangeError(`Correction factor must be finite and ≥ 0; got ${correctionFactor}`);
  }
  const x = rates.X * correctionFactor;
  const mPlus = (rates.M + rates.X) * correctionFactor;
  return { "C+": (rates.C + rates.M + rates.X) * correctionFactor, "M+": mPlus, X: x };
}

function buildPoissonRow(ratePerDay: number): Record<WindowKey, number> {
  return {
    "24h": probabilityOfAtLeastOne(ratePerDay, 1),
    "48h": probabilityOfAtLeastOne(ratePerDay, 2),
    "72h": probabilityOfAtLeastOne(ratePerDay, 3),
  };
}

/** The 24/48/72 h grid (T = 1, 2, 3 days) from level rates, windows starting at the issue time. */
export function buildPoissonGrid(levelRates: LevelRates): ProbabilityGrid {
  return {
    "C+": buildPoissonRow(levelRates["C+"]),
    "M+": buildPoissonRow(levelRates["M+"]),
    X: buildPoissonRow(levelRates.X),
  };
}
