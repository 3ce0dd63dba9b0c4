// Generates the demo archive: a seeded, documented generative model of regions, flares and
// forecasts (docs/demo-archive.md). Pure: the same options always give the same objects.

import type { AssessmentInput, FlareCounts } from "@/lib/domain/assessment-input";
import type {
  ArchiveDay,
  ArchiveRegion,
  ArchiveRegionDay,
  DemoArchive,
  DemoArchiveOptions,
} from "./archive-types";
import { addDays, computeIssueTimeMs, parseDay } from "./calendar";
import { summariseDay } from "./day-forecasts";
import { FlareTimeline } from "./flares";
import {
  DEFAULT_FORECASTER,
  draftFinals,
  writeFinalReasons,
  type ForecasterBehaviour,
} from "./forecaster";
import { generateGroups } from "./groups";
import { scoreRegionDay } from "./guidance";
import { MISSING_RATES } from "./magnetic-metrics";
import { observeGroup } from "./observe";
import { formatRegionNumber, listPassages, type Passage, type Visit } from "./passages";
import { createStream, type Random } from "./random";
import { computeTrueProbabilities, drawFlareCounts } from "./truth";

function assertOptions({ seed, startDay, days }: DemoArchiveOptions): void {
  if (!Number.isInteger(seed)) throw new Error(`The seed must be an integer; got ${String(seed)}`);
  parseDay(startDay);
  if (!Number.isInteger(days) || days < 1 || days > 3660) {
    throw new Error(`days must be a whole number from 1 to 3660; got ${String(days)}`);
  }
}

function groupVisitsByDay(
  passages: readonly Passage[],
  days: number,
): { passage: Passage; visit: Visit }[][] {
  const byDay = Array.from({ length: days }, () => [] as { passage: Passage; visit: Visit }[]);
  for (const passage of passages) {
    for (const visit of passage.visits) byDay[visit.dayIndex]?.push({ passage, visit });
  }
  for (const list of byDay) list.sort((a, b) => a.passage.number - b.passage.number);
  return byDay;
}

interface DayContext {
  day: string;
  issueMs: number;
  isOutage: boolean;
  behaviour: ForecasterBehaviour;
  streams: { evolution: Random; gaps: Random; flares: Random; forecaster: Random };
  timeline: FlareTimeline;
  /** The latest region-day's flare counts of each passage, by region number. */
  previousCounts: Map<number, FlareCounts>;
}

/** One region-day: what the desk reports, what was true, the flares drawn, and the forecasts. */
function buildRegionDay(passage: Passage, visit: Visit, c: DayContext): ArchiveRegionDay {
  const { evolution, gaps, flares, forecaster } = c.streams;
  const o = observeGroup(
    passage.group,
    visit.t,
    visit.longitudeDeg,
    visit.smoothArea,
    c.isOutage,
    evolution,
    gaps,
  );
  const regionNumber = formatRegionNumber(passage.number);
  // A region's first day on the disk has no observed flare history: counted as none.
  const flares24h = c.previousCounts.get(passage.number) ?? { C: 0, M: 0, X: 0 };
  const input: AssessmentInput = {
    region: regionNumber,
    location: o.location,
    areaMsh: o.areaMsh,
    spotCount: o.spotCount,
    mcintosh: o.mcintosh,
    mountWilson: o.mountWilson,
    ...o.reported,
    flares24h: { ...flares24h },
  };
  const truth = computeTrueProbabilities(o.latent);
  const counts = drawFlareCounts(truth, flares);
  c.timeline.addRegionFlares(c.issueMs, counts, regionNumber);
  c.previousCounts.set(passage.number, counts);
  const { guidance, blended } = scoreRegionDay(input);
  if (!blended) throw new Error(`No guidance could be blended for ${regionNumber} on ${c.day}`);
  const finals = draftFinals(blended, truth, c.behaviour, forecaster);
  return {
    regionNumber,
    day: c.day,
    issueTime: new Date(c.issueMs).toISOString(),
    latitudeDeg: o.latitudeDeg,
    longitudeDeg: o.longitudeDeg,
    isLimbFlagged: o.isLimbFlagged,
    input,
    latent: o.latent,
    truth,
    counts,
    guidance,
    blended,
    finals,
    finalReasons: writeFinalReasons(finals, blended, c.behaviour.marginPoints),
  };
}

export function generateDemoArchive(options: DemoArchiveOptions): DemoArchive {
  assertOptions(options);
  const { seed, startDay, days } = options;
  const firstNumber = options.firstRegionNumber ?? 1;
  const streams = {
    evolution: createStream(seed, "evolution"),
    gaps: createStream(seed, "gaps"),
    flares: createStream(seed, "flares"),
    forecaster: createStream(seed, "forecaster"),
  };
  const groups = generateGroups(days, createStream(seed, "groups"));
  const passages = listPassages(groups, days, firstNumber);
  const timeline = new FlareTimeline(streams.flares);
  const previousCounts = new Map<number, FlareCounts>();
  const behaviour = options.forecaster ?? DEFAULT_FORECASTER;
  const regionDays: ArchiveRegionDay[] = [];
  const dayRecords: ArchiveDay[] = [];
  for (const [d, visits] of groupVisitsByDay(passages, days).entries()) {
    const day = addDays(startDay, d);
    const issueMs = computeIssueTimeMs(day);
    const isOutage = streams.gaps() < MISSING_RATES.outagePerDay;
    const context = { day, issueMs, isOutage, behaviour, streams, timeline, previousCounts };
    const rows = visits.map(({ passage, visit }) => buildRegionDay(passage, visit, context));
    timeline.addUnattributedFlares(issueMs);
    regionDays.push(...rows);
    dayRecords.push(summariseDay(day, new Date(issueMs).toISOString(), rows));
  }
  const regions: ArchiveRegion[] = passages.map((p) => ({
    number: formatRegionNumber(p.number),
    groupId: p.group.id,
    firstDay: addDays(startDay, (p.visits[0] as Visit).dayIndex),
    lastDay: addDays(startDay, (p.visits[p.visits.length - 1] as Visit).dayIndex),
  }));
  const nextRegionNumber = firstNumber + passages.length;
  const flares = timeline.listSortedFlares();
  return { seed, startDay, days, regions, regionDays, flares, dayRecords, nextRegionNumber };
}
