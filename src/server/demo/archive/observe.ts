// What the desk sees of a demo group on one forecast day: area, spots, classes and metrics.

import { formatLocation, isBeyondLimbThreshold } from "@/lib/domain/location";
import { zurichClassOf, type McIntoshClass } from "@/lib/domain/mcintosh";
import type { MountWilsonClass } from "@/lib/domain/mount-wilson";
import { LIMB_THRESHOLD_DEG } from "@/server/scoring/predictor-inputs";
import { classifyMcIntosh, classifyMountWilson, type GroupLook } from "./classification";
import { computeEffectiveComplexity, isDecaying } from "./evolution";
import type { SpotGroup } from "./groups";
import {
  drawLatentMetrics,
  reportMetrics,
  type LatentMetrics,
  type ReportedMetrics,
} from "./magnetic-metrics";
import { drawNormal, type Random } from "./random";

export interface Observation {
  location: string;
  latitudeDeg: number;
  longitudeDeg: number;
  isLimbFlagged: boolean;
  areaMsh: number;
  spotCount: number;
  mcintosh: McIntoshClass;
  mountWilson: MountWilsonClass;
  latent: LatentMetrics;
  reported: ReportedMetrics;
}

/** Day-to-day scatter of the measured area around the smooth evolution, in ln(area) (invented). */
export const AREA_NOISE_SD_LN = 0.08;

/** Spot count grows with area and complexity; its bounds keep it plausible for each Zurich class (invented). */
function drawSpotCount(
  cls: McIntoshClass,
  area: number,
  complexity: number,
  random: Random,
): number {
  const typical = (1.5 + 0.9 * area ** 0.6) * (0.7 + 0.6 * complexity);
  const n = Math.round(typical * Math.exp(drawNormal(random, 0, 0.15)));
  switch (cls.charAt(0)) {
    case "A":
      return random() < 0.4 ? 2 : 1;
    case "H":
      return 1 + Math.floor(random() * 3);
    case "B":
      return Math.min(8, Math.max(2, n));
    case "C":
      return Math.min(25, Math.max(3, n));
    default:
      return Math.max(4, n);
  }
}

export function observeGroup(
  group: SpotGroup,
  t: number,
  longitudeDeg: number,
  smoothArea: number,
  isOutage: boolean,
  evolution: Random,
  gaps: Random,
): Observation {
  const areaMsh = Math.max(
    1,
    Math.round(smoothArea * Math.exp(drawNormal(evolution, 0, AREA_NOISE_SD_LN))),
  );
  const complexity = computeEffectiveComplexity(group, smoothArea);
  const look: GroupLook = {
    areaMsh,
    peakAreaMsh: group.peakAreaMsh,
    isDecaying: isDecaying(group, t),
    complexity,
    isAsymmetric: group.isAsymmetric,
  };
  const mcintosh = classifyMcIntosh(look);
  const spotCount = drawSpotCount(mcintosh, areaMsh, complexity, evolution);
  const latent = drawLatentMetrics(areaMsh, complexity, evolution);
  // Whole degrees, as the location is written (N12E34) and as the desk stores an entered one;
  // `|| 0` keeps −0 out. The limb flag is taken from the same rounded position.
  const loc = {
    latitudeDeg: Math.round(group.latitudeDeg) || 0,
    longitudeDeg: Math.round(longitudeDeg) || 0,
  };
  return {
    location: formatLocation(loc),
    latitudeDeg: loc.latitudeDeg,
    longitudeDeg: loc.longitudeDeg,
    // Beyond 60° from disk centre the metrics are kept but flagged (B0 taken as 0°).
    isLimbFlagged: isBeyondLimbThreshold(loc, LIMB_THRESHOLD_DEG, 0),
    areaMsh,
    spotCount,
    mcintosh,
    mountWilson: classifyMountWilson(zurichClassOf(mcintosh), look),
    latent,
    reported: reportMetrics(latent, isOutage, gaps),
  };
}
