// Candidate logistic coefficients fitted by maximum likelihood on archived region-days, for the
// predictors and transforms of an existing logistic model (pure, on fitLogistic).
import type { AssessmentInput } from "@/lib/domain/assessment-input";
import { FLARE_LEVELS, type FlareLevel } from "@/lib/domain/flare-levels";
import type { LogisticLevelParams, LogisticParams } from "@/server/scoring/model-params";
import { readPredictor } from "@/server/scoring/predictor-inputs";
import { TRANSFORMS } from "@/server/scoring/transforms";
import { fitLogistic } from "@/server/verification/logistic-fit";

export interface CoefficientFit {
  term: string;
  estimate: number | null;
  standardError: number | null;
  /** The coefficient of the model being recalibrated, for comparison. */
  current: number;
}

export interface LevelFit {
  level: FlareLevel;
  /** Region-days with every predictor inside its transform's domain. */
  n: number;
  skipped: number;
  events: number;
  converged: boolean;
  /** Why the fit did not converge; null when it did. */
  reason: string | null;
  iterations: number;
  deviance: number | null;
  nullDeviance: number | null;
  coefficients: CoefficientFit[];
}

export interface LogisticCandidate {
  /** null unless every level converged. */
  params: LogisticParams | null;
  levels: LevelFit[];
}

export interface LabelledDay {
  input: AssessmentInput;
  /** Observed outcome per level over the model's window (archive rule). */
  outcomes: Record<FlareLevel, 0 | 1>;
}

/** The transformed predictor row of one region-day, or null when a value is missing or out of domain. */
function designRow(level: LogisticLevelParams, input: AssessmentInput): number[] | null {
  const row: number[] = [];
  for (const p of level.predictors) {
    const raw = readPredictor(input, p.input);
    const x = raw === null ? null : TRANSFORMS[p.transform].apply(raw);
    if (x === null || !Number.isFinite(x)) return null;
    row.push(x);
  }
  return row;
}

/**
 * For each level, logit P = β₀ + Σ βⱼ fⱼ(xⱼ) fitted by IRLS (McCullagh & Nelder 1989; fitLogistic),
 * with standard errors from the inverse Fisher information and the convergence report. Only
 * region-days with every predictor available and inside its transform's domain enter a level's fit.
 */
export function fitLogisticCandidate(
  current: LogisticParams,
  days: readonly LabelledDay[],
): LogisticCandidate {
  const levels = FLARE_LEVELS.map((level): LevelFit => {
    const spec = current.levels[level];
    const x: number[][] = [];
    const y: number[] = [];
    for (const d of days) {
      const row = designRow(spec, d.input);
      if (row === null) continue;
      x.push(row);
      y.push(d.outcomes[level]);
    }
    const terms = ["intercept", ...spec.predictors.map((p) => `${p.transform}(${p.input})`)];
    const currentValues = [spec.intercept, ...spec.predictors.map((p) => p.coefficient)];
    const base = {
      level,
      n: x.length,
      skipped: days.length - x.length,
      events: y.reduce((s, v) => s + v, 0),
    };
    if (x.length <= terms.length) {
      return {
        ...base,
        converged: false,
        reason: `only ${x.length} usable region-days for ${terms.length} coefficients`,
        iterations: 0,
        deviance: null,
        nullDeviance: null,
        coefficients: terms.map((term, j) => ({
          term,
          estimate: null,
          standardError: null,
          current: currentValues[j] as number,
        })),
      };
    }
    const fit = fitLogistic(x, y);
    if (!fit.converged) {
      return {
        ...base,
        converged: false,
        reason: fit.reason,
        iterations: fit.iterations,
        deviance: null,
        nullDeviance: null,
        coefficients: terms.map((term, j) => ({
          term,
          estimate: fit.lastCoefficients[j] ?? null,
          standardError: null,
          current: currentValues[j] as number,
        })),
      };
    }
    return {
      ...base,
      converged: true,
      reason: null,
      iterations: fit.iterations,
      deviance: fit.deviance,
      nullDeviance: fit.nullDeviance,
      coefficients: terms.map((term, j) => ({
        term,
        estimate: fit.coefficients[j] as number,
        standardError: fit.standardErrors[j] as number,
        current: currentValues[j] as number,
      })),
    };
  });
  if (!levels.every((l) => l.converged)) return { params: null, levels };
  const fitted = (level: FlareLevel): LogisticLevelParams => {
    const lf = levels.find((l) => l.level === level) as LevelFit;
    const [intercept, ...slopes] = lf.coefficients.map((c) => c.estimate as number);
    return {
      intercept: intercept as number,
      predictors: current.levels[level].predictors.map((p, j) => ({
        ...p,
        coefficient: slopes[j] as number,
      })),
    };
  };
  return {
    params: {
      windowHours: current.windowHours,
      levels: { "C+": fitted("C+"), "M+": fitted("M+"), X: fitted("X") },
    },
    levels,
  };
}
