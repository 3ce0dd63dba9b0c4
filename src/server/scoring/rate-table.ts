// McIntosh-class Poisson guidance: a rate table per class, corrected, then 1 − exp(−λT).

import { copyGrid, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import {
  explainMcIntoshError,
  isValidMcIntosh,
  MCINTOSH_CLASSES,
  zurichClassOf,
  type McIntoshClass,
} from "@/lib/domain/mcintosh";
import type { McIntoshPoissonParams } from "./model-params";
import { buildPoissonGrid, cumulativeLevelRates } from "./poisson";
import { buildUndefinedOutcome, type Scorer } from "./score-result";

interface ClassEntry {
  grid: ProbabilityGrid;
  /** Set when the class had no row of its own and its Zurich-class rates stand in. */
  fallbackFlag: string | null;
}

/**
 * Rates per McIntosh class (Bloomfield et al. 2012, ApJ 747, L41), scaled by the table's
 * correction factor (McCloskey et al. 2018, JSWSC 8, A34). All 60 grids are computed once here,
 * so scoring a region is a lookup.
 */
export function compileMcIntoshPoisson(params: McIntoshPoissonParams): Scorer {
  const entries = new Map<McIntoshClass, ClassEntry>();
  for (const cls of MCINTOSH_CLASSES) {
    const own = params.rates[cls];
    const zurich = zurichClassOf(cls);
    const rates = own ?? params.zurichRates?.[zurich];
    if (!rates) continue;
    entries.set(cls, {
      grid: buildPoissonGrid(cumulativeLevelRates(rates, params.correctionFactor)),
      fallbackFlag: own ? null : `fallback: no rates for ${cls}; Zurich class ${zurich} rates used`,
    });
  }

  return (input) => {
    const cls = input.mcintosh;
    if (cls === null || cls === undefined || cls === "") {
      return buildUndefinedOutcome("missing inputs: mcintosh", ["mcintosh"]);
    }
    if (!isValidMcIntosh(cls)) {
      return buildUndefinedOutcome(
        `mcintosh: ${explainMcIntoshError(cls) ?? "not a McIntosh class"}`,
      );
    }
    const entry = entries.get(cls);
    if (!entry) return buildUndefinedOutcome(`the rate table has no rates for ${cls}`);
    return {
      probabilities: copyGrid(entry.grid),
      missingInputs: [],
      flags: entry.fallbackFlag ? [entry.fallbackFlag] : [],
      reason: null,
    };
  };
}
