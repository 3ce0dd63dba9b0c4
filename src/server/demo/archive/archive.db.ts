// Drizzle queries and bulk writes of the demo archive loader, inside its one transaction.

import type { Transaction } from "@electric-sql/pglite";
import { and, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import {
  assessments,
  eventLists,
  flareEvents,
  forecastRecords,
  guidance,
  models,
  regions,
  users,
} from "@/db/schema";
import { DEMO_PEOPLE } from "@/server/demo/people";
import {
  ASSESSMENT_COPY_COLUMNS,
  FLARE_EVENT_COPY_COLUMNS,
  FORECAST_RECORD_COPY_COLUMNS,
  GUIDANCE_COPY_COLUMNS,
  formatRegionDayKey,
  toAssessmentValues,
  toFlareEventValues,
  toForecastRecordValues,
  toGuidanceValues,
} from "./archive-rows";
import type { DemoArchive } from "./archive-types";
import { countDaysBetween } from "./calendar";
import { copyRows } from "./copy-rows";
import { listForecastRecords } from "./day-forecasts";
import { insertInChunks } from "./insert-in-chunks";

export const DEMO_EVENT_LIST_NAME = "Demo observed flares (invented)";

export interface DemoArchiveCounts {
  regions: number;
  assessments: number;
  guidance: number;
  flareEvents: number;
  forecastRecords: number;
}

/** The demo event list marks a loaded archive. */
export async function hasDemoArchive(db: Db): Promise<boolean> {
  const [marker] = await db
    .select({ id: eventLists.id })
    .from(eventLists)
    .where(and(eq(eventLists.name, DEMO_EVENT_LIST_NAME), eq(eventLists.isDemo, true)));
  return marker !== undefined;
}

/** Ids of the demo people with a role, in the order people.ts lists them. */
export async function findDemoUserIds(db: Db, role: string): Promise<number[]> {
  const emails = DEMO_PEOPLE.filter((p) => p.role === role).map((p) => p.email);
  const rows = await db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(inArray(users.email, emails));
  return emails.flatMap((e) => rows.filter((r) => r.email === e).map((r) => r.id));
}

async function insertRegions(w: Db, archive: DemoArchive): Promise<Map<string, number>> {
  const numbers = archive.regions.map((r) => r.number);
  const taken = await w
    .select({ number: regions.number })
    .from(regions)
    .where(inArray(sql`upper(${regions.number})`, numbers));
  if (taken.length > 0) {
    const list = taken.map((t) => t.number).join(", ");
    throw new Error(`Region numbers of the demo archive are already in use: ${list}`);
  }
  const rows = await insertInChunks(
    numbers.map((number) => ({ number, isDemo: true })),
    (chunk) =>
      w.insert(regions).values(chunk).returning({ id: regions.id, number: regions.number }),
  );
  return new Map(rows.map((r) => [r.number, r.id]));
}

/** Writes every table of the archive; `w` is a Drizzle handle on the same transaction `tx`. */
export async function writeDemoArchive(
  w: Db,
  tx: Transaction,
  archive: DemoArchive,
  people: { forecasterIds: number[]; verifierId: number | null },
): Promise<DemoArchiveCounts> {
  const regionIds = await insertRegions(w, archive);
  const numberOf = new Map([...regionIds].map(([number, id]) => [id, number]));
  // Forecasters take week-long shifts in turn.
  const { forecasterIds } = people;
  const pick = (day: string) =>
    forecasterIds[
      Math.floor(countDaysBetween(archive.startDay, day) / 7) % forecasterIds.length
    ] as number;
  const assessmentCount = await copyRows(
    tx,
    assessments,
    ASSESSMENT_COPY_COLUMNS,
    toAssessmentValues(archive, regionIds, pick),
  );
  const ids = await w
    .select({ id: assessments.id, regionId: assessments.regionId, day: assessments.forecastDay })
    .from(assessments)
    .where(inArray(assessments.regionId, [...numberOf.keys()]));
  const assessmentIds = new Map(
    ids.map((a) => [formatRegionDayKey(numberOf.get(a.regionId) ?? "", a.day), a.id]),
  );
  const modelRows = await w
    .select({ id: models.id, key: models.key, version: models.version })
    .from(models);
  const modelIds = new Map(modelRows.map((m) => [`${m.key}@${m.version}`, m.id]));
  const guidanceCount = await copyRows(
    tx,
    guidance,
    GUIDANCE_COPY_COLUMNS,
    toGuidanceValues(archive, assessmentIds, modelIds),
  );
  const [list] = await w
    .insert(eventLists)
    .values({
      name: DEMO_EVENT_LIST_NAME,
      convention: "true",
      isDemo: true,
      uploadedBy: people.verifierId,
    })
    .returning({ id: eventLists.id });
  if (!list) throw new Error("The demo event list was not created");
  const flareCount = await copyRows(
    tx,
    flareEvents,
    FLARE_EVENT_COPY_COLUMNS,
    toFlareEventValues(archive, list.id),
  );
  const records = toForecastRecordValues(listForecastRecords(archive));
  const recordCount = await copyRows(tx, forecastRecords, FORECAST_RECORD_COPY_COLUMNS, records);
  return {
    regions: regionIds.size,
    assessments: assessmentCount,
    guidance: guidanceCount,
    flareEvents: flareCount,
    forecastRecords: recordCount,
  };
}
