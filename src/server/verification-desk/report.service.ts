// The verification report: loads the chosen source's records and the observed events, matches
// them into cases and scores them beside the reference.
import type { SourceOption, VerificationReport } from "@/lib/query/verification";
import type { ReportQuery } from "@/lib/schemas/verification-report";
import { thinRocPoints } from "@/lib/charts/verification";
import { buildCases, sharedCases, type VerificationCases } from "./cases";
import { rememberFor } from "./cases-cache";
import { loadEventsForMatching } from "./events.db";
import { listSources, loadRecords } from "./records.db";
import { scoreSample, scoreSide, skillAgainstReference } from "./report-scores";
import { rollingBrier } from "./rolling-brier";

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;
export const TIMELINE_WINDOW_DAYS = 30;

export interface LoadedCases {
  cases: VerificationCases;
  source: SourceOption | null;
  reference: SourceOption | null;
  eventsInPeriod: number;
}

function periodOf(q: ReportQuery): { fromMs: number | null; toMs: number | null } {
  return {
    fromMs: q.from ? Date.parse(`${q.from}T00:00:00Z`) : null,
    toMs: q.to ? Date.parse(`${q.to}T00:00:00Z`) + DAY_MS : null,
  };
}

/** Records of the source (and reference) matched against the events that could fall in a window. */
export async function loadCases(q: ReportQuery, sources?: SourceOption[]): Promise<LoadedCases> {
  const key = JSON.stringify([
    q.source,
    q.reference ?? null,
    q.level,
    q.window,
    q.scope,
    q.from ?? null,
    q.to ?? null,
    q.convention,
  ]);
  return rememberFor(key, () => readCases(q, sources));
}

async function readCases(q: ReportQuery, sources?: SourceOption[]): Promise<LoadedCases> {
  const known = sources ?? (await listSources());
  const { fromMs, toMs } = periodOf(q);
  const wanted = q.reference ? [q.source, q.reference] : [q.source];
  const rows = await loadRecords({
    sources: wanted,
    level: q.level,
    windowHours: q.window,
    scope: q.scope,
    fromMs,
    toMs,
  });
  let first = Number.POSITIVE_INFINITY;
  let last = Number.NEGATIVE_INFINITY;
  for (const r of rows) {
    first = Math.min(first, r.issueTimeMs);
    last = Math.max(last, r.issueTimeMs);
  }
  const events =
    rows.length === 0 ? [] : await loadEventsForMatching(first, last + q.window * HOUR_MS);
  const cases = buildCases(
    rows,
    {
      source: q.source,
      reference: q.reference ?? null,
      level: q.level,
      windowHours: q.window,
      convention: q.convention,
    },
    events,
  );
  return {
    cases,
    source: known.find((s) => s.id === q.source) ?? null,
    reference: q.reference ? (known.find((s) => s.id === q.reference) ?? null) : null,
    eventsInPeriod: events.length,
  };
}

function countOnes(o: Uint8Array): number {
  let n = 0;
  for (const v of o) n += v;
  return n;
}

function describeNotes(q: ReportQuery, loaded: LoadedCases, shared: number): string[] {
  const notes = [
    q.convention === "true"
      ? "Level thresholds are applied to true flux (legacy-scaled lists were divided by 0.7 on upload)."
      : "Level thresholds are applied to legacy-scaled flux (true flux × 0.7), to compare with legacy-derived tables.",
    `An event is a flare at or above ${q.level === "X" ? "X1.0" : q.level === "M+" ? "M1.0" : "C1.0"} peaking in [issue time, issue time + ${q.window} h)${q.scope === "region" ? " and attributed to the forecast's region" : " anywhere on the disk"}.`,
  ];
  if (!loaded.source) notes.push(`No forecast records of ${q.source} are stored.`);
  if (loaded.cases.p.length > 0 && loaded.eventsInPeriod === 0)
    notes.push(
      "No observed events are stored for this period: upload an event list before reading these scores.",
    );
  if (loaded.cases.collapsedDuplicates > 0)
    notes.push(
      `${loaded.cases.collapsedDuplicates} repeated records of a case (re-issued bulletins) were collapsed to the latest.`,
    );
  if (q.reference)
    notes.push(
      `The reference forecast covers ${shared} of ${loaded.cases.p.length} cases; comparisons and BSS against it use those cases only.`,
    );
  return notes;
}

export async function buildReport(
  q: ReportQuery,
  sources?: SourceOption[],
): Promise<VerificationReport> {
  const loaded = await loadCases(q, sources);
  const { cases } = loaded;
  const sample = scoreSample(cases.p, cases.o, q.threshold);
  const shared = sharedCases(cases);
  const hasReference = !!q.reference;
  const n = cases.p.length;
  const events = countOnes(cases.o);
  return {
    source: { id: q.source, label: loaded.source?.label ?? q.source },
    reference: q.reference
      ? { id: q.reference, label: loaded.reference?.label ?? q.reference }
      : null,
    level: q.level,
    windowHours: q.window,
    scope: q.scope,
    convention: q.convention,
    period: { from: q.from ?? null, to: q.to ?? null },
    sample: {
      n,
      events,
      baseRate: n > 0 ? events / n : null,
      firstIssue: n > 0 ? new Date(cases.issueTimeMs[0] as number).toISOString() : null,
      lastIssue: n > 0 ? new Date(cases.issueTimeMs[n - 1] as number).toISOString() : null,
    },
    isDemo: !!loaded.source?.isDemo || !!loaded.reference?.isDemo,
    scores: {
      ...sample.scores,
      bssReference: skillAgainstReference(shared.p, shared.o, hasReference ? shared.pRef : null),
    },
    contingency: sample.contingency,
    reliability: sample.reliability,
    roc: thinRocPoints(sample.roc),
    sweep: sample.sweep,
    timeline: {
      windowDays: TIMELINE_WINDOW_DAYS,
      points: rollingBrier(cases, TIMELINE_WINDOW_DAYS),
    },
    comparison:
      hasReference && shared.o.length > 0
        ? {
            n: shared.o.length,
            events: countOnes(shared.o),
            source: scoreSide(shared.p, shared.o),
            reference: scoreSide(shared.pRef, shared.o),
          }
        : null,
    notes: describeNotes(q, loaded, shared.o.length),
  };
}
