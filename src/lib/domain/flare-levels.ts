// Flare levels and validity windows of a forecast, and the probability grid they span.
// "C+" is at least one flare ≥ C1.0, "M+" ≥ M1.0, "X" ≥ X1.0 in the window (GOES 0.1–0.8 nm).

export const FLARE_LEVELS = ["C+", "M+", "X"] as const;
export type FlareLevel = (typeof FLARE_LEVELS)[number];

export const WINDOW_KEYS = ["24h", "48h", "72h"] as const;
export type WindowKey = (typeof WINDOW_KEYS)[number];

export const WINDOW_HOURS: Readonly<Record<WindowKey, number>> = {
  "24h": 24,
  "48h": 48,
  "72h": 72,
};

/** Probabilities in [0, 1] for every level × window, windows starting at the issue time. */
export type ProbabilityGrid = Record<FlareLevel, Record<WindowKey, number>>;

/** Builds a grid by calling `cell` for every level × window. */
export function buildGrid(cell: (level: FlareLevel, window: WindowKey) => number): ProbabilityGrid {
  // Written out cell by cell: grids are built in the scoring hot path.
  return {
    "C+": { "24h": cell("C+", "24h"), "48h": cell("C+", "48h"), "72h": cell("C+", "72h") },
    "M+": { "24h": cell("M+", "24h"), "48h": cell("M+", "48h"), "72h": cell("M+", "72h") },
    X: { "24h": cell("X", "24h"), "48h": cell("X", "48h"), "72h": cell("X", "72h") },
  };
}

/** A copy that shares nothing with `grid`. */
export function copyGrid(grid: ProbabilityGrid): ProbabilityGrid {
  const [c, m, x] = [grid["C+"], grid["M+"], grid.X];
  return {
    "C+": { "24h": c["24h"], "48h": c["48h"], "72h": c["72h"] },
    "M+": { "24h": m["24h"], "48h": m["48h"], "72h": m["72h"] },
    X: { "24h": x["24h"], "48h": x["48h"], "72h": x["72h"] },
  };
}
