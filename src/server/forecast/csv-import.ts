// Batch import of a day's assessments from CSV: every row validated with the one assessment
// schema and scored, previewed, then committed all together in one transaction or not at all.
import { getDb } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import { plausibilityWarnings } from "@/lib/domain/metrics";
import { createAssessmentSchema, type CreateAssessmentData } from "@/lib/schemas/assessment";
import {
  csvImportRequestSchema,
  IMPORT_LIMITS,
  type CsvImportRequest,
  type ImportCommitted,
  type ImportField,
  type ImportPreview,
  type ImportRowPreview,
} from "@/lib/schemas/csv-import";
import { recordAudit } from "@/server/audit/audit.db";
import { parseWith, readJson, zodFieldErrors } from "@/server/http/body";
import { AppError, type FieldErrors } from "@/server/http/errors";
import { findAssessment, findOrCreateRegion, listDay } from "./assessments.db";
import { insertAssessment } from "./assessments.service";
import { checkMappingAgainstHeaders, parseCsvTable, readMappedValues } from "./csv-mapping";
import { isUniqueViolation } from "./unique-violation";
import { computeGuidance, toModelInput, type GuidanceAnswer } from "./guidance.service";

interface AcceptedRow {
  data: CreateAssessmentData;
  answer: GuidanceAnswer;
}

/** Reads the request with the import's own size limit and a message that says what to do. */
export async function readCsvImportRequest(request: Request): Promise<CsvImportRequest> {
  try {
    return parseWith(csvImportRequestSchema, await readJson(request, IMPORT_LIMITS.maxBytes));
  } catch (err) {
    if (err instanceof AppError && err.code === "PAYLOAD_TOO_LARGE") {
      throw new AppError(
        "PAYLOAD_TOO_LARGE",
        "The file is too large to import: send at most 2 MiB of CSV at a time (split it by region).",
        { fields: { csv: "Larger than 2 MiB." } },
      );
    }
    throw err;
  }
}

function toCandidate(forecastDay: string, v: Partial<Record<ImportField, string>>) {
  return {
    forecastDay,
    region: v.region ?? "",
    location: v.location ?? "",
    areaMsh: v.areaMsh ?? "",
    spotCount: v.spotCount ?? "",
    mcintosh: v.mcintosh ?? "",
    mountWilson: v.mountWilson ?? "",
    unsignedFluxMx: v.unsignedFluxMx ?? "",
    pilLengthMm: v.pilLengthMm ?? "",
    logR: v.logR ?? "",
    meanShearDeg: v.meanShearDeg ?? "",
    freeEnergyProxy: v.freeEnergyProxy ?? "",
    flares24h: { C: v.flaresC ?? "", M: v.flaresM ?? "", X: v.flaresX ?? "" },
    notes: v.notes ?? "",
    finals: null,
  };
}

/** Schema paths back to the CSV field the forecaster mapped ("flares24h.M" → flaresM). */
function toImportErrors(fields: FieldErrors): ImportRowPreview["errors"] {
  const errors: ImportRowPreview["errors"] = {};
  for (const [path, message] of Object.entries(fields)) {
    const flare = /^flares24h\.([CMX])$/.exec(path);
    const key = (flare ? `flares${flare[1]}` : path) as ImportField;
    errors[key] ??= message;
  }
  return errors;
}

interface RowContext {
  day: string;
  /** Regions with an assessment on the day already (upper case). */
  assessed: ReadonlySet<string>;
  /** Data rows of each region in the file, to name duplicates. */
  rowsByRegion: ReadonlyMap<string, number[]>;
}

async function checkRow(index: number, v: Partial<Record<ImportField, string>>, ctx: RowContext) {
  const parsed = createAssessmentSchema.safeParse(toCandidate(ctx.day, v));
  const errors = parsed.success ? {} : toImportErrors(zodFieldErrors(parsed.error.issues));
  const region = (v.region ?? "").toUpperCase();
  const sameRegion = ctx.rowsByRegion.get(region) ?? [];
  if (!errors.region && sameRegion.length > 1) {
    errors.region = `${region} appears more than once in this file (rows ${sameRegion.join(", ")}).`;
  }
  if (!errors.region && ctx.assessed.has(region)) {
    errors.region = `${region} already has an assessment for ${ctx.day}; edit that one instead.`;
  }
  const row: ImportRowPreview = {
    row: index + 1,
    values: v,
    errors,
    warnings: [],
    guidance: { mPlus24h: null, reason: "Correct the row to see guidance." },
  };
  if (!parsed.success) return { row, accepted: null };
  const answer = await computeGuidance(toModelInput(parsed.data));
  row.warnings = plausibilityWarnings(parsed.data);
  row.guidance = {
    mPlus24h: answer.blended?.["M+"]["24h"] ?? null,
    reason: answer.blended ? null : (answer.blendReason ?? "No active model gave guidance."),
  };
  const accepted = Object.keys(errors).length === 0 ? { data: parsed.data, answer } : null;
  return { row, accepted };
}

async function analyseImport(
  req: CsvImportRequest,
): Promise<{ preview: ImportPreview; accepted: AcceptedRow[] }> {
  const table = parseCsvTable(req.csv, IMPORT_LIMITS.maxRows);
  const mapping = checkMappingAgainstHeaders(req.mapping, table.headers);
  const assessed = new Set((await listDay(req.forecastDay)).map((a) => a.region.toUpperCase()));
  const rowsByRegion = new Map<string, number[]>();
  const values = table.rows.map((cells, i) => {
    const v = readMappedValues(cells, table.headers, mapping);
    const region = (v.region ?? "").toUpperCase();
    if (region) rowsByRegion.set(region, [...(rowsByRegion.get(region) ?? []), i + 1]);
    return v;
  });
  const ctx: RowContext = { day: req.forecastDay, assessed, rowsByRegion };
  const rows: ImportRowPreview[] = [];
  const accepted: AcceptedRow[] = [];
  for (const [i, v] of values.entries()) {
    const checked = await checkRow(i, v, ctx);
    rows.push(checked.row);
    if (checked.accepted) accepted.push(checked.accepted);
  }
  const withErrors = rows.filter((r) => Object.keys(r.errors).length > 0).length;
  const withWarnings = rows.filter((r) => r.warnings.length > 0).length;
  const counts = { rows: rows.length, valid: rows.length - withErrors, withErrors, withWarnings };
  const preview = { forecastDay: req.forecastDay, headers: table.headers, mapping, rows, counts };
  return { preview, accepted };
}

export async function previewCsvImport(req: CsvImportRequest): Promise<ImportPreview> {
  return (await analyseImport(req)).preview;
}

/** Writes every row or none: any row error, or any failure inside the transaction, imports nothing. */
export async function commitCsvImport(
  req: CsvImportRequest,
  actor: CurrentUser,
): Promise<ImportCommitted> {
  const { preview, accepted } = await analyseImport(req);
  if (preview.counts.withErrors > 0) {
    const fields: FieldErrors = {};
    for (const r of preview.rows)
      for (const [field, message] of Object.entries(r.errors))
        fields[`rows.${r.row}.${field}`] = message;
    throw new AppError(
      "UNPROCESSABLE_CONTENT",
      `${preview.counts.withErrors} of ${preview.counts.rows} rows need attention; nothing was imported.`,
      { fields },
    );
  }
  try {
    const ids = await getDb().transaction(async (tx) => {
      const ids: number[] = [];
      for (const { data, answer } of accepted) {
        const regionId = await findOrCreateRegion(tx, data.region);
        if (await findAssessment(tx, regionId, data.forecastDay))
          throw new AppError(
            "CONFLICT",
            `${data.region} was assessed for ${data.forecastDay} while the file was being checked; nothing was imported.`,
          );
        ids.push(await insertAssessment(tx, regionId, data, answer, actor, false));
      }
      await recordAudit(
        {
          actor: { id: actor.id, email: actor.email },
          action: "assessment.imported",
          targetType: "forecast_day",
          targetId: req.forecastDay,
          details: { count: ids.length, regions: accepted.map((a) => a.data.region) },
        },
        tx,
      );
      return ids;
    });
    return { imported: ids.length, ids };
  } catch (err) {
    if (isUniqueViolation(err))
      throw new AppError(
        "CONFLICT",
        "Another assessment for one of these regions was saved at the same moment; nothing was imported. Check the file again.",
        { cause: err },
      );
    throw err;
  }
}
