// API shapes of recalibration: fits (with their stages), fitted rates and coefficients, the
// held-out comparison and proposals.
import type { FlareLevel } from "@/lib/domain/flare-levels";
import type { ReliabilityBinJson, ScoreJson } from "./verification";

export interface RecalibrationLevelFit {
  level: FlareLevel;
  n: number;
  skipped: number;
  events: number;
  converged: boolean;
  reason: string | null;
  iterations: number;
  deviance: number | null;
  nullDeviance: number | null;
  coefficients: {
    term: string;
    estimate: number | null;
    standardError: number | null;
    current: number;
  }[];
}

export interface RateRowJson {
  mcintosh: string;
  regionDays: number;
  source: "class" | "zurich-pooled";
  basisRegionDays: number;
  isSparse: boolean;
  rates: Record<"C" | "M" | "X", { flares: number; ratePerDay: number; standardError: number }>;
}

export interface HeldOutLevelJson {
  level: FlareLevel;
  n: number;
  events: number;
  skipped: number;
  candidate: { brier: ScoreJson; bss: ScoreJson; reliability: ReliabilityBinJson[] };
  active: { brier: ScoreJson; bss: ScoreJson; reliability: ReliabilityBinJson[] };
}

export interface FitResultJson {
  model: { id: number; key: string; version: string; kind: string; name: string };
  archive: {
    from: string | null;
    to: string | null;
    regionDays: number;
    events: number;
    isDemo: boolean;
    rule: string;
  };
  split: { trainFrom: string; trainTo: string; testFrom: string; testTo: string } | null;
  poisson: {
    regionDays: number;
    skipped: number;
    minRegionDays: number;
    pooledClasses: string[];
    zurichFromArchive: string[];
    rows: RateRowJson[];
  } | null;
  logistic: { levels: RecalibrationLevelFit[] } | null;
  holdout: { levels: HeldOutLevelJson[]; reason: null } | { levels: null; reason: string };
  isProposable: boolean;
  notProposableReason: string | null;
}

export interface FitJobJson {
  id: string;
  status: "running" | "done" | "failed";
  stage: string;
  done: number;
  total: number;
  error: string | null;
  result: FitResultJson | null;
}

export interface ProposalJson {
  id: number;
  kind: string;
  modelKey: string;
  status: "proposed" | "activated" | "rejected";
  proposedBy: string | null;
  decidedBy: string | null;
  createdAt: string;
  decidedAt: string | null;
  archive: { from: string | null; to: string | null; isDemo: boolean };
  heldOut: { level: FlareLevel; candidateBss: ScoreJson; activeBss: ScoreJson }[];
  activatedVersion: string | null;
}
