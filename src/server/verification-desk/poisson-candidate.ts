// A candidate McIntosh–Poisson rate table fitted on archived region-days (pure, on fitMcIntoshRates).
import type { FlareCounts } from "@/lib/domain/assessment-input";
import {
  isValidMcIntosh,
  ZURICH_CLASSES,
  zurichClassOf,
  type ZurichClass,
} from "@/lib/domain/mcintosh";
import type { McIntoshPoissonParams } from "@/server/scoring/model-params";
import { fitMcIntoshRates, type McIntoshRateTable } from "@/server/verification/poisson-fit";

export interface PoissonCandidate {
  params: McIntoshPoissonParams;
  table: McIntoshRateTable;
  regionDays: number;
  /** Region-days left out because their McIntosh class was missing or invalid. */
  skipped: number;
  /** Zurich classes with no region-day, given the rate of the whole archive. */
  zurichFromArchive: ZurichClass[];
}

/** Fewer region-days than this and a class takes its Zurich class's rate (common practice; value chosen here). */
export const MIN_REGION_DAYS = 20;

type Tally = { days: number; C: number; M: number; X: number };

const rateOf = (t: Tally): FlareCounts => ({ C: t.C / t.days, M: t.M / t.days, X: t.X / t.days });

/**
 * Rates λ̂ = flares / region-days per class (fitMcIntoshRates; Bloomfield et al. 2012, ApJ 747,
 * L41). Classes with enough region-days carry their own rates; the others fall back to their
 * Zurich class's pooled rates through `zurichRates`, as the scorer reads them. A Zurich class
 * absent from the archive gets the all-archive rate, so every one of the 60 classes is covered.
 * The correction factor is 1: the table comes from the office's own recent archive, not from
 * another solar cycle (the McCloskey et al. 2018 correction is for that case).
 */
export function fitPoissonCandidate(
  days: readonly { mcintosh: string | null; counts: FlareCounts }[],
  minRegionDays = MIN_REGION_DAYS,
): PoissonCandidate {
  const usable = days.filter((d): d is { mcintosh: string; counts: FlareCounts } =>
    isValidMcIntosh(d.mcintosh),
  );
  if (usable.length === 0)
    throw new Error("The archive has no region-day with a valid McIntosh class to fit rates on");
  const table = fitMcIntoshRates(usable, { minRegionDays });
  const all: Tally = { days: 0, C: 0, M: 0, X: 0 };
  const byZurich = new Map<ZurichClass, Tally>();
  for (const d of usable) {
    const z = zurichClassOf(d.mcintosh as Parameters<typeof zurichClassOf>[0]);
    const t = byZurich.get(z) ?? { days: 0, C: 0, M: 0, X: 0 };
    for (const target of [t, all]) {
      target.days += 1;
      target.C += d.counts.C;
      target.M += d.counts.M;
      target.X += d.counts.X;
    }
    byZurich.set(z, t);
  }
  const rates: McIntoshPoissonParams["rates"] = {};
  for (const row of table.rows) {
    if (row.source === "class")
      rates[row.mcintosh] = {
        C: row.rates.C.ratePerDay,
        M: row.rates.M.ratePerDay,
        X: row.rates.X.ratePerDay,
      };
  }
  const zurichRates: NonNullable<McIntoshPoissonParams["zurichRates"]> = {};
  const zurichFromArchive: ZurichClass[] = [];
  for (const z of ZURICH_CLASSES) {
    const t = byZurich.get(z);
    if (!t) zurichFromArchive.push(z);
    zurichRates[z] = rateOf(t ?? all);
  }
  return {
    params: { rates, zurichRates, correctionFactor: 1 },
    table,
    regionDays: usable.length,
    skipped: days.length - usable.length,
    zurichFromArchive,
  };
}
