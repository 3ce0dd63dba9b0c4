// Flare events of the demo archive: times and GOES classes drawn for each region-day's counts,
// plus a few flares no region is credited with (demo — invented).

import type { FlareCounts } from "@/lib/domain/assessment-input";
import { formatGoesClass } from "@/server/verification/goes";
import { drawPoisson, drawPowerLaw, type Random } from "./random";

export interface ArchiveFlare {
  startTime: string;
  peakTime: string;
  endTime: string;
  /** In the true-flux convention, as the list gives it. */
  originalClass: string;
  peakFluxTrue: number;
  regionNumber: string | null;
}

export const FLARE_PARAMETERS = {
  /**
   * Slope of the flare-frequency distribution dN/dF ∝ F^−α of peak flux; α ≈ 1.8 is the commonly
   * reported value for soft X-ray flares (from memory).
   */
  alpha: 1.8,
  /** The largest flares drawn, X30 (3e-3 W m⁻²): about the largest on record (from memory). */
  maxFluxWm2: 3e-3,
  /** Flares per day credited to no region (behind the limb, or unnumbered plage). */
  unattributedPerDay: 0.1,
} as const;

const DAY_MINUTES = 1440;
const CLASS_BOUNDS = {
  C: [1e-6, 1e-5],
  M: [1e-5, 1e-4],
  X: [1e-4, FLARE_PARAMETERS.maxFluxWm2],
} as const;
const DECADE_EXPONENT = { C: -6, M: -5, X: -4 } as const;

type GoesClass = keyof typeof CLASS_BOUNDS;

/** Truncated to one decimal of its decade, so a C9.97 stays C9.9 rather than rounding to M1.0. */
function quantiseFlux(flux: number): { flux: number; originalClass: string } {
  const letter: GoesClass = flux >= 1e-4 ? "X" : flux >= 1e-5 ? "M" : "C";
  const exponent = DECADE_EXPONENT[letter];
  const magnitude = Math.max(1, Math.floor((flux / 10 ** exponent) * 10 + 1e-9) / 10);
  const quantised = Number(`${magnitude.toFixed(1)}e${exponent}`);
  return { flux: quantised, originalClass: formatGoesClass(quantised) };
}

export class FlareTimeline {
  private readonly taken = new Set<string>();
  readonly flares: ArchiveFlare[] = [];

  constructor(private readonly random: Random) {}

  /**
   * One flare with its peak at a whole minute drawn uniformly in the 24 h window from
   * `windowStartMs`; rise 3–14 min and decay growing with the class (invented). A draw that
   * repeats an existing (peak, flux) pair is redrawn: event lists key flares on that pair.
   */
  private add(windowStartMs: number, rawFlux: number, regionNumber: string | null): void {
    const { flux, originalClass } = quantiseFlux(rawFlux);
    let peakMs = windowStartMs + Math.floor(this.random() * DAY_MINUTES) * 60_000;
    while (this.taken.has(`${peakMs}|${flux}`)) {
      peakMs = windowStartMs + Math.floor(this.random() * DAY_MINUTES) * 60_000;
    }
    this.taken.add(`${peakMs}|${flux}`);
    const riseMin = 3 + Math.floor(this.random() * 12);
    const decayMin = 5 + Math.floor(this.random() * (20 + 15 * Math.log10(flux / 1e-6)));
    this.flares.push({
      startTime: new Date(peakMs - riseMin * 60_000).toISOString(),
      peakTime: new Date(peakMs).toISOString(),
      endTime: new Date(peakMs + decayMin * 60_000).toISOString(),
      originalClass,
      peakFluxTrue: flux,
      regionNumber,
    });
  }

  /** Flares of one region-day: each class's peak flux from the power law within its class. */
  addRegionFlares(windowStartMs: number, counts: FlareCounts, regionNumber: string): void {
    for (const letter of ["C", "M", "X"] as const) {
      const [low, high] = CLASS_BOUNDS[letter];
      for (let i = 0; i < counts[letter]; i++) {
        const flux = drawPowerLaw(this.random, low, high, FLARE_PARAMETERS.alpha);
        this.add(windowStartMs, flux, regionNumber);
      }
    }
  }

  /** Flares credited to no region: a Poisson number a day, peak flux on the whole C1–X30 law. */
  addUnattributedFlares(windowStartMs: number): void {
    const n = drawPoisson(this.random, FLARE_PARAMETERS.unattributedPerDay);
    for (let i = 0; i < n; i++) {
      const flux = drawPowerLaw(
        this.random,
        1e-6,
        FLARE_PARAMETERS.maxFluxWm2,
        FLARE_PARAMETERS.alpha,
      );
      this.add(windowStartMs, flux, null);
    }
  }

  listSortedFlares(): ArchiveFlare[] {
    return this.flares.slice().sort((a, b) => a.peakTime.localeCompare(b.peakTime));
  }
}
