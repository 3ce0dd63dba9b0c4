// Reads issued forecast records for scoring, lists the sources that have them, and writes the
// records of uploaded external series.
import { and, count, eq, gte, inArray, isNotNull, isNull, lt, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { externalSeries, forecastRecords, models } from "@/db/schema";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import type { SourceOption } from "@/lib/query/verification";

export interface RecordRow {
  source: string;
  issueTimeMs: number;
  regionNumber: string | null;
  probability: number;
}

export interface RecordFilter {
  sources: readonly string[];
  level: FlareLevel;
  windowHours: number;
  scope: "region" | "full-disk";
  fromMs: number | null;
  toMs: number | null;
}

/**
 * Records of the filter, ordered by issue time then id (so a later record of a case comes later).
 * The rows come back as one tab-separated text value built inside the database: PGlite turns
 * every result row into a JavaScript object, which for tens of thousands of records costs seconds,
 * while one string_agg cell costs a few hundred milliseconds. float8 prints its shortest exact
 * form (PostgreSQL 12 onward), so Number() gives back the stored probability bit for bit.
 */
export async function loadRecords(f: RecordFilter, tx: Db | Tx = getDb()): Promise<RecordRow[]> {
  const c: SQL[] = [
    inArray(forecastRecords.source, [...f.sources]),
    eq(forecastRecords.level, f.level),
    eq(forecastRecords.windowHours, f.windowHours),
  ];
  c.push(
    f.scope === "full-disk"
      ? isNull(forecastRecords.regionNumber)
      : isNotNull(forecastRecords.regionNumber),
  );
  if (f.fromMs !== null) c.push(gte(forecastRecords.issueTime, new Date(f.fromMs)));
  if (f.toMs !== null) c.push(lt(forecastRecords.issueTime, new Date(f.toMs)));
  const line = sql`concat_ws(E'\t', ${forecastRecords.id}, (extract(epoch from ${forecastRecords.issueTime}) * 1000)::bigint, ${forecastRecords.source}, coalesce(translate(${forecastRecords.regionNumber}, E'\t\n', '  '), ''), ${forecastRecords.probability}::text)`;
  const [packed] = await tx
    .select({ text: sql<string | null>`string_agg(${line}, E'\n')` })
    .from(forecastRecords)
    .where(and(...c));
  if (!packed?.text) return [];
  const rows = packed.text.split("\n").map((l) => {
    const [id, ms, source, region, p] = l.split("\t") as [string, string, string, string, string];
    return {
      id: Number(id),
      source,
      issueTimeMs: Number(ms),
      regionNumber: region === "" ? null : region,
      probability: Number(p),
    };
  });
  rows.sort((a, b) => a.issueTimeMs - b.issueTimeMs || a.id - b.id);
  return rows.map(({ id: _id, ...row }) => row);
}

function describeSource(
  source: string,
  modelNames: Map<string, string>,
  seriesNames: Map<number, string>,
): Pick<SourceOption, "label" | "kind"> {
  if (source === "forecaster")
    return { label: "Forecasters (issued bulletins)", kind: "forecaster" };
  const model = /^model:(.+)@(.+)$/.exec(source);
  if (model)
    return {
      label: `${modelNames.get(`${model[1]}@${model[2]}`) ?? model[1]} ${model[2]}`,
      kind: "model",
    };
  const external = /^external:(\d+)$/.exec(source);
  const name = external ? seriesNames.get(Number(external[1])) : undefined;
  return { label: name ? `External: ${name}` : source, kind: "external" };
}

const KIND_ORDER = { forecaster: 0, model: 1, external: 2 } as const;

/** Every source with records, forecasters first, then models, then external series. */
export async function listSources(): Promise<SourceOption[]> {
  const db = getDb();
  const rows = await db
    .select({
      source: forecastRecords.source,
      records: count(),
      demo: sql<boolean>`bool_or(${forecastRecords.isDemo})`,
    })
    .from(forecastRecords)
    .groupBy(forecastRecords.source);
  const modelNames = new Map(
    (
      await db.select({ key: models.key, version: models.version, name: models.name }).from(models)
    ).map((m) => [`${m.key}@${m.version}`, m.name]),
  );
  const seriesNames = new Map(
    (
      await db.select({ id: externalSeries.id, name: externalSeries.name }).from(externalSeries)
    ).map((s) => [s.id, s.name]),
  );
  return rows
    .map((r) => ({
      id: r.source,
      records: r.records,
      isDemo: !!r.demo,
      ...describeSource(r.source, modelNames, seriesNames),
    }))
    .sort((a, b) => KIND_ORDER[a.kind] - KIND_ORDER[b.kind] || a.label.localeCompare(b.label));
}

export interface NewRecord {
  source: string;
  issueTime: Date;
  regionNumber: string | null;
  level: FlareLevel;
  windowHours: number;
  probability: number;
}

export async function insertRecords(tx: Db | Tx, rows: readonly NewRecord[]): Promise<number> {
  let stored = 0;
  for (let i = 0; i < rows.length; i += 1000) {
    const batch = rows.slice(i, i + 1000);
    await tx.insert(forecastRecords).values(batch);
    stored += batch.length;
  }
  return stored;
}
