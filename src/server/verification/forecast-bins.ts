// Probability bins on [0, 1] shared by the reliability curve and the binned Murphy decomposition.

/** A number of equal-width bins, or explicit ascending edges from 0 to 1. */
export type BinSpec = number | readonly number[];

/**
 * Edges of the bins. k equal-width bins get edges i·(1/k), the same doubles as
 * numpy.linspace(0, 1, k + 1) that scikit-learn's calibration_curve uses.
 */
export function resolveBinEdges(bins: BinSpec): number[] {
  if (typeof bins === "number") {
    if (!Number.isInteger(bins) || bins < 1 || bins > 1000) {
      throw new Error(`The number of bins must be an integer from 1 to 1000; got ${bins}`);
    }
    const step = 1 / bins;
    const edges = Array.from({ length: bins + 1 }, (_, i) => i * step);
    edges[bins] = 1;
    return edges;
  }
  if (bins.length < 2) throw new Error("Bin edges need at least two values (0 and 1)");
  if (bins[0] !== 0 || bins[bins.length - 1] !== 1) {
    throw new Error(
      `Bin edges must start at 0 and end at 1; got ${bins[0]} … ${bins[bins.length - 1]}`,
    );
  }
  for (let i = 1; i < bins.length; i++) {
    if (!((bins[i] as number) > (bins[i - 1] as number))) {
      throw new Error(`Bin edges must be strictly increasing; edge ${i} is ${bins[i]}`);
    }
  }
  return [...bins];
}

/**
 * Index of the bin holding p: bin j is [edge j, edge j+1), the last bin also holds 1, so a 0.2
 * forecast sits in the 0.2–0.3 bin (numpy.searchsorted(interior edges, p, side="right")).
 * scikit-learn 1.2's calibration_curve uses side="left" and puts values lying exactly on an
 * interior edge in the lower bin; elsewhere the two agree.
 */
export function findBinIndex(p: number, edges: readonly number[]): number {
  let lo = 0;
  let hi = edges.length - 2; // the last bin index
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((edges[mid] as number) <= p) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}
