// Turns a model table given as CSV into the parameter object of its kind: a McIntosh rate table
// (class,C,M,X; a single Zurich letter gives that class's fallback rates) or logistic coefficients
// (level,term,transform,coefficient; the term "intercept" is the level's intercept).
import Papa from "papaparse";
import { explainMcIntoshError, ZURICH_CLASSES } from "@/lib/domain/mcintosh";
import { MODEL_CSV_COLUMNS } from "@/lib/schemas/models";
import type { FieldErrors } from "@/server/http/errors";

export type CsvParamsResult = { ok: true; params: unknown } | { ok: false; fields: FieldErrors };

interface CsvModelInput {
  kind: string;
  csv?: string | undefined;
  correctionFactor?: number | undefined;
  windowHours?: number | undefined;
}

type Cells = Record<string, string>;

/** Rows keyed by the expected column names (matched case-insensitively), or the missing columns. */
function readTable(
  csv: string,
  columns: readonly string[],
): { rows: Cells[] } | { fields: FieldErrors } {
  const parsed = Papa.parse<string[]>(csv.replace(/^\uFEFF/, ""), { skipEmptyLines: "greedy" });
  const [header = [], ...data] = parsed.data;
  const names = header.map((h) => h.trim().toLowerCase());
  const missing = columns.filter((c) => !names.includes(c.toLowerCase()));
  if (missing.length)
    return {
      fields: {
        csv: `The table needs the columns ${columns.join(", ")}; missing: ${missing.join(", ")}.`,
      },
    };
  if (data.length === 0) return { fields: { csv: "The table has a header row but no data rows." } };
  const index = Object.fromEntries(columns.map((c) => [c, names.indexOf(c.toLowerCase())]));
  return {
    rows: data.map((cells) =>
      Object.fromEntries(columns.map((c) => [c, (cells[index[c] ?? -1] ?? "").trim()])),
    ),
  };
}

function readNumber(cells: Cells, column: string, row: number, fields: FieldErrors): number {
  const text = cells[column] ?? "";
  const value = text === "" ? Number.NaN : Number(text);
  if (!Number.isFinite(value))
    fields[`csv.${row}.${column}`] = `Row ${row}, ${column}: "${text}" is not a number.`;
  return value;
}

function rateTableFromRows(rows: Cells[], correctionFactor: number | undefined): CsvParamsResult {
  const fields: FieldErrors = {};
  const rates: Record<string, { C: number; M: number; X: number }> = {};
  const zurichRates: typeof rates = {};
  rows.forEach((cells, i) => {
    const row = i + 1;
    const cls = cells.class ?? "";
    const isZurich = (ZURICH_CLASSES as readonly string[]).includes(cls);
    const classError = isZurich ? null : explainMcIntoshError(cls);
    if (classError) fields[`csv.${row}.class`] = `Row ${row}: ${classError}.`;
    const target = isZurich ? zurichRates : rates;
    if (target[cls]) fields[`csv.${row}.class`] = `Row ${row}: ${cls} has a row already.`;
    target[cls] = {
      C: readNumber(cells, "C", row, fields),
      M: readNumber(cells, "M", row, fields),
      X: readNumber(cells, "X", row, fields),
    };
  });
  if (Object.keys(fields).length) return { ok: false, fields };
  return {
    ok: true,
    params: {
      rates,
      ...(Object.keys(zurichRates).length ? { zurichRates } : {}),
      correctionFactor,
    },
  };
}

function logisticFromRows(rows: Cells[], windowHours: number | undefined): CsvParamsResult {
  const fields: FieldErrors = {};
  const levels: Record<
    string,
    { intercept?: number; predictors: { input: string; transform: string; coefficient: number }[] }
  > = {};
  rows.forEach((cells, i) => {
    const row = i + 1;
    const level = cells.level ?? "";
    if (!["C+", "M+", "X"].includes(level))
      fields[`csv.${row}.level`] = `Row ${row}: the level must be C+, M+ or X; got "${level}".`;
    const entry = (levels[level] ??= { predictors: [] });
    const coefficient = readNumber(cells, "coefficient", row, fields);
    const term = cells.term ?? "";
    if (term.toLowerCase() === "intercept") {
      if (entry.intercept !== undefined)
        fields[`csv.${row}.term`] = `Row ${row}: ${level} has an intercept already.`;
      entry.intercept = coefficient;
    } else {
      entry.predictors.push({ input: term, transform: cells.transform || "identity", coefficient });
    }
  });
  if (Object.keys(fields).length) return { ok: false, fields };
  return { ok: true, params: { windowHours, levels } };
}

export function paramsFromCsv(input: CsvModelInput): CsvParamsResult {
  if (input.kind !== "mcintosh-poisson" && input.kind !== "logistic") {
    return {
      ok: false,
      fields: {
        kind: "A CSV table can hold a rate table or logistic coefficients; give other kinds as JSON.",
      },
    };
  }
  const table = readTable(input.csv ?? "", MODEL_CSV_COLUMNS[input.kind]);
  if ("fields" in table) return { ok: false, fields: table.fields };
  return input.kind === "mcintosh-poisson"
    ? rateTableFromRows(table.rows, input.correctionFactor)
    : logisticFromRows(table.rows, input.windowHours);
}
