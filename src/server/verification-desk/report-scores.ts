// The scores of one verification sample: Brier and skill, Murphy decomposition, ROC, reliability,
// the contingency table at a threshold and the threshold sweep (pure, on the tested math).
import type {
  ContingencyJson,
  ReliabilityBinJson,
  RocPointJson,
  ScoreJson,
  SideScoresJson,
  SweepRowJson,
} from "@/lib/query/verification";
import {
  brierScore,
  brierSkillScore,
  contingencyFromProbabilities,
  contingencyScores,
  murphyDecomposition,
  reliabilityCurve,
  rocCurve,
  thresholdSweep,
  undefinedScore,
  type NumberList,
} from "@/server/verification/scores";

/** Ten equal bins, the reliability diagram's and the binned decomposition's (common practice). */
export const RELIABILITY_BINS = 10;

export interface SampleScores {
  brier: ScoreJson;
  bssClimatology: ScoreJson;
  reliability: ScoreJson;
  resolution: ScoreJson;
  uncertainty: ScoreJson;
  withinBinVariance: ScoreJson;
  withinBinCovariance: ScoreJson;
  rocArea: ScoreJson;
}

export interface SampleReport {
  scores: SampleScores;
  contingency: ContingencyJson;
  reliability: ReliabilityBinJson[];
  roc: RocPointJson[];
  sweep: SweepRowJson[];
}

/**
 * Brier score and BSS against the sample climatology (Wilks, forecast verification); REL, RES,
 * UNC with the within-bin terms of Stephenson, Coelho & Jolliffe (2008, Wea. Forecasting 23, 752)
 * on ten bins, so BS = REL − RES + UNC + WBV − WBC holds exactly; ROC area (Mason 1982).
 */
export function scoreSample(p: NumberList, o: NumberList, threshold: number): SampleReport {
  const murphy = murphyDecomposition(p, o, RELIABILITY_BINS);
  const roc = rocCurve(p, o);
  const table = contingencyFromProbabilities(p, o, threshold);
  return {
    scores: {
      brier: brierScore(p, o),
      bssClimatology: brierSkillScore(p, o),
      reliability: murphy.reliability,
      resolution: murphy.resolution,
      uncertainty: murphy.uncertainty,
      withinBinVariance: murphy.withinBinVariance,
      withinBinCovariance: murphy.withinBinCovariance,
      rocArea: roc.auc,
    },
    contingency: { threshold, table, scores: contingencyScores(table) },
    reliability: reliabilityCurve(p, o, RELIABILITY_BINS),
    roc: roc.points,
    sweep: thresholdSweep(p, o).map((row) => ({
      threshold: row.threshold,
      tss: row.scores.tss,
      hss: row.scores.hss,
    })),
  };
}

/** The few scores shown side by side for two forecast sets on the same cases. */
export function scoreSide(p: NumberList, o: NumberList): SideScoresJson {
  const murphy = murphyDecomposition(p, o, RELIABILITY_BINS);
  return {
    brier: brierScore(p, o),
    bssClimatology: brierSkillScore(p, o),
    rocArea: rocCurve(p, o).auc,
    reliability: murphy.reliability,
    resolution: murphy.resolution,
  };
}

/** BSS of p with the reference forecasts as reference: 1 − BS/BS_ref (Wilks). */
export function skillAgainstReference(
  p: NumberList,
  o: NumberList,
  reference: NumberList | null,
): ScoreJson {
  if (reference === null) return undefinedScore("no reference forecast chosen");
  if (p.length === 0) return undefinedScore("the scored source and the reference share no cases");
  return brierSkillScore(p, o, reference);
}
