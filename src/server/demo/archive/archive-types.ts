// The plain objects a generated demo archive is made of.

import type { AssessmentInput, FlareCounts } from "@/lib/domain/assessment-input";
import type { FlareLevel, ProbabilityGrid } from "@/lib/domain/flare-levels";
import type { ArchiveFlare } from "./flares";
import type { ForecasterBehaviour } from "./forecaster";
import type { ArchiveGuidance } from "./guidance";
import type { LatentMetrics } from "./magnetic-metrics";

export interface DemoArchiveOptions {
  seed: number;
  /** First forecast day, YYYY-MM-DD (UTC). */
  startDay: string;
  days: number;
  /** Number of the first region of the archive (HR-0001 by default). */
  firstRegionNumber?: number;
  forecaster?: ForecasterBehaviour;
}

export interface ArchiveRegion {
  number: string;
  groupId: number;
  firstDay: string;
  lastDay: string;
}

/** One active region on one forecast day: what was reported, what was true, what was forecast. */
export interface ArchiveRegionDay {
  regionNumber: string;
  day: string;
  /** ISO time, D 00:30 UTC. */
  issueTime: string;
  latitudeDeg: number;
  longitudeDeg: number;
  isLimbFlagged: boolean;
  /** The assessment as the desk has it (some metrics null), scored by the models. */
  input: AssessmentInput;
  /** The generating metrics (never missing). */
  latent: LatentMetrics;
  /** True P(≥ 1 flare of the level) in the 24 h window from the issue time. */
  truth: Record<FlareLevel, number>;
  /** Flares of each exclusive GOES class the region produced in that window. */
  counts: FlareCounts;
  guidance: ArchiveGuidance[];
  blended: ProbabilityGrid | null;
  finals: ProbabilityGrid;
  finalReasons: Record<string, string>;
}

export interface FullDiskForecast {
  /** "forecaster" or "model:<key>@<version>". */
  source: string;
  probabilities: ProbabilityGrid;
}

export interface ArchiveDay {
  day: string;
  issueTime: string;
  regionNumbers: string[];
  /** A model's full disk appears only on days when it scored every region on the disk. */
  fullDisk: FullDiskForecast[];
}

export interface DemoArchive {
  seed: number;
  startDay: string;
  days: number;
  regions: ArchiveRegion[];
  /** Ordered by day, then region number. */
  regionDays: ArchiveRegionDay[];
  /** Ordered by peak time; true-flux convention. */
  flares: ArchiveFlare[];
  dayRecords: ArchiveDay[];
  /** The number the next (live) region should take to follow on from the archive. */
  nextRegionNumber: number;
}
