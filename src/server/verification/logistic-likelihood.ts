// Input checks, deviance, score vector and Fisher information of the binary logistic model.

import type { Matrix } from "./dense-cholesky";

export interface LogisticEvaluation {
  deviance: number;
  /** Xᵀ(y − μ), the gradient of the log-likelihood. */
  score: number[];
  /** XᵀWX with W = diag(μ(1 − μ)), the Fisher information. */
  information: Matrix;
  maxAbsEta: number;
}

/** ln(1 + eˣ) without overflow: max(x, 0) + ln(1 + e^−|x|) (common practice). */
function softplus(x: number): number {
  return Math.max(x, 0) + Math.log1p(Math.exp(-Math.abs(x)));
}

/**
 * Validates the design and returns the coefficient count (intercept + columns) and the null
 * deviance −2 n [ȳ ln ȳ + (1 − ȳ) ln(1 − ȳ)] of the intercept-only model (McCullagh & Nelder 1989).
 */
export function assertLogisticInputs(
  predictors: readonly (readonly number[])[],
  outcomes: readonly number[],
): { width: number; events: number; nullDeviance: number } {
  const n = outcomes.length;
  if (predictors.length !== n) {
    throw new Error(`Predictors have ${predictors.length} rows but there are ${n} outcomes`);
  }
  const columns = predictors[0]?.length ?? 0;
  if (n <= columns + 1) {
    throw new Error(
      `A logistic fit of ${columns + 1} coefficients needs more than ${columns + 1} cases; got ${n}`,
    );
  }
  let events = 0;
  predictors.forEach((row, i) => {
    if (row.length !== columns) {
      throw new Error(`Row ${i} has ${row.length} predictors; expected ${columns}`);
    }
    if (!row.every(Number.isFinite)) {
      throw new Error(`Row ${i} has a predictor that is not a finite number`);
    }
    const y = outcomes[i];
    if (y !== 0 && y !== 1) throw new Error(`Outcome ${i} must be 0 or 1; got ${String(y)}`);
    events += y;
  });
  const rate = events / n;
  // A constant outcome has null deviance 0 (0·ln 0 taken as 0); the fitter reports it as unfittable.
  const nullDeviance =
    events === 0 || events === n
      ? 0
      : -2 * n * (rate * Math.log(rate) + (1 - rate) * Math.log(1 - rate));
  return { width: columns + 1, events, nullDeviance };
}

/** Deviance −2 Σ [y ln μ + (1 − y) ln(1 − μ)], with ln μ = −softplus(−η) to avoid log(0). */
export function evaluateLogistic(
  predictors: readonly (readonly number[])[],
  outcomes: readonly number[],
  beta: readonly number[],
): LogisticEvaluation {
  const k = beta.length;
  const score = new Array<number>(k).fill(0);
  const information: Matrix = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  const x = new Array<number>(k).fill(1);
  let deviance = 0;
  let maxAbsEta = 0;
  for (let i = 0; i < outcomes.length; i++) {
    const row = predictors[i] as readonly number[];
    for (let j = 1; j < k; j++) x[j] = row[j - 1] as number;
    let eta = 0;
    for (let j = 0; j < k; j++) eta += (beta[j] as number) * (x[j] as number);
    maxAbsEta = Math.max(maxAbsEta, Math.abs(eta));
    const y = outcomes[i] as number;
    deviance += 2 * (y === 1 ? softplus(-eta) : softplus(eta));
    const mu = 1 / (1 + Math.exp(-eta));
    const weight = mu * (1 - mu);
    for (let j = 0; j < k; j++) {
      score[j]! += (x[j] as number) * (y - mu);
      const infoRow = information[j] as number[];
      for (let m = 0; m <= j; m++) infoRow[m]! += weight * (x[j] as number) * (x[m] as number);
    }
  }
  for (let j = 0; j < k; j++) {
    for (let m = j + 1; m < k; m++)
      (information[j] as number[])[m] = (information[m] as number[])[j] as number;
  }
  return { deviance, score, information, maxAbsEta };
}
