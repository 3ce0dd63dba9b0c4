// Probability grids as the forecaster types them (whole or decimal percent) and back.
import { FLARE_LEVELS, WINDOW_KEYS, buildGrid, type FlareLevel, type ProbabilityGrid, type WindowKey } from "@/lib/domain/flare-levels";

export type PercentGrid = Record<FlareLevel, Record<WindowKey, string>>;

export function toPercentGrid(grid: ProbabilityGrid | null): PercentGrid {
  return Object.fromEntries(
    FLARE_LEVELS.map((l) => [l, Object.fromEntries(WINDOW_KEYS.map((w) => [w, grid ? String(Math.round(grid[l][w] * 1000) / 10) : ""]))]),
  ) as PercentGrid;
}

/** null when any cell is empty or not a number in 0–100. */
export function fromPercentGrid(grid: PercentGrid): ProbabilityGrid | null {
  let isComplete = true;
  const out = buildGrid((l, w) => {
    const text = grid[l][w].trim().replace(",", ".");
    const n = Number(text);
    if (text === "" || !Number.isFinite(n) || n < 0 || n > 100) isComplete = false;
    return Math.round(n * 10) / 1000;
  });
  return isComplete ? out : null;
}

export function isPercentGridEmpty(grid: PercentGrid): boolean {
  return FLARE_LEVELS.every((l) => WINDOW_KEYS.every((w) => grid[l][w].trim() === ""));
}

export function pct(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return "—";
  const v = p * 100;
  return v > 0 && v < 1 ? "<1" : String(Math.round(v));
}
