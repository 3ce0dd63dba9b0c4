// Latent magnetic metrics of a demo group on one day, correlated with its area and complexity.
// Every relation below is invented for the demo; only the typical ranges follow the literature.

import { drawNormal, type Random } from "./random";

/** The generating values: the truth of the archive, whether or not the day's report shows them. */
export interface LatentMetrics {
  /** Total unsigned flux, Mx (regions usually carry 1e20–1e23 Mx; Bobra et al. 2014). */
  unsignedFluxMx: number;
  /** log10 of Schrijver's R in Mx, 0–6 (Schrijver 2007, ApJ 655, L117). */
  logR: number;
  /** Mean shear angle, degrees, 0–90. */
  meanShearDeg: number;
  /** Length of the polarity-inversion line, Mm. */
  pilLengthMm: number;
  /** Free-energy proxy in the product's proxy unit (erg-like magnitudes, invented). */
  freeEnergyProxy: number;
}

export const METRIC_RELATIONS = {
  flux: { base: 19.9, perLogArea: 0.85, perComplexity: 0.4, sd: 0.12 },
  logR: { base: -1.5, perLogArea: 1.5, perComplexity: 2.5, sd: 0.35, range: [0, 6] as const },
  shear: { base: 10, perLogArea: 6, perComplexity: 40, sd: 6, range: [0, 89.9] as const },
  pil: { base: -0.2, perLogArea: 0.6, perComplexity: 0.8, sdLog10: 0.15, maxMm: 400 },
  freeEnergy: { base: 28.5, perLogArea: 1.1, perComplexity: 1.0, sdLog10: 0.2 },
} as const;

const R = METRIC_RELATIONS;

function clamp(x: number, [low, high]: readonly [number, number]): number {
  return Math.min(high, Math.max(low, x));
}

function roundTo(x: number, decimals: number): number {
  return Number(x.toFixed(decimals));
}

function roundSignificant(x: number, digits: number): number {
  return Number(x.toPrecision(digits));
}

/**
 * log10 Φ, log R, shear and log10 PIL are each linear in log10(area) and complexity plus its own
 * Gaussian noise, so the four predictors are correlated (as in Bobra et al. 2014) yet not
 * collinear — a refit can tell their effects apart.
 */
export function drawLatentMetrics(
  areaMsh: number,
  complexity: number,
  random: Random,
): LatentMetrics {
  const la = Math.log10(areaMsh);
  const k = complexity;
  const log10Flux = R.flux.base + R.flux.perLogArea * la + R.flux.perComplexity * (k - 0.3);
  const logR = R.logR.base + R.logR.perLogArea * la + R.logR.perComplexity * k;
  const shear = R.shear.base + R.shear.perLogArea * la + R.shear.perComplexity * k;
  const log10Pil = R.pil.base + R.pil.perLogArea * la + R.pil.perComplexity * k;
  const log10Energy =
    R.freeEnergy.base + R.freeEnergy.perLogArea * la + R.freeEnergy.perComplexity * k;
  // Rounded as a report would give them, so a reported value is the generating value itself.
  return {
    unsignedFluxMx: roundSignificant(10 ** drawNormal(random, log10Flux, R.flux.sd), 3),
    logR: roundTo(clamp(drawNormal(random, logR, R.logR.sd), R.logR.range), 2),
    meanShearDeg: roundTo(clamp(drawNormal(random, shear, R.shear.sd), R.shear.range), 1),
    // Capped: inversion lines rarely exceed a few hundred Mm (the plausibility range of metrics.ts).
    pilLengthMm: roundTo(
      Math.min(R.pil.maxMm, 10 ** drawNormal(random, log10Pil, R.pil.sdLog10)),
      1,
    ),
    freeEnergyProxy: roundSignificant(
      10 ** drawNormal(random, log10Energy, R.freeEnergy.sdLog10),
      3,
    ),
  };
}

/** Chance that a measurement is absent from a region-day's report (invented). */
export const MISSING_RATES = {
  /** A magnetogram outage: no magnetic metric for any region that day. */
  outagePerDay: 0.02,
  perRegionDay: {
    unsignedFluxMx: 0.005,
    logR: 0.02,
    meanShearDeg: 0.02,
    pilLengthMm: 0.015,
    freeEnergyProxy: 0.1,
  },
} as const;

export type ReportedMetrics = { [K in keyof LatentMetrics]: number | null };

/** The metrics as reported: the latent values with some left out (missing at random). */
export function reportMetrics(
  latent: LatentMetrics,
  isOutage: boolean,
  random: Random,
): ReportedMetrics {
  const pick = (key: keyof LatentMetrics) => {
    // One draw per metric even on outage days, so an outage does not shift later draws.
    const isMissing = random() < MISSING_RATES.perRegionDay[key];
    return isOutage || isMissing ? null : latent[key];
  };
  return {
    unsignedFluxMx: pick("unsignedFluxMx"),
    logR: pick("logR"),
    meanShearDeg: pick("meanShearDeg"),
    pilLengthMm: pick("pilLengthMm"),
    freeEnergyProxy: pick("freeEnergyProxy"),
  };
}
