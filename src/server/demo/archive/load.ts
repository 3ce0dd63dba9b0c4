// Loads the two-year demo archive into the database once (demo — invented for the scenario).

import type { PGlite } from "@electric-sql/pglite";
import { drizzle } from "drizzle-orm/pglite";
import { schema, type Db } from "@/db/client";
import { seedDemoModels } from "@/server/forecast/models.db";
import {
  findDemoUserIds,
  hasDemoArchive,
  writeDemoArchive,
  type DemoArchiveCounts,
} from "./archive.db";
import { addDays, formatDay } from "./calendar";
import { generateDemoArchive } from "./generate";

export { DEMO_EVENT_LIST_NAME } from "./archive.db";
export const DEMO_ARCHIVE_SEED = 412;
export const DEMO_ARCHIVE_DAYS = 730;

export interface LoadDemoArchiveOptions {
  seed?: number;
  days?: number;
  /** The archive ends the day before this one (default: today, UTC), which stays free for the live demo. */
  endDay?: string;
  /** Number of the archive's first region (default 1, HR-0001). */
  firstRegionNumber?: number;
}

export type LoadDemoArchiveResult =
  | { loaded: false; reason: string }
  | {
      loaded: true;
      startDay: string;
      lastDay: string;
      /** Live regions should be numbered from here on, to follow the archive without clashing. */
      nextRegionNumber: number;
      counts: DemoArchiveCounts;
      elapsedMs: number;
    };

const ALREADY_LOADED = { loaded: false, reason: "the demo archive is already loaded" } as const;
const NO_DEMO_OFFICE = {
  loaded: false,
  reason: "the demo forecasters are not in the users table: seed the demo office first",
} as const;

/**
 * Idempotent: does nothing when the demo event list exists, nor when the demo forecasters (the
 * demo office) are absent. Region numbers already in use throw. Everything is written in one PGlite
 * transaction; typed inserts go through a Drizzle handle bound to that transaction so they share
 * it with the COPY statements (Drizzle's own transaction object cannot hand COPY its data).
 */
export async function loadDemoArchive(
  db: Db,
  options: LoadDemoArchiveOptions = {},
): Promise<LoadDemoArchiveResult> {
  const started = performance.now();
  if (await hasDemoArchive(db)) return ALREADY_LOADED;
  const client = (db as Db & { $client?: PGlite }).$client;
  if (typeof client?.transaction !== "function")
    throw new Error("loadDemoArchive needs a PGlite-backed database");
  const days = options.days ?? DEMO_ARCHIVE_DAYS;
  const endDay = options.endDay ?? formatDay(Date.now());
  const startDay = addDays(endDay, -days);
  const archive = generateDemoArchive({
    seed: options.seed ?? DEMO_ARCHIVE_SEED,
    startDay,
    days,
    firstRegionNumber: options.firstRegionNumber ?? 1,
  });

  const outcome = await client.transaction(async (tx) => {
    const w = drizzle({ client: tx as unknown as PGlite, schema }) as unknown as Db;
    if (await hasDemoArchive(w)) return ALREADY_LOADED;
    // An office without the demo people is a real one: it gets no invented history.
    const forecasterIds = await findDemoUserIds(w, "forecaster");
    if (forecasterIds.length === 0) return NO_DEMO_OFFICE;
    const [verifierId] = await findDemoUserIds(w, "verifier");
    await seedDemoModels(w);
    return writeDemoArchive(w, tx, archive, { forecasterIds, verifierId: verifierId ?? null });
  });
  if ("loaded" in outcome) return outcome;
  const counts = outcome;
  return {
    loaded: true,
    startDay,
    lastDay: addDays(endDay, -1),
    nextRegionNumber: archive.nextRegionNumber,
    counts,
    elapsedMs: Math.round(performance.now() - started),
  };
}
