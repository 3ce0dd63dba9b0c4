// Composes a bulletin's content from the day's assessments and full-disk table (pure): live while
// the bulletin is open, frozen as-is at issue. Also says what still stops it from being issued.
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";
import type { BulletinRegionRow, IssuedBulletin } from "./issued-bulletin";

export interface RegionSource {
  region: string;
  location: string;
  isLimbFlagged: boolean;
  areaMsh: number | null;
  mcintosh: string | null;
  mountWilson: string | null;
  finals: ProbabilityGrid | null;
  blended: ProbabilityGrid | null;
  isDemo: boolean;
}

export interface ContentSources {
  id: number;
  forecastDay: string;
  version: number;
  issueTime: Date;
  officeName: string;
  contactLine: string;
  cautions: readonly string[];
  /** getFullDisk(day).final: derived from the regions, with the forecaster's adjustments. */
  fullDisk: ProbabilityGrid | null;
  regions: readonly RegionSource[];
  discussion: string;
  supersedesVersion: number | null;
  isDemo: boolean;
}

export interface ComposedContent {
  /** null while there is no full-disk table to issue. */
  bulletin: IssuedBulletin | null;
  /** Why the bulletin cannot be submitted or issued yet; empty when it can. */
  problems: string[];
}

function toRegionRow(r: RegionSource): BulletinRegionRow | null {
  const probabilities = r.finals ?? r.blended;
  if (!probabilities) return null;
  return {
    region: r.region,
    location: r.location,
    isLimbFlagged: r.isLimbFlagged,
    areaMsh: r.areaMsh,
    mcintosh: r.mcintosh,
    mountWilson: r.mountWilson,
    probabilities,
    probabilitySource: r.finals ? "final" : "guidance",
  };
}

export function composeBulletinContent(src: ContentSources): ComposedContent {
  const problems: string[] = [];
  const rows: BulletinRegionRow[] = [];
  for (const r of src.regions) {
    const row = toRegionRow(r);
    if (row) rows.push(row);
    else problems.push(`${r.region} has neither final probabilities nor guidance: set its finals.`);
  }
  if (!src.fullDisk)
    problems.push(
      `No region of ${src.forecastDay} has probabilities yet, so there is no full-disk table.`,
    );
  if (src.discussion.trim() === "") problems.push("Write the forecaster's discussion.");
  const bulletin: IssuedBulletin | null = src.fullDisk
    ? {
        id: src.id,
        forecastDay: src.forecastDay,
        version: src.version,
        issueTime: src.issueTime,
        officeName: src.officeName,
        contactLine: src.contactLine,
        fullDisk: src.fullDisk,
        regions: rows,
        discussion: src.discussion,
        cautions: [...src.cautions],
        supersedesVersion: src.supersedesVersion,
        isDemo: src.isDemo || src.regions.some((r) => r.isDemo),
      }
    : null;
  return { bulletin, problems };
}
