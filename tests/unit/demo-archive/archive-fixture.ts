import type { FlareCounts } from "@/lib/domain/assessment-input";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import type { DemoArchive } from "@/server/demo/archive/archive-types";
import { generateDemoArchive } from "@/server/demo/archive/generate";

/** The seed and length the desk loads (load.ts), so the tests check the archive users see. */
export const SEED = 412;
export const DAYS = 730;
export const START_DAY = "2024-01-01";

let cached: DemoArchive | null = null;

/** The two-year archive, generated once per test file. */
export function getArchive(): DemoArchive {
  cached ??= generateDemoArchive({ seed: SEED, startDay: START_DAY, days: DAYS });
  return cached;
}

/** Whether the counts include at least one flare of the cumulative level. */
export function hasEvent(level: FlareLevel, c: FlareCounts): boolean {
  if (level === "C+") return c.C + c.M + c.X > 0;
  if (level === "M+") return c.M + c.X > 0;
  return c.X > 0;
}
