// McIntosh–Poisson flare rates per class from archived region-days, pooled where data are thin.

import type { FlareCounts } from "@/lib/domain/assessment-input";
import {
  MCINTOSH_CLASSES,
  explainMcIntoshError,
  zurichClassOf,
  type McIntoshClass,
  type ZurichClass,
} from "@/lib/domain/mcintosh";

/** One active region observed for one day, with the flares it produced that day by GOES class. */
export interface RegionDay {
  mcintosh: string;
  counts: FlareCounts;
}

export interface ClassRate {
  flares: number;
  ratePerDay: number;
  standardError: number;
}

export interface McIntoshRateRow {
  mcintosh: McIntoshClass;
  /** Region-days observed in this McIntosh class. */
  regionDays: number;
  /** "zurich-pooled" when the class had fewer region-days than the minimum. */
  source: "class" | "zurich-pooled";
  /** Region-days behind the rates: the class's own, or its Zurich class's total. */
  basisRegionDays: number;
  /** True when even the basis has fewer region-days than the minimum. */
  isSparse: boolean;
  rates: Record<keyof FlareCounts, ClassRate>;
}

export interface McIntoshRateTable {
  rows: McIntoshRateRow[];
  pooledClasses: McIntoshClass[];
  minRegionDays: number;
}

interface Tally {
  regionDays: number;
  flares: FlareCounts;
}

const GOES_CLASSES = ["C", "M", "X"] as const;

function assertRegionDay(day: RegionDay, index: number): McIntoshClass {
  const problem = explainMcIntoshError(day.mcintosh);
  if (problem !== null) throw new Error(`Region-day ${index}: ${problem}`);
  for (const k of GOES_CLASSES) {
    const n = day.counts[k];
    if (!Number.isInteger(n) || n < 0) {
      throw new Error(
        `Region-day ${index}: the ${k} flare count must be a whole number ≥ 0; got ${String(n)}`,
      );
    }
  }
  return day.mcintosh as McIntoshClass;
}

function addTo(tallies: Map<string, Tally>, key: string, counts: FlareCounts): void {
  const tally = tallies.get(key) ?? { regionDays: 0, flares: { C: 0, M: 0, X: 0 } };
  tally.regionDays += 1;
  for (const k of GOES_CLASSES) tally.flares[k] += counts[k];
  tallies.set(key, tally);
}

/**
 * The maximum-likelihood Poisson rate is λ̂ = n/N flares per region-day, with standard error
 * √(λ̂/N) = √n/N from the Fisher information N/λ (common practice; rates per McIntosh class as in
 * Gallagher et al. 2002, Solar Phys. 209, 171, and Bloomfield et al. 2012, ApJ 747, L41). With
 * n = 0 the standard error is 0, which understates the uncertainty; isSparse flags thin bases.
 * A class with fewer than `minRegionDays` takes the rate of all region-days of its Zurich class.
 */
export function fitMcIntoshRates(
  days: readonly RegionDay[],
  { minRegionDays }: { minRegionDays: number },
): McIntoshRateTable {
  if (!Number.isInteger(minRegionDays) || minRegionDays < 1) {
    throw new Error(
      `The minimum of region-days must be a whole number ≥ 1; got ${String(minRegionDays)}`,
    );
  }
  const byClass = new Map<string, Tally>();
  const byZurich = new Map<string, Tally>();
  days.forEach((day, index) => {
    const cls = assertRegionDay(day, index);
    addTo(byClass, cls, day.counts);
    addTo(byZurich, zurichClassOf(cls), day.counts);
  });
  const rows: McIntoshRateRow[] = [];
  const pooledClasses: McIntoshClass[] = [];
  for (const cls of MCINTOSH_CLASSES) {
    const own = byClass.get(cls);
    if (own === undefined) continue;
    const isPooled = own.regionDays < minRegionDays;
    const basis = isPooled ? (byZurich.get(zurichClassOf(cls) as ZurichClass) as Tally) : own;
    if (isPooled) pooledClasses.push(cls);
    const rateOf = (k: keyof FlareCounts): ClassRate => ({
      flares: basis.flares[k],
      ratePerDay: basis.flares[k] / basis.regionDays,
      standardError: Math.sqrt(basis.flares[k]) / basis.regionDays,
    });
    rows.push({
      mcintosh: cls,
      regionDays: own.regionDays,
      source: isPooled ? "zurich-pooled" : "class",
      basisRegionDays: basis.regionDays,
      isSparse: basis.regionDays < minRegionDays,
      rates: { C: rateOf("C"), M: rateOf("M"), X: rateOf("X") },
    });
  }
  return { rows, pooledClasses, minRegionDays };
}
