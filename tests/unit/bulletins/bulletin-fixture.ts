// Invented bulletin content for unit tests (demo — invented for the scenario).
import { buildGrid, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import type { RegionSource } from "@/server/bulletins/bulletin-content";
import type { IssuedBulletin } from "@/server/bulletins/issued-bulletin";

/** A grid that respects the order rules: C+ ≥ M+ ≥ X and 24 h ≤ 48 h ≤ 72 h. */
export function gridOf(c24: number, m24: number, x24: number): ProbabilityGrid {
  const base = { "C+": c24, "M+": m24, X: x24 };
  const stretch = { "24h": 1, "48h": 1.25, "72h": 1.4 };
  return buildGrid((l, w) => Math.min(0.99, Math.round(base[l] * stretch[w] * 1000) / 1000));
}

export function regionSource(overrides: Partial<RegionSource> = {}): RegionSource {
  return {
    region: "HR-0412",
    location: "N12E34",
    isLimbFlagged: false,
    areaMsh: 480,
    mcintosh: "Dkc",
    mountWilson: "beta-gamma-delta",
    finals: gridOf(0.6, 0.2, 0.03),
    blended: gridOf(0.55, 0.18, 0.02),
    isDemo: true,
    ...overrides,
  };
}

export function issued(overrides: Partial<IssuedBulletin> = {}): IssuedBulletin {
  return {
    id: 7,
    forecastDay: "2031-05-06",
    version: 1,
    issueTime: new Date("2031-05-06T00:30:00Z"),
    officeName: "Halden Ridge Space Weather Desk (demo)",
    contactLine: "Duty desk (demo)",
    fullDisk: gridOf(0.7, 0.25, 0.04),
    regions: [
      {
        region: "HR-0412",
        location: "N12E34",
        isLimbFlagged: false,
        areaMsh: 480,
        mcintosh: "Dkc",
        mountWilson: "beta-gamma-delta",
        probabilities: gridOf(0.6, 0.2, 0.03),
        probabilitySource: "final",
      },
      {
        region: "HR-0413",
        location: "S05W20",
        isLimbFlagged: false,
        areaMsh: 80,
        mcintosh: "Cso",
        mountWilson: "beta",
        probabilities: gridOf(0.2, 0.05, 0.01),
        probabilitySource: "guidance",
      },
    ],
    discussion: "HR-0412 grew in the last day.",
    cautions: ["Guidance, not a storm warning."],
    supersedesVersion: null,
    isDemo: true,
    ...overrides,
  };
}
