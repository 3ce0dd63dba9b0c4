// Reads an uploaded table (CSV with a header row, or a JSON array of objects) into rows of text
// cells keyed by the desk's own field names, matched from the file's headers (pure).
import Papa from "papaparse";
import { AppError } from "@/server/http/errors";

/** Field name → header spellings accepted for it, compared lower-case without spaces, _ - . */
export type HeaderAliases<F extends string> = Readonly<Record<F, readonly string[]>>;

export type TextRow<F extends string> = Partial<Record<F, string>>;

function normaliseHeaderName(header: string): string {
  return header.toLowerCase().replace(/[\s_\-.()]+/g, "");
}

function matchHeaders<F extends string>(
  headers: readonly string[],
  aliases: HeaderAliases<F>,
): Map<number, F> {
  const byIndex = new Map<number, F>();
  const taken = new Set<F>();
  headers.forEach((header, i) => {
    const name = normaliseHeaderName(header);
    for (const field of Object.keys(aliases) as F[]) {
      if (taken.has(field)) continue;
      if (name === normaliseHeaderName(field) || aliases[field].includes(name)) {
        byIndex.set(i, field);
        taken.add(field);
        return;
      }
    }
  });
  return byIndex;
}

function refuse(message: string, field = "content"): never {
  throw new AppError("BAD_REQUEST", message, { fields: { [field]: message } });
}

function checkRequired<F extends string>(
  found: Iterable<F>,
  required: readonly F[],
  aliases: HeaderAliases<F>,
  field: string,
): void {
  const have = new Set(found);
  const missing = required.filter((f) => !have.has(f));
  if (missing.length > 0) {
    const names = missing.map((f) => `"${f}" (or ${aliases[f].slice(0, 3).join(", ")})`).join("; ");
    refuse(`The file has no column for ${names}.`, field);
  }
}

function checkRowCount(count: number, maxRows: number, field: string): void {
  if (count === 0) refuse("The file has no data rows.", field);
  if (count > maxRows)
    refuse(
      `The file has ${count.toLocaleString("en")} rows; send at most ${maxRows.toLocaleString("en")} at a time (split it by period).`,
      field,
    );
}

/** CSV with a header row; blank lines are skipped; unreadable quoting is a 400. */
export function readCsvRows<F extends string>(
  text: string,
  aliases: HeaderAliases<F>,
  required: readonly F[],
  maxRows: number,
  field = "content",
): TextRow<F>[] {
  const result = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: "greedy" });
  const broken = result.errors.find((e) => e.type === "Quotes");
  if (broken)
    refuse(
      `The CSV could not be read near data row ${(broken.row ?? 0) + 1}: ${broken.message}.`,
      field,
    );
  const [header, ...rows] = result.data;
  const columns = matchHeaders(header ?? [], aliases);
  checkRequired(columns.values(), required, aliases, field);
  checkRowCount(rows.length, maxRows, field);
  return rows.map((cells) => {
    const row: TextRow<F> = {};
    for (const [i, f] of columns) row[f] = (cells[i] ?? "").trim();
    return row;
  });
}

/** A JSON array of objects, or { events: [...] }; values are read as text. */
export function readJsonRows<F extends string>(
  text: string,
  aliases: HeaderAliases<F>,
  required: readonly F[],
  maxRows: number,
  field = "content",
): TextRow<F>[] {
  let data: unknown;
  try {
    data = JSON.parse(text.replace(/^\uFEFF/, ""));
  } catch {
    refuse("The file is not valid JSON.", field);
  }
  const list = Array.isArray(data) ? data : (data as { events?: unknown } | null)?.events;
  if (!Array.isArray(list))
    refuse('The JSON must be an array of events, or an object with an "events" array.', field);
  checkRowCount(list.length, maxRows, field);
  const keys = new Set<string>();
  for (const item of list)
    if (item && typeof item === "object") for (const k of Object.keys(item)) keys.add(k);
  const keyList = [...keys];
  const columns = matchHeaders(keyList, aliases);
  checkRequired(columns.values(), required, aliases, field);
  return list.map((item) => {
    const row: TextRow<F> = {};
    const record = (item && typeof item === "object" ? item : {}) as Record<string, unknown>;
    for (const [i, f] of columns) {
      const value = record[keyList[i] as string];
      row[f] = value === null || value === undefined ? "" : String(value).trim();
    }
    return row;
  });
}
