// Uploads of external forecast series: preview, then the series and all its forecast records
// (source "external:<id>") in one audited transaction, or nothing.
import { count, desc, eq, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { externalSeries, forecastRecords } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { type UploadPreview } from "@/lib/schemas/verification";
import {
  EXTERNAL_UPLOAD_LIMITS,
  externalUploadRequestSchema,
  type ExternalUploadCommitted,
  type ExternalUploadRequest,
} from "@/lib/schemas/verification-report";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import {
  checkExternalRows,
  EXTERNAL_ALIASES,
  REQUIRED_EXTERNAL_FIELDS,
  type ExternalRowCheck,
} from "./external-rows";
import { insertRecords } from "./records.db";
import { readCsvRows } from "./table-file";
import { buildUploadPreview, rowFieldErrors, type CheckedRow } from "./upload-preview";
import { readUploadRequest } from "./upload-request";

export function readExternalUploadRequest(request: Request): Promise<ExternalUploadRequest> {
  return readUploadRequest(request, externalUploadRequestSchema, {
    field: "csv",
    maxBytes: EXTERNAL_UPLOAD_LIMITS.maxBytes,
    message: "The series is too large: send at most 8 MiB of CSV at a time (split it by year).",
  });
}

function checkUpload(req: ExternalUploadRequest): ExternalRowCheck[] {
  return checkExternalRows(
    readCsvRows(
      req.csv,
      EXTERNAL_ALIASES,
      REQUIRED_EXTERNAL_FIELDS,
      EXTERNAL_UPLOAD_LIMITS.maxRows,
      "csv",
    ),
  );
}

const toChecked = (r: ExternalRowCheck): CheckedRow => ({
  row: r.row,
  values: r.values,
  errors: r.errors,
  isDuplicate: false,
  note: null,
  timeMs: r.record?.issueTime.getTime() ?? null,
});

export function previewExternalUpload(req: ExternalUploadRequest): UploadPreview {
  return buildUploadPreview(checkUpload(req).map(toChecked));
}

export async function commitExternalUpload(
  req: ExternalUploadRequest,
  actor: CurrentUser,
): Promise<ExternalUploadCommitted> {
  const checked = checkUpload(req);
  const bad = checked.filter((r) => Object.keys(r.errors).length > 0);
  if (bad.length > 0) {
    throw new AppError(
      "UNPROCESSABLE_CONTENT",
      `${bad.length} of ${checked.length} rows need attention; nothing was stored.`,
      { fields: rowFieldErrors(bad.map(toChecked)) },
    );
  }
  return getDb().transaction(async (tx) => {
    const [series] = await tx
      .insert(externalSeries)
      .values({ name: req.name, provenance: req.provenance, uploadedBy: actor.id })
      .returning({ id: externalSeries.id });
    if (!series) throw new Error("external series insert returned nothing");
    const source = `external:${series.id}`;
    const stored = await insertRecords(
      tx,
      checked.map((r) => ({ ...(r.record as NonNullable<ExternalRowCheck["record"]>), source })),
    );
    await recordAudit(
      {
        actor: { id: actor.id, email: actor.email },
        action: "external_series.uploaded",
        targetType: "external_series",
        targetId: series.id,
        details: { name: req.name, stored },
      },
      tx,
    );
    return { seriesId: series.id, source, stored };
  });
}

export interface ExternalSeriesView {
  id: number;
  source: string;
  name: string;
  provenance: string;
  uploadedAt: string;
  records: number;
  isDemo: boolean;
}

export async function listExternalSeries(): Promise<ExternalSeriesView[]> {
  const counts = getDb()
    .select({ source: forecastRecords.source, n: count().as("n") })
    .from(forecastRecords)
    .where(sql`${forecastRecords.source} like 'external:%'`)
    .groupBy(forecastRecords.source)
    .as("counts");
  const rows = await getDb()
    .select({ s: externalSeries, n: counts.n })
    .from(externalSeries)
    .leftJoin(counts, eq(counts.source, sql`'external:' || ${externalSeries.id}`))
    .orderBy(desc(externalSeries.uploadedAt));
  return rows.map(({ s, n }) => ({
    id: s.id,
    source: `external:${s.id}`,
    name: s.name,
    provenance: s.provenance,
    uploadedAt: s.uploadedAt.toISOString(),
    records: n ?? 0,
    isDemo: s.isDemo,
  }));
}
