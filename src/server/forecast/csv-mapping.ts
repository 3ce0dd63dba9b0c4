// The file side of the CSV import: reading the table, the office's remembered column mapping
// (settings key csvMapping), checking a mapping against the header row, and mapped row values.
import { eq } from "drizzle-orm";
import Papa from "papaparse";
import { getDb } from "@/db/client";
import { settings } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { REGION_NUMBER_PATTERN } from "@/lib/schemas/assessment";
import {
  columnMappingSchema,
  completeMappingSchema,
  IMPORT_FIELD_LABELS,
  IMPORT_FIELDS,
  type ColumnMapping,
  type ImportField,
} from "@/lib/schemas/csv-import";
import { recordAudit } from "@/server/audit/audit.db";
import { zodFieldErrors } from "@/server/http/body";
import { AppError, type FieldErrors } from "@/server/http/errors";

const KEY = "csvMapping";

/** Drops unmapped fields so stored and compared mappings carry only real choices. */
export function compactMapping(mapping: ColumnMapping): ColumnMapping {
  return Object.fromEntries(
    IMPORT_FIELDS.flatMap((f) => (mapping[f] ? [[f, mapping[f]]] : [])),
  ) as ColumnMapping;
}

export async function getRememberedMapping(): Promise<ColumnMapping> {
  const [row] = await getDb().select().from(settings).where(eq(settings.key, KEY));
  const parsed = columnMappingSchema.safeParse(row?.value ?? {});
  return parsed.success ? compactMapping(parsed.data) : {};
}

export async function saveRememberedMapping(
  mapping: ColumnMapping,
  actor: CurrentUser,
): Promise<ColumnMapping> {
  const value = compactMapping(mapping);
  await getDb().transaction(async (tx) => {
    await tx
      .insert(settings)
      .values({ key: KEY, value })
      .onConflictDoUpdate({ target: settings.key, set: { value, updatedAt: new Date() } });
    await recordAudit(
      {
        actor: { id: actor.id, email: actor.email },
        action: "settings.csv_mapping_saved",
        targetType: "settings",
        targetId: KEY,
        details: value,
      },
      tx,
    );
  });
  return value;
}

/**
 * Throws a 400 naming each required field without a column, and each chosen column the file
 * does not have. Returns the mapping without its empty entries.
 */
export function checkMappingAgainstHeaders(
  mapping: ColumnMapping,
  headers: readonly string[],
): ColumnMapping {
  const fields: FieldErrors = {};
  const complete = completeMappingSchema.safeParse(mapping);
  if (!complete.success) {
    for (const [key, message] of Object.entries(zodFieldErrors(complete.error.issues)))
      fields[`mapping.${key}`] = message;
  }
  const known = new Set(headers);
  for (const field of IMPORT_FIELDS) {
    const column = mapping[field];
    if (column && !known.has(column)) {
      fields[`mapping.${field}`] =
        `The file has no column "${column}" (chosen for ${IMPORT_FIELD_LABELS[field]}).`;
    }
  }
  if (Object.keys(fields).length) {
    throw new AppError("BAD_REQUEST", "The column mapping does not fit the file's header row.", {
      fields,
    });
  }
  return compactMapping(mapping);
}

export interface CsvTable {
  headers: string[];
  rows: string[][];
}

/** Reads CSV text with a required header row; refuses unreadable files and more than maxRows rows. */
export function parseCsvTable(text: string, maxRows: number): CsvTable {
  const result = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: "greedy" });
  const broken = result.errors.find((e) => e.type === "Quotes");
  if (broken) {
    const where = broken.row === undefined ? "" : ` near data row ${broken.row}`;
    throw new AppError("BAD_REQUEST", `The CSV could not be read${where}: ${broken.message}.`, {
      fields: { csv: "Check the quotes in the file." },
    });
  }
  const [first, ...rows] = result.data;
  const headers = (first ?? []).map((h) => h.trim());
  if (headers.every((h) => h === ""))
    throw new AppError("BAD_REQUEST", "The file is empty.", {
      fields: { csv: "The file is empty." },
    });
  if (headers.some((h) => REGION_NUMBER_PATTERN.test(h.toUpperCase()))) {
    throw new AppError(
      "BAD_REQUEST",
      "The first row looks like data: the file needs a header row naming its columns.",
      { fields: { csv: "Add a header row." } },
    );
  }
  const repeated = headers.find((h, i) => h !== "" && headers.indexOf(h) !== i);
  if (repeated)
    throw new AppError(
      "BAD_REQUEST",
      `The header row names "${repeated}" twice; give each column its own name.`,
      { fields: { csv: `Column "${repeated}" appears twice.` } },
    );
  if (rows.length === 0)
    throw new AppError("BAD_REQUEST", "The file has a header row but no data rows.", {
      fields: { csv: "No data rows." },
    });
  if (rows.length > maxRows) {
    throw new AppError(
      "BAD_REQUEST",
      `The file has too many rows: ${rows.length} data rows, at most ${maxRows} per import.`,
      { fields: { csv: `Too many rows (${rows.length}); split the file.` } },
    );
  }
  return { headers, rows };
}

/** The mapped cells of one data row, trimmed; a short row reads as empty cells. */
export function readMappedValues(
  row: readonly string[],
  headers: readonly string[],
  mapping: ColumnMapping,
): Partial<Record<ImportField, string>> {
  const values: Partial<Record<ImportField, string>> = {};
  for (const field of IMPORT_FIELDS) {
    const column = mapping[field];
    if (!column) continue;
    values[field] = (row[headers.indexOf(column)] ?? "").trim();
  }
  return values;
}
