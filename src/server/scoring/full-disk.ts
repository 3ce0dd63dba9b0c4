// Full-disk probabilities from the probabilities of the regions on the visible disk.

import { buildGrid, type ProbabilityGrid } from "@/lib/domain/flare-levels";

/**
 * P = 1 − Π(1 − Pᵢ) for independent regions (common practice). Computed as
 * −expm1(Σ log1p(−Pᵢ)) so that many small probabilities keep their precision (and `0 −` keeps
 * an empty disk at +0).
 */
export function combineIndependent(probabilities: readonly number[]): number {
  let logNone = 0;
  for (const p of probabilities) {
    if (!(p >= 0 && p <= 1)) throw new RangeError(`Probability must lie in [0, 1]; got ${p}`);
    logNone += Math.log1p(-p);
  }
  return 0 - Math.expm1(logNone);
}

/** The full-disk grid for every level × window; no regions gives 0 everywhere. */
export function combineFullDisk(regions: readonly ProbabilityGrid[]): ProbabilityGrid {
  return buildGrid((level, window) =>
    combineIndependent(regions.map((grid) => grid[level][window])),
  );
}
