// Reads the committed reference fixtures written by scripts/fixtures/make-sklearn-fixtures.py.

import { readFileSync } from "node:fs";

export interface SklearnSet {
  name: string;
  p: number[];
  o: number[];
  brier_score_loss: number;
  roc_auc_score: number;
  roc_curve: { fpr: number[]; tpr: number[]; thresholds: number[] };
  calibration_curve: Record<string, { prob_true: number[]; prob_pred: number[] }>;
  log_loss?: number;
}

export interface LogitFixture {
  x: number[] | number[][];
  y: number[];
  params: number[];
  bse: number[];
  deviance: number;
  null_deviance: number;
  converged: boolean;
}

export function readFixture<T>(name: string): T {
  const url = new URL(`../../fixtures/verification/${name}`, import.meta.url);
  return JSON.parse(readFileSync(url, "utf8")) as T;
}

/** |actual − expected| ≤ rel · max(|expected|, tiny): a relative check for reference values. */
export function isRelativelyClose(actual: number, expected: number, rel = 1e-12): boolean {
  return Math.abs(actual - expected) <= rel * Math.max(Math.abs(expected), 1e-300);
}
