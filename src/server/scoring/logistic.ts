// Logistic-regression guidance: p = 1/(1 + exp(−(β₀ + Σβᵢxᵢ))) per level on declared transforms.

import { FLARE_LEVELS } from "@/lib/domain/flare-levels";
import {
  MAGNETIC_INPUTS,
  type AssessmentInput,
  type PredictorInput,
} from "@/lib/domain/assessment-input";
import { explainHardLimitError, METRIC_FIELDS, type MetricField } from "@/lib/domain/metrics";
import type { LogisticLevelParams, LogisticParams } from "./model-params";
import { TRANSFORMS, type TransformName } from "./transforms";
import { buildUndefinedOutcome, type Scorer } from "./score-result";
import { explainLimbFlag, readPredictor } from "./predictor-inputs";

/** The logistic function without overflow: exp is only ever taken of a non-positive number. */
export function sigmoid(z: number): number {
  if (z >= 0) return 1 / (1 + Math.exp(-z));
  const e = Math.exp(z);
  return e / (1 + e);
}

export type LinearPredictorResult = { ok: true; value: number } | { ok: false; reason: string };

interface CompiledTerm {
  /** Index of the term's input in the scorer's list of required inputs. */
  slot: number;
  input: PredictorInput;
  transform: TransformName;
  coefficient: number;
}

/** β₀ + Σβᵢ·fᵢ(xᵢ) over precompiled terms reading their raw inputs from `raw[slot]`. */
function sumTerms(
  intercept: number,
  terms: readonly CompiledTerm[],
  raw: ArrayLike<number>,
): LinearPredictorResult {
  let z = intercept;
  for (const term of terms) {
    const value = raw[term.slot] as number;
    const x = TRANSFORMS[term.transform].apply(value);
    if (x === null) {
      const domain = TRANSFORMS[term.transform].domain;
      return {
        ok: false,
        reason: `${term.input} = ${value} is outside the domain of ${term.transform} (${domain})`,
      };
    }
    z += term.coefficient * x;
  }
  if (!Number.isFinite(z)) return { ok: false, reason: "the linear predictor is not finite" };
  return { ok: true, value: z };
}

function compileTerms(
  level: LogisticLevelParams,
  slots: ReadonlyMap<PredictorInput, number>,
): CompiledTerm[] {
  return level.predictors.map(({ input, transform, coefficient }) => ({
    slot: slots.get(input) as number,
    input,
    transform,
    coefficient,
  }));
}

/** β₀ + Σβᵢ·fᵢ(xᵢ), given the raw values of the inputs the level uses. */
export function evaluateLinearPredictor(
  level: LogisticLevelParams,
  values: Readonly<Partial<Record<PredictorInput, number>>>,
): LinearPredictorResult {
  const inputs = [...new Set(level.predictors.map((p) => p.input))];
  const missing = inputs.find((input) => values[input] === undefined);
  if (missing) return { ok: false, reason: `missing input ${missing}` };
  const terms = compileTerms(level, new Map(inputs.map((input, slot) => [input, slot])));
  return sumTerms(
    level.intercept,
    terms,
    inputs.map((input) => values[input] as number),
  );
}

const METRIC_SET: ReadonlySet<string> = new Set(METRIC_FIELDS);

function isMetricField(input: PredictorInput): input is MetricField & PredictorInput {
  return METRIC_SET.has(input);
}

/**
 * A scorer for one coefficient set. Probabilities for the fitted window W become 24/48/72 h by
 * the Poisson conversion P_T = 1 − (1 − P_W)^(T/W) (see poisson.ts).
 */
export function compileLogistic(params: LogisticParams): Scorer {
  const required = [
    ...new Set(FLARE_LEVELS.flatMap((l) => params.levels[l].predictors.map((p) => p.input))),
  ];
  const slots = new Map(required.map((input, slot) => [input, slot]));
  const levels = FLARE_LEVELS.map((level) => ({
    level,
    intercept: params.levels[level].intercept,
    terms: compileTerms(params.levels[level], slots),
  }));
  const metricSlots = required.flatMap((input, slot) =>
    isMetricField(input) ? [{ input, slot }] : [],
  );
  const usesMagnetic = required.some((input) => MAGNETIC_INPUTS.has(input));
  // T/W for T = 24, 48, 72 h.
  const [r24, r48, r72] = [24, 48, 72].map((hours) => hours / params.windowHours) as [
    number,
    number,
    number,
  ];
  const buildRow = (logNone: number) => ({
    "24h": 0 - Math.expm1(r24 * logNone),
    "48h": 0 - Math.expm1(r48 * logNone),
    "72h": 0 - Math.expm1(r72 * logNone),
  });

  return (input: AssessmentInput, context) => {
    const raw = new Float64Array(required.length);
    let missing: string[] | null = null;
    for (let slot = 0; slot < required.length; slot++) {
      const name = required[slot] as PredictorInput;
      const value = readPredictor(input, name);
      if (value === null) (missing ??= []).push(name);
      else raw[slot] = value;
    }
    if (missing) return buildUndefinedOutcome(`missing inputs: ${missing.join(", ")}`, missing);
    for (const { input: name, slot } of metricSlots) {
      const error = explainHardLimitError(name, raw[slot]);
      if (error) return buildUndefinedOutcome(`${name}: ${error}`);
    }
    // P_T = 1 − exp((T/W)·ln(1 − P_W)), the Poisson window conversion; 0 − keeps +0.
    const logNone: number[] = [];
    for (const { level, intercept, terms } of levels) {
      const z = sumTerms(intercept, terms, raw);
      if (!z.ok) return buildUndefinedOutcome(`${level}: ${z.reason}`);
      logNone.push(Math.log1p(-sigmoid(z.value)));
    }
    const [c = 0, m = 0, x = 0] = logNone;
    const probabilities = { "C+": buildRow(c), "M+": buildRow(m), X: buildRow(x) };
    const limbFlag = usesMagnetic ? explainLimbFlag(input.location, context.b0Deg ?? 0) : null;
    return { probabilities, missingInputs: [], flags: limbFlag ? [limbFlag] : [], reason: null };
  };
}
