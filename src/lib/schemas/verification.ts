// Inputs of the verification desk's observed events (upload, entry, correction, list filters),
// each with one zod schema, and the upload preview shape shared with external series.
import { z } from "zod";
import { FLARE_LEVELS } from "@/lib/domain/flare-levels";
import { REGION_NUMBER_PATTERN } from "./assessment";
import { pageSchema, pageSizeSchema } from "./paging";

export const FLUX_CONVENTIONS = ["true", "legacy-scaled"] as const;
export type FluxConventionName = (typeof FLUX_CONVENTIONS)[number];
export const FLUX_CONVENTION_LABELS: Readonly<Record<FluxConventionName, string>> = {
  true: "True flux (GOES-16 onward, reprocessed GOES 13–15)",
  "legacy-scaled": "Legacy-scaled (operational GOES 8–15, factor 0.7 applied)",
};

export type UtcParse = { ok: true; ms: number } | { ok: false; message: string };

const UTC_PATTERN =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d{1,3})?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;

/**
 * ISO-8601 date and time in UTC: "2024-05-10T06:54Z", "2024-05-10 06:54:30", "…+00:00". A time
 * without an offset is read as UTC (the desk's rule: times are UTC everywhere); any other offset
 * is refused rather than converted, since it usually means a local-time column.
 */
export function parseUtcTimestamp(input: string): UtcParse {
  const text = input.trim();
  const m = UTC_PATTERN.exec(text);
  if (!m)
    return { ok: false, message: `"${input}" is not a UTC time: write e.g. 2024-05-10T06:54Z` };
  const offset = (m[8] ?? "Z").toUpperCase();
  if (offset !== "Z" && !/^[+-]00:?00$/.test(offset)) {
    return { ok: false, message: `"${input}" has the offset ${offset}: give the time in UTC (Z)` };
  }
  const [y, mo, d, h, mi, s] = [1, 2, 3, 4, 5, 6].map((i) => Number(m[i] ?? 0)) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  const ms = Date.UTC(y, mo - 1, d, h, mi, s, Math.round(Number(m[7] ?? 0) * 1000));
  const back = new Date(ms);
  if (back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d || h > 23 || mi > 59 || s > 59) {
    return { ok: false, message: `"${input}" is not a real date and time` };
  }
  return { ok: true, ms };
}

const utcTime = (label: string) =>
  z
    .string({ error: `Enter the ${label} time (UTC).` })
    .trim()
    .superRefine((v, ctx) => {
      const parsed = parseUtcTimestamp(v);
      if (!parsed.ok) ctx.addIssue({ code: "custom", message: parsed.message });
    });

/** A light shape check for forms; the server's GOES class parser has the last word. */
export const GOES_CLASS_SHAPE = /^[ABCMX]\d+(\.\d+)?$/i;

const optionalRegion = z
  .string()
  .trim()
  .toUpperCase()
  .refine((v) => v === "" || REGION_NUMBER_PATTERN.test(v), {
    error: "Write the region as letters, a dash and digits, e.g. HR-0412, or leave it empty.",
  })
  .optional()
  .default("");

const eventFields = z.object({
  start: utcTime("start"),
  peak: utcTime("peak"),
  end: utcTime("end"),
  goesClass: z
    .string({ error: "Enter the GOES class, e.g. M2.5." })
    .trim()
    .toUpperCase()
    .regex(GOES_CLASS_SHAPE, {
      error: "Write a GOES class: a letter A, B, C, M or X and a number, e.g. M2.5.",
    }),
  regionNumber: optionalRegion,
});

function checkOrder(v: { start: string; peak: string; end: string }, ctx: z.RefinementCtx): void {
  const [s, p, e] = [v.start, v.peak, v.end].map(parseUtcTimestamp);
  if (!s?.ok || !p?.ok || !e?.ok) return;
  if (p.ms < s.ms)
    ctx.addIssue({ code: "custom", path: ["peak"], message: "The peak is before the start." });
  if (e.ms < p.ms)
    ctx.addIssue({ code: "custom", path: ["end"], message: "The end is before the peak." });
}

export const eventEntrySchema = eventFields
  .extend({
    convention: z.enum(FLUX_CONVENTIONS, { error: "Choose the flux convention of the class." }),
  })
  .superRefine(checkOrder);
export type EventEntryValues = z.input<typeof eventEntrySchema>;
export type EventEntryData = z.output<typeof eventEntrySchema>;

export const eventCorrectionSchema = eventFields
  .extend({
    reason: z
      .string({ error: "Say why the event is corrected." })
      .trim()
      .min(3, { error: "Say why the event is corrected." })
      .max(500),
  })
  .superRefine(checkOrder);
export type EventCorrectionValues = z.input<typeof eventCorrectionSchema>;
export type EventCorrectionData = z.output<typeof eventCorrectionSchema>;

export const EVENT_UPLOAD_LIMITS = { maxBytes: 2 * 1024 * 1024, maxRows: 20_000 } as const;

export const eventUploadRequestSchema = z.object({
  name: z
    .string({ error: "Name the event list." })
    .trim()
    .min(2, { error: "Name the event list." })
    .max(200),
  convention: z.enum(FLUX_CONVENTIONS, {
    error: "Say whether the list uses true or legacy-scaled flux.",
  }),
  format: z.enum(["csv", "json"], { error: "Send the list as CSV or JSON." }),
  content: z.string({ error: "Send the file's text." }).min(1, { error: "The file is empty." }),
  mode: z.enum(["preview", "commit"], { error: 'Say "preview" or "commit".' }),
  skipDuplicates: z.boolean().optional().default(false),
});
export type EventUploadRequest = z.output<typeof eventUploadRequestSchema>;

const utcDay = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-12-01." })
  .refine((s) => new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), {
    error: "Not a real date.",
  });
export const optionalUtcDaySchema = z.preprocess(
  (v) => (v === "" ? undefined : v),
  utcDay.optional(),
);

export const eventListQuerySchema = z.object({
  from: optionalUtcDaySchema,
  to: optionalUtcDaySchema,
  level: z.enum(FLARE_LEVELS, { error: "Choose C+, M+ or X." }).optional(),
  region: z.string().trim().toUpperCase().max(20).optional(),
  page: pageSchema,
  pageSize: pageSizeSchema,
});
export type EventListQuery = z.output<typeof eventListQuerySchema>;

/** One row of an upload preview (events or an external series). */
export interface UploadRowPreview {
  /** 1 = the first data row. */
  row: number;
  values: Record<string, string>;
  errors: Record<string, string>;
  isDuplicate: boolean;
  /** Events: the class of the normalised true flux; external rows: null. */
  note: string | null;
}

export interface UploadPreview {
  counts: { rows: number; valid: number; withErrors: number; duplicates: number };
  /** Rows with problems first (at most 200), then the first valid rows. */
  rows: UploadRowPreview[];
  isTruncated: boolean;
  period: { first: string | null; last: string | null };
}

export interface EventUploadCommitted {
  listId: number;
  stored: number;
  skippedDuplicates: number;
}
