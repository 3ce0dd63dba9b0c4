// Guidance model definitions, their compilation into scorers, and scoring one region.

import type { AssessmentInput } from "@/lib/domain/assessment-input";
import { compileLogistic } from "./logistic";
import {
  parseModelParams,
  type FieldError,
  type ModelKind,
  type ModelParamsByKind,
} from "./model-params";
import { appendGridFlags } from "./order-rules";
import { compilePersistence } from "./persistence";
import { compileMcIntoshPoisson } from "./rate-table";
import type { ScoreContext, ScoreResult, Scorer } from "./score-result";

interface ModelDefinitionOf<K extends ModelKind> {
  key: string;
  version: string;
  kind: K;
  name: string;
  provenance: string;
  params: ModelParamsByKind[K];
  active: boolean;
}

export type ModelDefinition = { [K in ModelKind]: ModelDefinitionOf<K> }[ModelKind];

export interface CompiledModel {
  key: string;
  version: string;
  kind: ModelKind;
  name: string;
  provenance: string;
  score: (input: AssessmentInput, context?: ScoreContext) => ScoreResult;
}

/** Thrown by `compileModel` when a definition's parameters do not pass their schema. */
export class ModelParamsError extends Error {
  readonly fieldErrors: FieldError[];
  constructor(key: string, version: string, fieldErrors: FieldError[]) {
    const first = fieldErrors[0];
    super(
      `Parameters of ${key} ${version} are invalid${first ? `: ${first.path || "(root)"}: ${first.message}` : ""}`,
    );
    this.name = "ModelParamsError";
    this.fieldErrors = fieldErrors;
  }
}

function compileScorer(def: ModelDefinition): Scorer {
  // Validated once here, so the hot path never runs a schema.
  const parsed = parseModelParams(def.kind, def.params);
  if (!parsed.ok) throw new ModelParamsError(def.key, def.version, parsed.fieldErrors);
  switch (def.kind) {
    case "mcintosh-poisson":
      return compileMcIntoshPoisson(parsed.params as ModelParamsByKind["mcintosh-poisson"]);
    case "logistic":
      return compileLogistic(parsed.params as ModelParamsByKind["logistic"]);
    case "persistence":
      return compilePersistence(parsed.params as ModelParamsByKind["persistence"]);
  }
}

/** Validates a definition and returns a model that scores regions; throws ModelParamsError. */
export function compileModel(def: ModelDefinition): CompiledModel {
  const scorer = compileScorer(def);
  const { key, version, kind, name, provenance } = def;
  return {
    key,
    version,
    kind,
    name,
    provenance,
    score(input, context = {}) {
      const outcome = scorer(input, context);
      // Order and range flags report; they never alter the model's values.
      const flags = outcome.probabilities
        ? appendGridFlags(outcome.probabilities, outcome.flags)
        : outcome.flags;
      const { probabilities, missingInputs, reason } = outcome;
      return { key, version, provenance, probabilities, missingInputs, flags, reason };
    },
  };
}

const compiledByDefinition = new WeakMap<ModelDefinition, CompiledModel>();

function isCompiledModel(model: CompiledModel | ModelDefinition): model is CompiledModel {
  return typeof (model as CompiledModel).score === "function";
}

/** Scores one region with one model; a definition is compiled once and remembered. */
export function scoreAssessment(
  model: CompiledModel | ModelDefinition,
  input: AssessmentInput,
  context: ScoreContext = {},
): ScoreResult {
  if (isCompiledModel(model)) return model.score(input, context);
  let compiled = compiledByDefinition.get(model);
  if (!compiled) {
    compiled = compileModel(model);
    compiledByDefinition.set(model, compiled);
  }
  return compiled.score(input, context);
}
