// Maximum-likelihood logistic regression by Newton–Raphson (IRLS) with standard errors.

import {
  decomposeCholesky,
  invertFromCholesky,
  solveCholesky,
  type Matrix,
} from "./dense-cholesky";
import { assertLogisticInputs, evaluateLogistic } from "./logistic-likelihood";

export interface LogisticFitOptions {
  /** Newton iterations allowed (default 50). */
  maxIterations?: number;
  /** Stop when |D_old − D_new| / (|D_new| + 0.1) < tolerance (default 1e-10). */
  tolerance?: number;
}

export type LogisticFit =
  | {
      converged: true;
      /** Intercept first, then one coefficient per predictor column. */
      coefficients: number[];
      standardErrors: number[];
      covariance: Matrix;
      deviance: number;
      nullDeviance: number;
      logLikelihood: number;
      iterations: number;
    }
  | { converged: false; reason: string; iterations: number; lastCoefficients: number[] };

/** |η| beyond 20 puts a fitted probability within 2e-9 of 0 or 1. */
const SEPARATION_ETA = 20;
const MAX_HALVINGS = 30;
const REASON_SEPARATION =
  "separation: some fitted probabilities are numerically 0 or 1, so the maximum-likelihood estimate does not exist (a predictor splits events from non-events)";

function failFit(reason: string, iterations: number, beta: number[]): LogisticFit {
  return { converged: false, reason, iterations, lastCoefficients: beta };
}

/** A singular information matrix with extreme fitted values is separation, not collinearity. */
function explainSingular(message: string, maxAbsEta: number): string {
  return maxAbsEta > SEPARATION_ETA ? REASON_SEPARATION : message;
}

/**
 * Fits logit P(y = 1) = β₀ + Σ βⱼ xⱼ. Each Newton step solves (XᵀWX) δ = Xᵀ(y − μ) with
 * W = diag(μ(1 − μ)), which is iteratively reweighted least squares for the canonical link
 * (McCullagh & Nelder 1989, Generalized Linear Models, 2nd ed., §2.5 and §4.4). A step that
 * raises the deviance is halved (as R's glm.fit does), the stopping rule is glm.control's relative
 * deviance change (common practice), and standard errors are √diag((XᵀWX)⁻¹) at the optimum, the
 * inverse Fisher information. Fitted probabilities numerically 0 or 1 mean (quasi-)separation:
 * the maximum-likelihood estimate does not exist, and the fit is reported as not converged.
 */
export function fitLogistic(
  predictors: readonly (readonly number[])[],
  outcomes: readonly number[],
  options: LogisticFitOptions = {},
): LogisticFit {
  const { maxIterations = 50, tolerance = 1e-10 } = options;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw new Error(`maxIterations must be a whole number ≥ 1; got ${String(maxIterations)}`);
  }
  if (!(tolerance > 0 && tolerance < 1)) {
    throw new Error(`tolerance must lie in (0, 1); got ${String(tolerance)}`);
  }
  const { nullDeviance, width, events } = assertLogisticInputs(predictors, outcomes);
  let beta = new Array<number>(width).fill(0);
  if (events === 0 || events === outcomes.length) {
    const which =
      events === 0 ? "no events (every outcome is 0)" : "only events (every outcome is 1)";
    return failFit(`the sample has ${which}: the intercept would be infinite`, 0, beta);
  }
  let current = evaluateLogistic(predictors, outcomes, beta);
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const factor = decomposeCholesky(current.information);
    if (!factor.ok) {
      return failFit(explainSingular(factor.message, current.maxAbsEta), iteration, beta);
    }
    const step = solveCholesky(factor.lower, current.score);
    let scale = 1;
    let candidate = beta.map((b, j) => b + (step[j] as number));
    let next = evaluateLogistic(predictors, outcomes, candidate);
    for (let h = 0; next.deviance > current.deviance && h < MAX_HALVINGS; h++) {
      scale /= 2;
      candidate = beta.map((b, j) => b + scale * (step[j] as number));
      next = evaluateLogistic(predictors, outcomes, candidate);
    }
    if (next.deviance > current.deviance) {
      return failFit(
        `step-halving could not lower the deviance at iteration ${iteration}`,
        iteration,
        beta,
      );
    }
    const change = Math.abs(current.deviance - next.deviance) / (Math.abs(next.deviance) + 0.1);
    beta = candidate;
    current = next;
    if (change < tolerance) {
      if (current.maxAbsEta > SEPARATION_ETA) return failFit(REASON_SEPARATION, iteration, beta);
      const final = decomposeCholesky(current.information);
      if (!final.ok) {
        return failFit(explainSingular(final.message, current.maxAbsEta), iteration, beta);
      }
      const covariance = invertFromCholesky(final.lower);
      return {
        converged: true,
        coefficients: beta,
        standardErrors: covariance.map((row, j) => Math.sqrt(row[j] as number)),
        covariance,
        deviance: current.deviance,
        nullDeviance,
        logLikelihood: -current.deviance / 2,
        iterations: iteration,
      };
    }
  }
  const reason =
    current.maxAbsEta > SEPARATION_ETA
      ? REASON_SEPARATION
      : `no convergence within ${maxIterations} iterations`;
  return failFit(reason, maxIterations, beta);
}
