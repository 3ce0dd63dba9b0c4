// Bulk loading by COPY … FROM '/dev/blob', PGlite's way of feeding a file to COPY: several times
// faster than multi-row INSERTs for the archive's ~180,000 forecast records.

import type { Transaction } from "@electric-sql/pglite";
import { getTableName, type Table } from "drizzle-orm";
import type { PgColumn } from "drizzle-orm/pg-core";

/** A field value; any other object (a grid, a list, an input) is written as JSON. */
export type CopyValue = string | number | boolean | Date | null | object;

// A backslash is quoted too, so no field can read as the end-of-data marker \. on its own line.
const NEEDS_QUOTES = /[",\n\r\\]/;

/**
 * One CSV field as PostgreSQL's COPY (FORMAT csv, NULL '') reads it: an unquoted empty field is
 * NULL; text with a comma, quote or line break, and the empty string, are double-quoted with
 * inner quotes doubled (PostgreSQL manual, COPY, "CSV Format"). Objects are written as JSON.
 */
export function encodeCopyField(value: CopyValue): string {
  if (value === null) return "";
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new RangeError(`Cannot COPY a non-finite number: ${value}`);
    return String(value);
  }
  if (typeof value === "boolean") return value ? "t" : "f";
  const text =
    value instanceof Date
      ? value.toISOString()
      : typeof value === "string"
        ? value
        : JSON.stringify(value);
  return text !== "" && !NEEDS_QUOTES.test(text) ? text : `"${text.replaceAll('"', '""')}"`;
}

export function encodeCopyCsv(rows: readonly (readonly CopyValue[])[]): string {
  return rows.map((row) => row.map(encodeCopyField).join(",")).join("\n");
}

/** COPYs `rows` (values in the order of `columns`) into `table`; returns the rows written. */
export async function copyRows(
  tx: Transaction,
  table: Table,
  columns: readonly PgColumn[],
  rows: readonly (readonly CopyValue[])[],
): Promise<number> {
  if (rows.length === 0) return 0;
  const names = columns.map((c) => `"${c.name}"`).join(", ");
  const statement = `copy "${getTableName(table)}" (${names}) from '/dev/blob' with (format csv, null '')`;
  const result = await tx.query(statement, [], { blob: new Blob([encodeCopyCsv(rows)]) });
  const written = result.affectedRows ?? rows.length;
  if (written !== rows.length)
    throw new Error(`COPY wrote ${written} of ${rows.length} rows into ${getTableName(table)}`);
  return written;
}
