// Blended guidance: the weighted mean of the models' probabilities and their spread per cell.

import { buildGrid, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import { checkOrderRules } from "./order-rules";

export interface GuidanceEntry {
  key: string;
  probabilities: ProbabilityGrid | null;
}

export interface BlendResult {
  /** Weighted mean per cell; null (with `reason`) when no model contributes. */
  probabilities: ProbabilityGrid | null;
  /** Max − min per cell over the contributing models. */
  spread: ProbabilityGrid | null;
  usedKeys: string[];
  /** Models left out: no probabilities, or a weight of 0. */
  skippedKeys: string[];
  flags: string[];
  reason: string | null;
}

/**
 * Weights default to 1 (equal weights); a key missing from `weights` keeps 1, and a weight of 0
 * leaves the model out. A weighted mean of grids that respect the order rules respects them too,
 * so a flag here points back at a model that breaks them.
 */
export function blendGuidance(
  entries: readonly GuidanceEntry[],
  weights: Readonly<Record<string, number>> = {},
): BlendResult {
  const used: { grid: ProbabilityGrid; weight: number }[] = [];
  const usedKeys: string[] = [];
  const skippedKeys: string[] = [];
  for (const entry of entries) {
    const weight = weights[entry.key] ?? 1;
    if (!Number.isFinite(weight) || weight < 0) {
      throw new RangeError(`Weight of ${entry.key} must be finite and ≥ 0; got ${weight}`);
    }
    if (entry.probabilities === null || weight === 0) {
      skippedKeys.push(entry.key);
      continue;
    }
    used.push({ grid: entry.probabilities, weight });
    usedKeys.push(entry.key);
  }
  if (used.length === 0) {
    const reason = entries.length === 0 ? "no guidance to blend" : "no model gave probabilities";
    return { probabilities: null, spread: null, usedKeys, skippedKeys, flags: [], reason };
  }
  const totalWeight = used.reduce((sum, u) => sum + u.weight, 0);
  const probabilities = buildGrid(
    (level, window) =>
      used.reduce((sum, u) => sum + u.weight * u.grid[level][window], 0) / totalWeight,
  );
  const spread = buildGrid((level, window) => {
    const cells = used.map((u) => u.grid[level][window]);
    return Math.max(...cells) - Math.min(...cells);
  });
  const flags = checkOrderRules(probabilities).map((flag) => `blend: ${flag}`);
  return { probabilities, spread, usedKeys, skippedKeys, flags, reason: null };
}
