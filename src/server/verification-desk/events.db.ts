// Drizzle access for observed flare events and their lists; returns events as the desk shows them.
import { and, count, desc, eq, gte, inArray, lt, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { eventLists, flareEvents } from "@/db/schema";
import type { FluxConventionName } from "@/lib/schemas/verification";
import type { EventView } from "@/lib/query/verification";
import { LEVEL_THRESHOLD_WM2, formatGoesClass } from "@/server/verification/goes";
import type { FlareLevel } from "@/lib/domain/flare-levels";
import { eventKey, type ValidEvent } from "./event-rows";
import type { MatchEvent } from "./matching";

const DAY_MS = 86_400_000;
const INSERT_BATCH = 500;

type EventRow = typeof flareEvents.$inferSelect;

export function toEventView(row: EventRow, list: { name: string; convention: string }): EventView {
  return {
    id: row.id,
    listId: row.listId,
    listName: list.name,
    convention: list.convention as FluxConventionName,
    startTime: row.startTime.toISOString(),
    peakTime: row.peakTime.toISOString(),
    endTime: row.endTime.toISOString(),
    originalClass: row.originalClass,
    trueClass: formatGoesClass(row.peakFluxTrue),
    peakFluxTrue: row.peakFluxTrue,
    regionNumber: row.regionNumber,
    isDemo: row.isDemo,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Keys (eventKey) of stored events peaking at any of these times. */
export async function findStoredEventKeys(
  tx: Db | Tx,
  peakTimes: readonly Date[],
): Promise<Set<string>> {
  const keys = new Set<string>();
  const unique = [...new Map(peakTimes.map((d) => [d.getTime(), d])).values()];
  for (let i = 0; i < unique.length; i += 1000) {
    const rows = await tx
      .select({ peakTime: flareEvents.peakTime, flux: flareEvents.peakFluxTrue })
      .from(flareEvents)
      .where(inArray(flareEvents.peakTime, unique.slice(i, i + 1000)));
    for (const r of rows) keys.add(eventKey(r.peakTime.getTime(), r.flux));
  }
  return keys;
}

export async function insertEventList(
  tx: Db | Tx,
  values: { name: string; convention: FluxConventionName; uploadedBy: number | null },
): Promise<number> {
  const [row] = await tx.insert(eventLists).values(values).returning({ id: eventLists.id });
  if (!row) throw new Error("event list insert returned nothing");
  return row.id;
}

export async function insertEvents(
  tx: Db | Tx,
  listId: number,
  events: readonly ValidEvent[],
  actorId: number | null,
): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 0; i < events.length; i += INSERT_BATCH) {
    const batch = events
      .slice(i, i + INSERT_BATCH)
      .map((e) => ({ ...e, listId, updatedBy: actorId }));
    const rows = await tx.insert(flareEvents).values(batch).returning({ id: flareEvents.id });
    ids.push(...rows.map((r) => r.id));
  }
  return ids;
}

/** Hand-entered events go to one list per convention, created on first use. */
export async function findOrCreateManualList(
  tx: Db | Tx,
  convention: FluxConventionName,
  actorId: number,
): Promise<number> {
  const name = `Entered by hand (${convention === "true" ? "true flux" : "legacy-scaled"})`;
  const [existing] = await tx
    .select({ id: eventLists.id })
    .from(eventLists)
    .where(and(eq(eventLists.name, name), eq(eventLists.convention, convention)));
  return existing?.id ?? insertEventList(tx, { name, convention, uploadedBy: actorId });
}

function whereOf(q: {
  from?: string | undefined;
  to?: string | undefined;
  level?: FlareLevel | undefined;
  region?: string | undefined;
}): SQL | undefined {
  const c: SQL[] = [];
  if (q.from) c.push(gte(flareEvents.peakTime, new Date(`${q.from}T00:00:00Z`)));
  if (q.to) c.push(lt(flareEvents.peakTime, new Date(Date.parse(`${q.to}T00:00:00Z`) + DAY_MS)));
  // The same relative tolerance as meetsLevel, so the list and the scores agree on the boundary.
  if (q.level) c.push(gte(flareEvents.peakFluxTrue, LEVEL_THRESHOLD_WM2[q.level] * (1 - 1e-9)));
  if (q.region) c.push(sql`upper(${flareEvents.regionNumber}) = ${q.region.toUpperCase()}`);
  return c.length ? and(...c) : undefined;
}

export async function listEvents(
  q: Parameters<typeof whereOf>[0] & { page: number; pageSize: number },
): Promise<{ rows: EventView[]; total: number }> {
  const where = whereOf(q);
  const db = getDb();
  const rows = await db
    .select({ e: flareEvents, name: eventLists.name, convention: eventLists.convention })
    .from(flareEvents)
    .innerJoin(eventLists, eq(flareEvents.listId, eventLists.id))
    .where(where)
    .orderBy(desc(flareEvents.peakTime), desc(flareEvents.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
  const [total] = await db.select({ n: count() }).from(flareEvents).where(where);
  return { rows: rows.map((r) => toEventView(r.e, r)), total: total?.n ?? 0 };
}

export async function getEvent(id: number, tx: Db | Tx = getDb()): Promise<EventView | null> {
  const [row] = await tx
    .select({ e: flareEvents, name: eventLists.name, convention: eventLists.convention })
    .from(flareEvents)
    .innerJoin(eventLists, eq(flareEvents.listId, eventLists.id))
    .where(eq(flareEvents.id, id));
  return row ? toEventView(row.e, row) : null;
}

export async function updateEvent(
  tx: Db | Tx,
  id: number,
  event: ValidEvent,
  actorId: number,
): Promise<void> {
  await tx
    .update(flareEvents)
    .set({ ...event, updatedBy: actorId, updatedAt: new Date() })
    .where(eq(flareEvents.id, id));
}

/**
 * Events peaking in [fromMs, toMs), in the shape the matcher reads. Packed into one text value
 * inside the database for the reason given at loadRecords (records.db.ts): PGlite's per-row
 * objects are the slow part of reading thousands of rows.
 */
export async function loadEventsForMatching(
  fromMs: number,
  toMs: number,
  tx: Db | Tx = getDb(),
): Promise<MatchEvent[]> {
  const line = sql`concat_ws(E'\t', (extract(epoch from ${flareEvents.peakTime}) * 1000)::bigint, ${flareEvents.peakFluxTrue}::text, coalesce(translate(${flareEvents.regionNumber}, E'\t\n', '  '), ''))`;
  const [packed] = await tx
    .select({ text: sql<string | null>`string_agg(${line}, E'\n')` })
    .from(flareEvents)
    .where(
      and(gte(flareEvents.peakTime, new Date(fromMs)), lt(flareEvents.peakTime, new Date(toMs))),
    );
  if (!packed?.text) return [];
  return packed.text.split("\n").map((l) => {
    const [ms, flux, region] = l.split("\t") as [string, string, string];
    return {
      peakTimeMs: Number(ms),
      peakFluxTrue: Number(flux),
      regionNumber: region === "" ? null : region,
    };
  });
}

/** Whether a database error (or one of its causes) is a unique-constraint violation. */
export function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === "23505") return true;
  }
  return false;
}
