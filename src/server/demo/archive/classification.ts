// McIntosh and Mount Wilson classes of a demo group from its area, phase and complexity.
// The class rules are McIntosh (1990), Solar Phys. 125, 251; the area thresholds are invented.

import { isValidMcIntosh, type McIntoshClass, type ZurichClass } from "@/lib/domain/mcintosh";
import type { MountWilsonClass } from "@/lib/domain/mount-wilson";

export interface GroupLook {
  areaMsh: number;
  peakAreaMsh: number;
  isDecaying: boolean;
  /** Effective complexity of the day, 0–1. */
  complexity: number;
  isAsymmetric: boolean;
}

/** Zurich class by area while growing (invented thresholds, rising with group size). */
function zurichByArea(area: number): ZurichClass {
  if (area < 10) return "A";
  if (area < 25) return "B";
  if (area < 70) return "C";
  if (area < 250) return "D";
  if (area < 600) return "E";
  return "F";
}

/**
 * A decaying group that had penumbral spots ends as its leading spot alone (H, unipolar with
 * penumbra) before the last pores (A) vanish — the usual end of a group's life (common practice).
 */
export function classifyZurich(look: GroupLook): ZurichClass {
  const { areaMsh, peakAreaMsh } = look;
  if (areaMsh < 10) return "A";
  if (look.isDecaying && peakAreaMsh >= 60 && areaMsh < 0.35 * peakAreaMsh && areaMsh < 120) {
    return "H";
  }
  return zurichByArea(areaMsh);
}

function classifyPenumbra(zurich: ZurichClass, look: GroupLook): "x" | "r" | "s" | "a" | "h" | "k" {
  if (zurich === "A" || zurich === "B") return "x";
  if (look.areaMsh < 20) return "r";
  if (look.areaMsh < 40) return "s";
  if (look.areaMsh < 200) return look.isAsymmetric ? "a" : "s";
  return look.isAsymmetric ? "k" : "h";
}

function classifyDistribution(zurich: ZurichClass, look: GroupLook): "x" | "o" | "i" | "c" {
  if (zurich === "A" || zurich === "H") return "x";
  if (zurich === "B" || zurich === "C") return look.complexity < 0.3 ? "o" : "i";
  if (look.complexity >= 0.55 && look.areaMsh >= 150) return "c";
  return look.complexity >= 0.25 ? "i" : "o";
}

export function classifyMcIntosh(look: GroupLook): McIntoshClass {
  const zurich = classifyZurich(look);
  const penumbra = classifyPenumbra(zurich, look);
  let distribution = classifyDistribution(zurich, look);
  // McIntosh (1990) allows no compact (c) group whose largest spot has rudimentary penumbra (r).
  if (penumbra === "r" && distribution === "c") distribution = "i";
  const cls = `${zurich}${penumbra}${distribution}`;
  if (!isValidMcIntosh(cls)) throw new Error(`Generated an invalid McIntosh class ${cls}`);
  return cls;
}

/** Mount Wilson class: unipolar groups are alpha; delta spots need a large, complex group. */
export function classifyMountWilson(zurich: ZurichClass, look: GroupLook): MountWilsonClass {
  const k = look.complexity;
  if (zurich === "A" || zurich === "H") return "alpha";
  if (zurich === "B" || zurich === "C") return k < 0.4 ? "beta" : "beta-gamma";
  if (k < 0.25) return "beta";
  if (k < 0.5 || look.areaMsh < 150) return "beta-gamma";
  return k < 0.7 ? "beta-delta" : "beta-gamma-delta";
}
