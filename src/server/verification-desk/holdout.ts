// Held-out comparison of a candidate and the active model: split the archive at its last year,
// then score both on the test region-days per level (pure).
import type { AssessmentInput } from "@/lib/domain/assessment-input";
import { FLARE_LEVELS, type FlareLevel } from "@/lib/domain/flare-levels";
import type { ReliabilityBinJson, ScoreJson } from "@/lib/query/verification";
import type { CompiledModel } from "@/server/scoring/models";
import { brierScore, brierSkillScore, reliabilityCurve } from "@/server/verification/scores";
import { RELIABILITY_BINS } from "./report-scores";

const DAY_MS = 86_400_000;

export interface ArchiveSplit {
  trainFrom: string;
  trainTo: string;
  testFrom: string;
  testTo: string;
}

/**
 * The test period is the archive's last 365 days, the training period everything before it
 * (train on all but the last year, test on the last). Null when the archive does not reach
 * beyond one year, since then nothing is left to train on.
 */
export function splitAtLastYear(days: readonly string[]): ArchiveSplit | null {
  if (days.length === 0) return null;
  const sorted = [...days].sort();
  const first = sorted[0] as string;
  const last = sorted[sorted.length - 1] as string;
  const testFromMs = Date.parse(`${last}T00:00:00Z`) - 364 * DAY_MS;
  const testFrom = new Date(testFromMs).toISOString().slice(0, 10);
  if (first >= testFrom) return null;
  const trainTo = new Date(testFromMs - DAY_MS).toISOString().slice(0, 10);
  return { trainFrom: first, trainTo, testFrom, testTo: last };
}

export interface HeldOutDay {
  input: AssessmentInput;
  /** Outcome per level over 24 h (archive rule). */
  outcomes: Record<FlareLevel, 0 | 1>;
}

export interface ModelOnTest {
  brier: ScoreJson;
  bss: ScoreJson;
  reliability: ReliabilityBinJson[];
}

export interface LevelComparison {
  level: FlareLevel;
  /** Test region-days both models could score. */
  n: number;
  events: number;
  /** Test region-days left out because one of the models gave no probability. */
  skipped: number;
  candidate: ModelOnTest;
  active: ModelOnTest;
}

function scoreOnTest(p: Float64Array, o: Uint8Array): ModelOnTest {
  return {
    brier: brierScore(p, o),
    bss: brierSkillScore(p, o),
    reliability: reliabilityCurve(p, o, RELIABILITY_BINS),
  };
}

/**
 * 24 h probabilities of both models on each test region-day, scored with the Brier score, BSS
 * against the test sample's climatology and a reliability curve per level (Wilks, forecast
 * verification). Only region-days both models score enter, so the two are compared like for like.
 */
export function compareOnHeldOut(
  candidate: CompiledModel,
  active: CompiledModel,
  test: readonly HeldOutDay[],
): LevelComparison[] {
  const scored = test.map((d) => ({
    d,
    c: candidate.score(d.input).probabilities,
    a: active.score(d.input).probabilities,
  }));
  const both = scored.filter((s) => s.c !== null && s.a !== null);
  return FLARE_LEVELS.map((level) => {
    const pc = Float64Array.from(both, (s) => s.c![level]["24h"]);
    const pa = Float64Array.from(both, (s) => s.a![level]["24h"]);
    const o = Uint8Array.from(both, (s) => s.d.outcomes[level]);
    return {
      level,
      n: both.length,
      events: o.reduce((sum, v) => sum + v, 0),
      skipped: test.length - both.length,
      candidate: scoreOnTest(pc, o),
      active: scoreOnTest(pa, o),
    };
  });
}
