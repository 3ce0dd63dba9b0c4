// Remembers the last few loaded report samples, so the intervals and exports that follow a report
// do not read and match the same records again; a cheap stamp of both tables detects changes.
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";

const MAX_ENTRIES = 8;
const entries = new Map<string, { stamp: string; value: unknown }>();

/**
 * Changes whenever a forecast record or an event is added, removed or corrected (records are
 * only ever added; corrections of events bump updated_at).
 */
export async function readDataStamp(): Promise<string> {
  const result = await getDb().execute<{ stamp: string }>(
    sql`select (select count(*) || ':' || coalesce(max(id), 0) from forecast_records) || '/' || (select count(*) || ':' || coalesce(max(id), 0) || ':' || coalesce(max(updated_at)::text, '') from flare_events) as stamp`,
  );
  return result.rows[0]?.stamp ?? "";
}

export async function rememberFor<T>(key: string, load: () => Promise<T>): Promise<T> {
  const stamp = await readDataStamp();
  const hit = entries.get(key);
  if (hit && hit.stamp === stamp) {
    entries.delete(key);
    entries.set(key, hit); // most recently used last
    return hit.value as T;
  }
  const value = await load();
  entries.set(key, { stamp, value });
  while (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value as string);
  return value;
}
