// Inputs of the verification report (filters, exports), of external forecast series and of
// recalibration requests, each with one zod schema.
import { z } from "zod";
import { FLARE_LEVELS } from "@/lib/domain/flare-levels";
import { optionalUtcDaySchema } from "./verification";

export const MATCH_CONVENTIONS = ["true", "legacy"] as const;
export const FORECAST_WINDOWS = [24, 48, 72] as const;

/** Sources are "forecaster", "model:<key>@<version>" or "external:<id>". */
export const SOURCE_PATTERN = /^(forecaster|model:[\w.-]+@[\w.-]+|external:\d+)$/;
const source = z.string().trim().regex(SOURCE_PATTERN, { error: "Unknown forecast source." });

export const reportQuerySchema = z
  .object({
    source: source.default("forecaster"),
    reference: z.preprocess((v) => (v === "" ? undefined : v), source.optional()),
    from: optionalUtcDaySchema,
    to: optionalUtcDaySchema,
    level: z.enum(FLARE_LEVELS, { error: "Choose C+, M+ or X." }).default("M+"),
    window: z.coerce
      .number()
      .pipe(
        z.union([z.literal(24), z.literal(48), z.literal(72)], { error: "Choose 24, 48 or 72 h." }),
      )
      .default(24),
    scope: z
      .enum(["region", "full-disk"], { error: "Choose regions or full disk." })
      .default("full-disk"),
    threshold: z.coerce
      .number({ error: "Give the warning threshold as a probability." })
      .min(0.01, { error: "Use a threshold from 0.01 to 0.99." })
      .max(0.99, { error: "Use a threshold from 0.01 to 0.99." })
      .default(0.5),
    convention: z.enum(MATCH_CONVENTIONS, { error: 'Choose "true" or "legacy".' }).default("true"),
    resamples: z.coerce
      .number()
      .pipe(z.union([z.literal(200), z.literal(1000)], { error: "Use 200 or 1000 resamples." }))
      .default(1000),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, {
    path: ["to"],
    error: "The period ends before it starts.",
  })
  .refine((q) => q.reference !== q.source, {
    path: ["reference"],
    error: "Choose a reference other than the scored source.",
  });
export type ReportQuery = z.output<typeof reportQuerySchema>;

export const exportQuerySchema = z.object({
  what: z.enum(["pairs", "scores"], { error: 'Export "pairs" or "scores".' }),
});

export const EXTERNAL_UPLOAD_LIMITS = { maxBytes: 8 * 1024 * 1024, maxRows: 100_000 } as const;

export const externalUploadRequestSchema = z.object({
  name: z
    .string({ error: "Name the series." })
    .trim()
    .min(2, { error: "Name the series." })
    .max(200),
  provenance: z
    .string({ error: "Say where the series comes from." })
    .trim()
    .min(5, { error: "Say where the series comes from (who issued it, how it was obtained)." })
    .max(2000),
  csv: z.string({ error: "Send the CSV text." }).min(1, { error: "The file is empty." }),
  mode: z.enum(["preview", "commit"], { error: 'Say "preview" or "commit".' }),
});
export type ExternalUploadRequest = z.output<typeof externalUploadRequestSchema>;

export interface ExternalUploadCommitted {
  seriesId: number;
  source: string;
  stored: number;
}

export const fitRequestSchema = z.object({
  modelId: z.number({ error: "Choose an active model." }).int().positive(),
});
export const proposalRequestSchema = z.object({
  jobId: z
    .string({ error: "Run a fit first." })
    .regex(/^[a-f0-9-]{36}$/, { error: "Unknown fit." }),
});

export const rejectionSchema = z.object({
  reason: z
    .string({ error: "Say why the proposal is rejected." })
    .trim()
    .min(3, { error: "Say why the proposal is rejected." })
    .max(1000),
});

/** The canonical query string of a report, for its intervals, exports and printable page. */
export function reportSearchParams(q: ReportQuery): string {
  const params = new URLSearchParams({
    source: q.source,
    reference: q.reference ?? "",
    level: q.level,
    window: String(q.window),
    scope: q.scope,
    threshold: String(q.threshold),
    convention: q.convention,
    resamples: String(q.resamples),
  });
  if (q.from) params.set("from", q.from);
  if (q.to) params.set("to", q.to);
  return params.toString();
}
