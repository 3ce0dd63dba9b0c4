// The bootstrap confidence intervals of a report, as a list of tasks run one at a time so the
// caller can report progress between them (pure).
import type { ContingencyKey, IntervalJson } from "@/lib/query/verification";
import { CONTINGENCY_KEYS } from "@/lib/query/verification";
import {
  bootstrapInterval,
  brierScore,
  brierSkillScore,
  contingencyFromProbabilities,
  contingencyScores,
  murphyDecomposition,
  pairedBootstrapDifference,
  rocCurve,
  type BootstrapOptions,
  type NumberList,
  type Statistic,
} from "@/server/verification/scores";
import { RELIABILITY_BINS } from "./report-scores";

export interface IntervalTask {
  key: string;
  label: string;
  run: () => IntervalJson;
}

export interface IntervalSample {
  p: NumberList;
  o: NumberList;
  /** The cases the reference also forecast, aligned; null without a reference. */
  shared: { p: Float64Array; pRef: Float64Array; o: Uint8Array } | null;
  threshold: number;
}

/** One fixed seed, so the same report always shows the same intervals (and every score is
 * resampled on the same draws). */
export const INTERVAL_SEED = 20_260_101;
export const INTERVAL_LEVEL = 0.95;

const bssClimatology: Statistic = (p, o) => brierSkillScore(p, o);
const murphyTerm =
  (term: "reliability" | "resolution" | "uncertainty"): Statistic =>
  (p, o) =>
    murphyDecomposition(p, o, RELIABILITY_BINS)[term];
const contingencyTerm =
  (key: ContingencyKey, threshold: number): Statistic =>
  (p, o) =>
    contingencyScores(contingencyFromProbabilities(p, o, threshold))[key];

/**
 * The bootstrap resamples cases, but its statistic sees only (p, o). To resample the scored
 * forecasts and the reference together for BSS against the reference, each case's position i is
 * passed as p = i/(n − 1) (a valid probability that maps back to i exactly) and the statistic
 * gathers both forecast sets by position. The percentile interval is as for any other score.
 */
export function skillAgainstReferenceInterval(
  p: Float64Array,
  pRef: Float64Array,
  o: Uint8Array,
  opts: BootstrapOptions,
): IntervalJson {
  const n = o.length;
  const positions = Float64Array.from({ length: n }, (_, i) => (n > 1 ? i / (n - 1) : 0));
  const pBuf = new Float64Array(n);
  const refBuf = new Float64Array(n);
  const statistic: Statistic = (pos, oo) => {
    for (let j = 0; j < pos.length; j++) {
      const i = n > 1 ? Math.round((pos[j] as number) * (n - 1)) : 0;
      pBuf[j] = p[i] as number;
      refBuf[j] = pRef[i] as number;
    }
    return brierSkillScore(pBuf, oo, refBuf);
  };
  return bootstrapInterval(positions, o, statistic, opts);
}

export function buildIntervalTasks(sample: IntervalSample, resamples: number): IntervalTask[] {
  const opts: BootstrapOptions = { resamples, seed: INTERVAL_SEED, level: INTERVAL_LEVEL };
  const { p, o, shared, threshold } = sample;
  const on = (stat: Statistic) => () => bootstrapInterval(p, o, stat, opts);
  const tasks: IntervalTask[] = [
    { key: "brier", label: "Brier score", run: on(brierScore) },
    { key: "bssClimatology", label: "BSS against climatology", run: on(bssClimatology) },
    { key: "reliability", label: "Reliability", run: on(murphyTerm("reliability")) },
    { key: "resolution", label: "Resolution", run: on(murphyTerm("resolution")) },
    { key: "uncertainty", label: "Uncertainty", run: on(murphyTerm("uncertainty")) },
    { key: "rocArea", label: "ROC area", run: on((pp, oo) => rocCurve(pp, oo).auc) },
    ...CONTINGENCY_KEYS.map((key) => ({
      key: `contingency.${key}`,
      label: key.toUpperCase(),
      run: on(contingencyTerm(key, threshold)),
    })),
  ];
  if (shared) {
    tasks.push({
      key: "bssReference",
      label: "BSS against the reference",
      run: () => skillAgainstReferenceInterval(shared.p, shared.pRef, shared.o, opts),
    });
    tasks.push({
      key: "skillDifference",
      label: "Skill difference (paired)",
      run: () => pairedBootstrapDifference(shared.p, shared.pRef, shared.o, bssClimatology, opts),
    });
  }
  return tasks;
}
