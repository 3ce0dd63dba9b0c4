// The frozen content of an issued bulletin, as mailed, printed, fed and verified.
import type { ProbabilityGrid } from "@/lib/domain/flare-levels";

export interface BulletinRegionRow {
  region: string;
  location: string;
  isLimbFlagged: boolean;
  areaMsh: number | null;
  mcintosh: string | null;
  mountWilson: string | null;
  /** The forecaster's finals (guidance where no final was set). */
  probabilities: ProbabilityGrid;
  /** Where `probabilities` came from; absent in content frozen before this was recorded. */
  probabilitySource?: "final" | "guidance";
}

export interface IssuedBulletin {
  id: number;
  forecastDay: string;
  version: number;
  issueTime: Date;
  officeName: string;
  contactLine: string;
  fullDisk: ProbabilityGrid;
  regions: BulletinRegionRow[];
  discussion: string;
  cautions: string[];
  supersedesVersion: number | null;
  isDemo: boolean;
}
