// The demo forecaster's finals: the blended guidance moved part of the way toward the true
// probability, with noise, then put into the order rules (demo — invented behaviour).

import type { FlareLevel, ProbabilityGrid } from "@/lib/domain/flare-levels";
import { buildGrid } from "@/lib/domain/flare-levels";
import { cellsNeedingReason } from "@/lib/domain/finals";
import { convertWindow } from "@/server/scoring/poisson";
import { drawNormal, type Random } from "./random";

export interface ForecasterBehaviour {
  /** 0 keeps the guidance, 1 lands on the truth (before noise), in log-odds. */
  nudge: number;
  /** Standard deviation of the forecaster's noise, in log-odds. */
  noiseLogit: number;
  /** Finals are whole percentages within [floor, 1 − floor]. */
  floor: number;
  /** Cells differing from guidance by more than this many points carry a reason (office setting). */
  marginPoints: number;
}

export const DEFAULT_FORECASTER: ForecasterBehaviour = {
  nudge: 0.8,
  noiseLogit: 0.25,
  floor: 0.01,
  marginPoints: 10,
};

const EPS = 1e-6;
const logit = (p: number) => Math.log(p / (1 - p));
const expit = (z: number) => 1 / (1 + Math.exp(-z));
const clampOpen = (p: number) => Math.min(1 - EPS, Math.max(EPS, p));

/**
 * logit f = logit b + nudge·(logit p − logit b) + ε, ε ~ N(0, noise²), for the 24 h window of
 * each level; then f_X ≤ f_M+ ≤ f_C+ by a running minimum, the 48 and 72 h values by the Poisson
 * conversion 1 − (1 − f)^(T/24) (Gallagher et al. 2002), and rounding to whole percentages
 * within [floor, 1 − floor]. Every step after the minimum is monotone, so the level and window
 * orders of the product brief hold in the result.
 */
export function draftFinals(
  blended: ProbabilityGrid,
  truth: Record<FlareLevel, number>,
  behaviour: ForecasterBehaviour,
  random: Random,
): ProbabilityGrid {
  const move = (level: FlareLevel) => {
    const b = logit(clampOpen(blended[level]["24h"]));
    const p = logit(clampOpen(truth[level]));
    return expit(b + behaviour.nudge * (p - b) + drawNormal(random, 0, behaviour.noiseLogit));
  };
  const c = move("C+");
  const m = Math.min(c, move("M+"));
  const x = Math.min(m, move("X"));
  const day: Record<FlareLevel, number> = { "C+": c, "M+": m, X: x };
  const hours = { "24h": 24, "48h": 48, "72h": 72 } as const;
  const round = (p: number) =>
    Math.round(Math.min(1 - behaviour.floor, Math.max(behaviour.floor, p)) * 100) / 100;
  return buildGrid((level, window) => round(convertWindow(day[level], hours[window])));
}

/** A reason for every cell the office margin asks one for (demo wording, labelled invented). */
export function writeFinalReasons(
  finals: ProbabilityGrid,
  blended: ProbabilityGrid | null,
  marginPoints: number,
): Record<string, string> {
  const reasons: Record<string, string> = {};
  for (const key of cellsNeedingReason(finals, blended, marginPoints)) {
    reasons[key] = "Demo archive (invented): forecaster judgement of the region's evolution.";
  }
  return reasons;
}
