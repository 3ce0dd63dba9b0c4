// One schema for a region assessment: the form's resolver, POST /api/guidance, POST/PATCH
// /api/assessments and the CSV import all validate with it.
import { z } from "zod";
import { FLARE_LEVELS, WINDOW_KEYS } from "@/lib/domain/flare-levels";
import { explainMcIntoshError } from "@/lib/domain/mcintosh";
import { explainMountWilsonError } from "@/lib/domain/mount-wilson";
import { parseLocation } from "@/lib/domain/location";
import { explainHardLimitError, type MetricField } from "@/lib/domain/metrics";

export const REGION_NUMBER_PATTERN = /^[A-Z]{1,6}-\d{1,6}$/;

/** Empty form fields arrive as "" or NaN: both mean "not measured". */
const optionalNumber = (field: MetricField) =>
  z.preprocess(
    (v) => (v === "" || v === null || v === undefined || (typeof v === "number" && Number.isNaN(v)) ? null : typeof v === "string" ? Number(v) : v),
    z
      .number({ error: "Enter a number, or leave it empty." })
      .nullable()
      .superRefine((v, ctx) => {
        const message = explainHardLimitError(field, v);
        if (message) ctx.addIssue({ code: "custom", message });
      }),
  );

const requiredNumber = (field: MetricField, label: string) =>
  z.preprocess(
    (v) => (v === "" || v === null || v === undefined || (typeof v === "number" && Number.isNaN(v)) ? undefined : typeof v === "string" ? Number(v) : v),
    z.number({ error: `Enter the ${label}.` }).superRefine((v, ctx) => {
      const message = explainHardLimitError(field, v);
      if (message) ctx.addIssue({ code: "custom", message });
    }),
  );

const flareCount = z.preprocess(
  (v) => (v === "" || v === undefined || v === null ? 0 : typeof v === "string" ? Number(v) : v),
  z.number({ error: "Enter a count." }).int({ error: "Use a whole number." }).min(0, { error: "A count cannot be negative." }).max(200, { error: "That is more flares than a region produces in a day." }),
);

export const assessmentInputSchema = z.object({
  region: z
    .string({ error: "Enter the office region number." })
    .trim()
    .toUpperCase()
    .regex(REGION_NUMBER_PATTERN, { error: "Write the region number as letters, a dash and digits, e.g. HR-0412." }),
  location: z
    .string({ error: "Enter the location, e.g. N12E34." })
    .trim()
    .toUpperCase()
    .superRefine((v, ctx) => {
      const parsed = parseLocation(v);
      if (!parsed.ok) ctx.addIssue({ code: "custom", message: parsed.error });
    }),
  areaMsh: requiredNumber("areaMsh", "area in MSH"),
  spotCount: requiredNumber("spotCount", "number of spots"),
  mcintosh: z.string({ error: "Enter the McIntosh class, e.g. Dkc." }).trim().superRefine((v, ctx) => {
    const message = explainMcIntoshError(v);
    if (message) ctx.addIssue({ code: "custom", message });
  }),
  mountWilson: z.string({ error: "Choose the Mount Wilson class." }).trim().toLowerCase().superRefine((v, ctx) => {
    const message = explainMountWilsonError(v);
    if (message) ctx.addIssue({ code: "custom", message });
  }),
  unsignedFluxMx: optionalNumber("unsignedFluxMx").optional(),
  pilLengthMm: optionalNumber("pilLengthMm").optional(),
  logR: optionalNumber("logR").optional(),
  meanShearDeg: optionalNumber("meanShearDeg").optional(),
  freeEnergyProxy: optionalNumber("freeEnergyProxy").optional(),
  flares24h: z.object({ C: flareCount, M: flareCount, X: flareCount }, { error: "Give the flares of the last 24 h by class." }).default({ C: 0, M: 0, X: 0 }),
});
export type AssessmentInputValues = z.input<typeof assessmentInputSchema>;
export type AssessmentInputData = z.output<typeof assessmentInputSchema>;

export const forecastDaySchema = z
  .string({ error: "Give the forecast day as YYYY-MM-DD." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Give the forecast day as YYYY-MM-DD." })
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, { error: "That day does not exist." });

const probability = z.number({ error: "Enter a probability." }).min(0, { error: "At least 0 %." }).max(1, { error: "At most 100 %." });
const windowGrid = z.object(Object.fromEntries(WINDOW_KEYS.map((w) => [w, probability])) as Record<(typeof WINDOW_KEYS)[number], typeof probability>);
export const probabilityGridSchema = z.object(Object.fromEntries(FLARE_LEVELS.map((l) => [l, windowGrid])) as Record<(typeof FLARE_LEVELS)[number], typeof windowGrid>);

/** Reasons keyed "M+.24h" for cells where the final differs from blended guidance. */
export const finalReasonsSchema = z.record(z.string().regex(/^(C\+|M\+|X)\.(24h|48h|72h)$/, { error: "Unknown cell." }), z.string().trim().max(500, { error: "Keep a reason under 500 characters." }));

export const createAssessmentSchema = assessmentInputSchema.extend({
  forecastDay: forecastDaySchema,
  notes: z.string().trim().max(4000, { error: "Keep notes under 4000 characters." }).optional().default(""),
  finals: probabilityGridSchema.nullable().optional(),
  finalReasons: finalReasonsSchema.optional().default({}),
});
export type CreateAssessmentValues = z.input<typeof createAssessmentSchema>;
export type CreateAssessmentData = z.output<typeof createAssessmentSchema>;

export const updateAssessmentSchema = createAssessmentSchema.partial().omit({ forecastDay: true, region: true });
export type UpdateAssessmentData = z.output<typeof updateAssessmentSchema>;
