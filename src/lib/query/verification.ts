// API shapes of the verification desk and the query option factories its islands use.
import { queryOptions } from "@tanstack/react-query";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import type { EventListQuery, FluxConventionName } from "@/lib/schemas/verification";
import { fetchJson } from "./fetch-json";

/** A score as the server sends it: a number, or null with the reason it is undefined. */
export type ScoreJson = { value: number; reason?: undefined } | { value: null; reason: string };

export interface EventView {
  id: number;
  listId: number;
  listName: string;
  convention: FluxConventionName;
  startTime: string;
  peakTime: string;
  endTime: string;
  originalClass: string;
  /** The class of the normalised true peak flux, e.g. legacy C7.0 → "M1.0". */
  trueClass: string;
  peakFluxTrue: number;
  regionNumber: string | null;
  isDemo: boolean;
  updatedAt: string;
}

export interface SourceOption {
  id: string;
  label: string;
  kind: "forecaster" | "model" | "external";
  records: number;
  isDemo: boolean;
}

export const CONTINGENCY_KEYS = [
  "pod",
  "far",
  "pofd",
  "csi",
  "bias",
  "pc",
  "tss",
  "hss",
  "gss",
  "apss",
] as const;
export type ContingencyKey = (typeof CONTINGENCY_KEYS)[number];
export const SCORE_KEYS = [
  "brier",
  "bssClimatology",
  "bssReference",
  "reliability",
  "resolution",
  "uncertainty",
  "withinBinVariance",
  "withinBinCovariance",
  "rocArea",
] as const;
export type ScoreKey = (typeof SCORE_KEYS)[number];

export interface ContingencyJson {
  threshold: number;
  table: { hits: number; falseAlarms: number; misses: number; correctNegatives: number };
  scores: Record<ContingencyKey, ScoreJson>;
}

export interface ReliabilityBinJson {
  lower: number;
  upper: number;
  count: number;
  events: number;
  meanForecast: ScoreJson;
  observedFrequency: ScoreJson;
}

export interface RocPointJson {
  threshold: number | null;
  pod: number;
  pofd: number;
}

export interface SweepRowJson {
  threshold: number;
  tss: ScoreJson;
  hss: ScoreJson;
}

export interface TimelinePointJson {
  day: string;
  source: number | null;
  reference: number | null;
  count: number;
}

export interface SideScoresJson {
  brier: ScoreJson;
  bssClimatology: ScoreJson;
  rocArea: ScoreJson;
  reliability: ScoreJson;
  resolution: ScoreJson;
}

export interface VerificationReport {
  source: { id: string; label: string };
  reference: { id: string; label: string } | null;
  level: FlareLevel;
  windowHours: number;
  scope: "region" | "full-disk";
  convention: "true" | "legacy";
  period: { from: string | null; to: string | null };
  sample: {
    n: number;
    events: number;
    baseRate: number | null;
    firstIssue: string | null;
    lastIssue: string | null;
  };
  isDemo: boolean;
  scores: Record<ScoreKey, ScoreJson>;
  contingency: ContingencyJson;
  reliability: ReliabilityBinJson[];
  roc: RocPointJson[];
  sweep: SweepRowJson[];
  timeline: { windowDays: number; points: TimelinePointJson[] };
  /** Source and reference on the cases both forecast; null without a reference. */
  comparison: {
    n: number;
    events: number;
    source: SideScoresJson;
    reference: SideScoresJson;
  } | null;
  notes: string[];
}

export interface IntervalJson {
  estimate: ScoreJson;
  lower: ScoreJson;
  upper: ScoreJson;
  level: number;
  resamples: number;
  undefinedResamples: number;
}

export interface IntervalsResult {
  /** Keyed by score key, or "contingency.<key>". */
  intervals: Record<string, IntervalJson>;
  /** Paired bootstrap of BSS (source) − BSS (reference), both against sample climatology. */
  skillDifference: IntervalJson | null;
}

export type IntervalsMessage =
  | { type: "progress"; done: number; total: number; label: string }
  | { type: "result"; result: IntervalsResult }
  | { type: "error"; message: string };

export const verificationKeys = {
  events: (q: Partial<EventListQuery>) => ["verification", "events", q] as const,
  allEvents: ["verification", "events"] as const,
  proposals: ["verification", "proposals"] as const,
  fit: (id: string) => ["verification", "fit", id] as const,
};

export function eventsQuery(q: Partial<EventListQuery>) {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== "") params.set(k, String(v));
  return queryOptions({
    queryKey: verificationKeys.events(q),
    queryFn: () =>
      fetchJson<{ events: EventView[]; total: number; page: number; pageSize: number }>(
        `/api/events?${params}`,
      ),
    placeholderData: (prev) => prev,
  });
}
