// Entry point of the forecast verification scores; the implementations live in sibling files.
//
// Score shape: every score is a `ScoreValue` — `{ value: number }` when defined for the sample,
// `{ value: null, reason: string }` when not (empty sample, no observed events, no non-events,
// a zero denominator). NaN and Infinity are never returned.
// Input rule: forecasts p and outcomes o are arrays (or typed arrays) of equal length, every p a
// probability in [0, 1], every o exactly 0 or 1; anything else throws an Error saying which
// index is wrong. Warnings are issued when p ≥ threshold, everywhere.

export {
  REASON_ALL_EVENTS,
  REASON_EMPTY,
  REASON_NO_EVENTS,
  defineScore,
  divideScore,
  undefinedScore,
  type ScoreValue,
} from "./score-value";
export { assertForecastPairs, countEvents, type NumberList } from "./forecast-input";
export { brierScore, brierSkillScore, logLoss } from "./brier";
export { findBinIndex, resolveBinEdges, type BinSpec } from "./forecast-bins";
export { murphyDecomposition, type MurphyDecomposition } from "./murphy";
export { reliabilityCurve, type ReliabilityBin } from "./reliability";
export { rocCurve, type RocCurve, type RocPoint } from "./roc";
export { contingencyScores, type ContingencyScores, type ContingencyTable } from "./contingency";
export {
  DEFAULT_SWEEP_THRESHOLDS,
  contingencyFromProbabilities,
  thresholdSweep,
  type ThresholdRow,
} from "./threshold-sweep";
export {
  bootstrapInterval,
  pairedBootstrapDifference,
  type BootstrapInterval,
  type BootstrapOptions,
  type Statistic,
} from "./bootstrap";
export { createMulberry32 } from "./prng";
