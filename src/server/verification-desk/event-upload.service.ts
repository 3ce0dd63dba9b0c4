// Upload of an observed event list: read with its size limit, checked row by row against the
// file and the stored events, previewed, then stored all together with one audit row, or not at all.
import { getDb } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/roles";
import {
  EVENT_UPLOAD_LIMITS,
  eventUploadRequestSchema,
  type EventUploadCommitted,
  type EventUploadRequest,
  type UploadPreview,
} from "@/lib/schemas/verification";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import { formatGoesClass } from "@/server/verification/goes";
import {
  checkEventRows,
  EVENT_ALIASES,
  REQUIRED_EVENT_FIELDS,
  type EventRowCheck,
} from "./event-rows";
import { findStoredEventKeys, insertEventList, insertEvents, isUniqueViolation } from "./events.db";
import { readCsvRows, readJsonRows } from "./table-file";
import { buildUploadPreview, rowFieldErrors, type CheckedRow } from "./upload-preview";
import { readUploadRequest } from "./upload-request";

const actorOf = (u: CurrentUser) => ({ id: u.id, email: u.email });

export function readEventUploadRequest(request: Request): Promise<EventUploadRequest> {
  return readUploadRequest(request, eventUploadRequestSchema, {
    field: "content",
    maxBytes: EVENT_UPLOAD_LIMITS.maxBytes,
    message: "The event list is too large: send at most 2 MiB at a time (split it by period).",
  });
}

async function checkUpload(req: EventUploadRequest): Promise<EventRowCheck[]> {
  const read = req.format === "csv" ? readCsvRows : readJsonRows;
  const rows = read(req.content, EVENT_ALIASES, REQUIRED_EVENT_FIELDS, EVENT_UPLOAD_LIMITS.maxRows);
  const firstPass = checkEventRows(rows, req.convention, new Set());
  const peaks = firstPass.flatMap((r) => (r.event ? [r.event.peakTime] : []));
  return checkEventRows(rows, req.convention, await findStoredEventKeys(getDb(), peaks));
}

function toChecked(r: EventRowCheck): CheckedRow {
  return {
    row: r.row,
    values: r.values,
    errors: r.errors,
    isDuplicate: r.isDuplicate,
    note: r.event ? formatGoesClass(r.event.peakFluxTrue) : null,
    timeMs: r.event?.peakTime.getTime() ?? null,
  };
}

export async function previewEventUpload(req: EventUploadRequest): Promise<UploadPreview> {
  return buildUploadPreview((await checkUpload(req)).map(toChecked));
}

/**
 * Stores every valid event or none. Row errors refuse the file; duplicates refuse it too unless
 * the verifier asked to skip them. The list, its events and the audit row share one transaction.
 */
export async function commitEventUpload(
  req: EventUploadRequest,
  actor: CurrentUser,
): Promise<EventUploadCommitted> {
  const checked = await checkUpload(req);
  const blocking = checked.filter(
    (r) => Object.keys(r.errors).length > 0 && !(r.isDuplicate && req.skipDuplicates),
  );
  if (blocking.length > 0) {
    const duplicates = blocking.filter((r) => r.isDuplicate).length;
    const hint =
      duplicates > 0
        ? ` (${duplicates} duplicate${duplicates === 1 ? "" : "s"}: tick "skip events already stored" to leave them out)`
        : "";
    throw new AppError(
      "UNPROCESSABLE_CONTENT",
      `${blocking.length} of ${checked.length} rows need attention${hint}; nothing was stored.`,
      { fields: rowFieldErrors(blocking.map(toChecked)) },
    );
  }
  const events = checked.flatMap((r) => (r.event && !r.isDuplicate ? [r.event] : []));
  if (events.length === 0)
    throw new AppError(
      "UNPROCESSABLE_CONTENT",
      "Every event in the file is already stored; nothing was stored.",
    );
  try {
    return await getDb().transaction(async (tx) => {
      const listId = await insertEventList(tx, {
        name: req.name,
        convention: req.convention,
        uploadedBy: actor.id,
      });
      const ids = await insertEvents(tx, listId, events, actor.id);
      const skippedDuplicates = checked.length - events.length;
      await recordAudit(
        {
          actor: actorOf(actor),
          action: "event_list.uploaded",
          targetType: "event_list",
          targetId: listId,
          details: {
            name: req.name,
            convention: req.convention,
            stored: ids.length,
            skippedDuplicates,
          },
        },
        tx,
      );
      return { listId, stored: ids.length, skippedDuplicates };
    });
  } catch (err) {
    if (isUniqueViolation(err))
      throw new AppError(
        "CONFLICT",
        "Some of these events were stored by someone else while the file was checked; nothing was stored. Check the file again.",
        { cause: err },
      );
    throw err;
  }
}
