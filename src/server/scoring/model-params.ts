// Zod schemas of every model kind's parameters, used to validate imports and compiled models.

import { z } from "zod";
import { MCINTOSH_CLASSES, ZURICH_CLASSES, zurichClassOf } from "@/lib/domain/mcintosh";
import { PREDICTOR_INPUTS } from "@/lib/domain/assessment-input";
import { TRANSFORM_NAMES } from "./transforms";

export const MODEL_KINDS = ["mcintosh-poisson", "logistic", "persistence"] as const;
export type ModelKind = (typeof MODEL_KINDS)[number];

// No region keeps up 100 flares a day of one class; a larger figure is a unit or typing error.
const rateSchema = z
  .number()
  .min(0, "Rates cannot be negative")
  .max(100, "Rate above 100 flares/day");
const classRatesSchema = z.strictObject({ C: rateSchema, M: rateSchema, X: rateSchema });
const correctionFactorSchema = z.number().positive("Must be > 0").max(10, "Must be ≤ 10");

export const mcintoshPoissonParamsSchema = z
  .strictObject({
    rates: z.partialRecord(z.enum(MCINTOSH_CLASSES), classRatesSchema),
    zurichRates: z.partialRecord(z.enum(ZURICH_CLASSES), classRatesSchema).optional(),
    correctionFactor: correctionFactorSchema,
  })
  .superRefine((params, ctx) => {
    const uncovered = MCINTOSH_CLASSES.filter(
      (cls) => !params.rates[cls] && !params.zurichRates?.[zurichClassOf(cls)],
    );
    if (uncovered.length > 0) {
      ctx.addIssue({
        code: "custom",
        path: ["rates"],
        message: `No rates and no Zurich-class fallback for ${uncovered.length} classes: ${uncovered.join(", ")}`,
      });
    }
  });

const predictorSchema = z.strictObject({
  input: z.enum(PREDICTOR_INPUTS),
  transform: z.enum(TRANSFORM_NAMES),
  coefficient: z.number(),
});
const logisticLevelSchema = z.strictObject({
  intercept: z.number(),
  predictors: z.array(predictorSchema).max(50),
});

export const logisticParamsSchema = z.strictObject({
  /** The window, in hours, the coefficients were fitted for (usually 24). */
  windowHours: z.number().positive().max(168),
  levels: z.strictObject({
    "C+": logisticLevelSchema,
    "M+": logisticLevelSchema,
    X: logisticLevelSchema,
  }),
});

export const persistenceParamsSchema = z.strictObject({
  /** Rates (flares/day) assumed before the last 24 h are seen. */
  priorRatesPerDay: classRatesSchema,
  /** How many days of observation the prior is worth; 0 uses the counts alone. */
  priorWeight: z.number().min(0).max(1000),
});

export type McIntoshPoissonParams = z.infer<typeof mcintoshPoissonParamsSchema>;
export type LogisticParams = z.infer<typeof logisticParamsSchema>;
export type LogisticLevelParams = z.infer<typeof logisticLevelSchema>;
export type PersistenceParams = z.infer<typeof persistenceParamsSchema>;

export interface ModelParamsByKind {
  "mcintosh-poisson": McIntoshPoissonParams;
  logistic: LogisticParams;
  persistence: PersistenceParams;
}

const SCHEMAS: { [K in ModelKind]: z.ZodType<ModelParamsByKind[K]> } = {
  "mcintosh-poisson": mcintoshPoissonParamsSchema,
  logistic: logisticParamsSchema,
  persistence: persistenceParamsSchema,
};

export interface FieldError {
  /** Dotted path into the parameters, e.g. "levels.M+.predictors.0.transform"; "" for the root. */
  path: string;
  message: string;
}

export type ParseParamsResult<T> =
  { ok: true; params: T } | { ok: false; fieldErrors: FieldError[] };

export function isModelKind(s: unknown): s is ModelKind {
  return typeof s === "string" && (MODEL_KINDS as readonly string[]).includes(s);
}

/** Validates a parameter set (an object, or JSON text) for a model kind. */
export function parseModelParams<K extends ModelKind>(
  kind: K,
  json: unknown,
): ParseParamsResult<ModelParamsByKind[K]> {
  if (!isModelKind(kind)) {
    return {
      ok: false,
      fieldErrors: [{ path: "kind", message: `Unknown model kind "${String(kind)}"` }],
    };
  }
  let value = json;
  if (typeof json === "string") {
    try {
      value = JSON.parse(json);
    } catch (error) {
      return {
        ok: false,
        fieldErrors: [{ path: "", message: `Not valid JSON: ${(error as Error).message}` }],
      };
    }
  }
  const parsed = SCHEMAS[kind].safeParse(value);
  if (parsed.success) return { ok: true, params: parsed.data };
  const fieldErrors = parsed.error.issues.map((issue) => ({
    path: issue.path.map(String).join("."),
    message: issue.message,
  }));
  return { ok: false, fieldErrors };
}
