// Reads the office archive for recalibration: every assessed region-day with its model inputs,
// and the observed events that can fall in their windows.
import { asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { assessments, regions } from "@/db/schema";
import type { AssessmentInput } from "@/lib/domain/assessment-input";
import { loadEventsForMatching } from "./events.db";
import type { MatchEvent } from "./matching";

export interface ArchiveDay {
  region: string;
  day: string;
  input: AssessmentInput;
  isDemo: boolean;
}

export interface Archive {
  days: ArchiveDay[];
  events: MatchEvent[];
  from: string | null;
  to: string | null;
  isDemo: boolean;
}

const DAY_MS = 86_400_000;

/** Region-days ordered by day; events peaking from the first day to three days after the last. */
export async function loadArchive(): Promise<Archive> {
  const rows = await getDb()
    .select({ a: assessments, number: regions.number })
    .from(assessments)
    .innerJoin(regions, eq(assessments.regionId, regions.id))
    .orderBy(asc(assessments.forecastDay), asc(regions.number));
  const days = rows.map(({ a, number }) => ({
    region: number,
    day: a.forecastDay,
    isDemo: a.isDemo,
    input: {
      region: number,
      location: a.location,
      areaMsh: a.areaMsh,
      spotCount: a.spotCount,
      mcintosh: a.mcintosh,
      mountWilson: a.mountWilson,
      unsignedFluxMx: a.unsignedFluxMx,
      pilLengthMm: a.pilLengthMm,
      logR: a.logR,
      meanShearDeg: a.meanShearDeg,
      freeEnergyProxy: a.freeEnergyProxy,
      flares24h: { C: a.flaresC, M: a.flaresM, X: a.flaresX },
    },
  }));
  const from = days[0]?.day ?? null;
  const to = days[days.length - 1]?.day ?? null;
  const events =
    from && to
      ? await loadEventsForMatching(
          Date.parse(`${from}T00:00:00Z`),
          Date.parse(`${to}T00:00:00Z`) + 4 * DAY_MS,
        )
      : [];
  return { days, events, from, to, isDemo: days.some((d) => d.isDemo) };
}
