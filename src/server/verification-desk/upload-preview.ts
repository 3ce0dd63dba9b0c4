// Turns checked upload rows into the preview a verifier reads before committing (pure).
import type { UploadPreview, UploadRowPreview } from "@/lib/schemas/verification";
import type { FieldErrors } from "@/server/http/errors";

export interface CheckedRow {
  row: number;
  values: Record<string, string | undefined>;
  errors: Record<string, string | undefined>;
  isDuplicate: boolean;
  note: string | null;
  /** The row's time (peak or issue) when it parsed, for the period shown. */
  timeMs: number | null;
}

const MAX_PROBLEM_ROWS = 200;
const MAX_VALID_ROWS = 20;

function compact(record: Record<string, string | undefined>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(record)) if (v !== undefined) out[k] = v;
  return out;
}

export function hasErrors(row: CheckedRow): boolean {
  return Object.values(row.errors).some((v) => v !== undefined);
}

/** Counts every row; lists the problem rows first and a few valid ones, so big files stay light. */
export function buildUploadPreview(rows: readonly CheckedRow[]): UploadPreview {
  const problems = rows.filter(hasErrors);
  const valid = rows.filter((r) => !hasErrors(r));
  const shown = [...problems.slice(0, MAX_PROBLEM_ROWS), ...valid.slice(0, MAX_VALID_ROWS)];
  let first: number | null = null;
  let last: number | null = null;
  for (const r of rows) {
    if (r.timeMs === null) continue;
    if (first === null || r.timeMs < first) first = r.timeMs;
    if (last === null || r.timeMs > last) last = r.timeMs;
  }
  const toPreview = (r: CheckedRow): UploadRowPreview => ({
    row: r.row,
    values: compact(r.values),
    errors: compact(r.errors),
    isDuplicate: r.isDuplicate,
    note: r.note,
  });
  return {
    counts: {
      rows: rows.length,
      valid: valid.length,
      withErrors: problems.filter((r) => !r.isDuplicate).length,
      duplicates: rows.filter((r) => r.isDuplicate).length,
    },
    rows: shown.map(toPreview),
    isTruncated: shown.length < rows.length,
    period: {
      first: first === null ? null : new Date(first).toISOString(),
      last: last === null ? null : new Date(last).toISOString(),
    },
  };
}

/** Field messages keyed "rows.<n>.<field>" for the first problem rows, for a refused commit. */
export function rowFieldErrors(rows: readonly CheckedRow[], limit = 50): FieldErrors {
  const fields: FieldErrors = {};
  for (const r of rows.filter(hasErrors).slice(0, limit)) {
    for (const [field, message] of Object.entries(r.errors))
      if (message) fields[`rows.${r.row}.${field}`] = message;
  }
  return fields;
}
