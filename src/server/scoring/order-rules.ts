// Consistency checks of a probability grid; they report problems and never change a value.

import { FLARE_LEVELS, WINDOW_KEYS, type ProbabilityGrid } from "@/lib/domain/flare-levels";

// Differences below this are floating-point noise, not a forecast that breaks an order rule.
const TOLERANCE = 1e-9;

// The text is put together only for a break, since this runs for every scored region.
function flagIfAbove(
  flags: string[],
  what: string,
  where: string,
  above: number,
  below: number,
): void {
  if (above > below + TOLERANCE) {
    flags.push(`order: ${what} at ${where} (${above.toFixed(3)} > ${below.toFixed(3)})`);
  }
}

function appendRangeFlags(grid: ProbabilityGrid, flags: string[]): string[] {
  for (const level of FLARE_LEVELS) {
    const row = grid[level];
    for (const window of WINDOW_KEYS) {
      const p = row[window];
      if (!Number.isFinite(p)) flags.push(`range: ${level} at ${window} is not a finite number`);
      else if (p < 0 || p > 1) flags.push(`range: ${level} at ${window} is ${p}, outside [0, 1]`);
    }
  }
  return flags;
}

/**
 * Level order P(X) ≤ P(M+) ≤ P(C+) in every window (every X flare is also an M+ and a C+ flare)
 * and window order P(24 h) ≤ P(48 h) ≤ P(72 h) at every level (a longer window from the same
 * issue time contains the shorter one). Product brief; the nesting makes both a necessity.
 * Adjacent pairs suffice: both orders are transitive.
 */
function appendOrderFlags(grid: ProbabilityGrid, flags: string[]): string[] {
  const c = grid["C+"];
  const m = grid["M+"];
  const x = grid.X;
  for (const w of WINDOW_KEYS) {
    flagIfAbove(flags, "M+ > C+", w, m[w], c[w]);
    flagIfAbove(flags, "X > M+", w, x[w], m[w]);
  }
  for (const level of FLARE_LEVELS) {
    const row = grid[level];
    flagIfAbove(flags, level, "24h > 48h", row["24h"], row["48h"]);
    flagIfAbove(flags, level, "48h > 72h", row["48h"], row["72h"]);
  }
  return flags;
}

/** Flags for cells that are not finite numbers in [0, 1]. */
export function checkProbabilityRange(grid: ProbabilityGrid): string[] {
  return appendRangeFlags(grid, []);
}

/** Flags for breaks of the level and window orders; an empty list means none. */
export function checkOrderRules(grid: ProbabilityGrid): string[] {
  return appendOrderFlags(grid, []);
}

/** Range flags first, then order flags; an empty list means the grid is consistent. */
export function checkGrid(grid: ProbabilityGrid): string[] {
  return appendGridFlags(grid, []);
}

/** A new list: `flags` followed by the grid's range and order flags. */
export function appendGridFlags(grid: ProbabilityGrid, flags: readonly string[]): string[] {
  return appendOrderFlags(grid, appendRangeFlags(grid, flags.slice()));
}
