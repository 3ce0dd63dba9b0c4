import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { regions, users } from "@/db/schema";
import { addDays } from "@/server/demo/archive/calendar";
import { listForecastRecords } from "@/server/demo/archive/day-forecasts";
import { generateDemoArchive } from "@/server/demo/archive/generate";
import {
  DEMO_ARCHIVE_SEED,
  DEMO_EVENT_LIST_NAME,
  loadDemoArchive,
} from "@/server/demo/archive/load";
import { DEMO_PEOPLE } from "@/server/demo/people";
import { seedDemoOffice } from "@/server/demo/seed";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";

// This file loads a short archive itself; the start-up seed must not load the full one first.
process.env.FACULA_DEMO_ARCHIVE = "off";

const DAYS = 90;
const END_DAY = "2026-01-01";
const archive = generateDemoArchive({
  seed: DEMO_ARCHIVE_SEED,
  startDay: addDays(END_DAY, -DAYS),
  days: DAYS,
});

async function count(table: string, where = "true"): Promise<number> {
  const result = await getDb().execute<{ n: number }>(
    sql.raw(`select count(*)::int as n from ${table} where ${where}`),
  );
  return result.rows[0]?.n ?? -1;
}

async function countAll() {
  return {
    regions: await count("regions"),
    assessments: await count("assessments"),
    guidance: await count("guidance"),
    flareEvents: await count("flare_events"),
    forecastRecords: await count("forecast_records"),
    eventLists: await count("event_lists"),
  };
}

beforeAll(useTestDatabase);
afterAll(closeTestDatabase);

describe("loadDemoArchive on an in-memory PGlite", () => {
  it("skips an office without the demo forecasters, writing nothing", async () => {
    const result = await loadDemoArchive(getDb(), { days: DAYS, endDay: END_DAY });
    expect(result).toEqual({ loaded: false, reason: expect.stringMatching(/demo forecasters/) });
    expect(await countAll()).toMatchObject({
      regions: 0,
      assessments: 0,
      eventLists: 0,
      forecastRecords: 0,
    });
  });

  it("refuses region numbers already in use and rolls everything back", async () => {
    await seedDemoOffice();
    await getDb().insert(regions).values({ number: "HR-0003" });
    await expect(loadDemoArchive(getDb(), { days: DAYS, endDay: END_DAY })).rejects.toThrow(
      /HR-0003/,
    );
    expect(await countAll()).toMatchObject({
      regions: 1,
      assessments: 0,
      guidance: 0,
      forecastRecords: 0,
      eventLists: 0,
    });
    await getDb().delete(regions).where(eq(regions.number, "HR-0003"));
  });

  it("writes exactly the rows the generator produced", async () => {
    const result = await loadDemoArchive(getDb(), { days: DAYS, endDay: END_DAY });
    if (!result.loaded) throw new Error(result.reason);
    const expected = {
      regions: archive.regions.length,
      assessments: archive.regionDays.length,
      guidance: archive.regionDays.length * 3,
      flareEvents: archive.flares.length,
      forecastRecords: listForecastRecords(archive).length,
    };
    expect(result.counts).toEqual(expected);
    expect(await countAll()).toEqual({ ...expected, eventLists: 1 });
    expect(result).toMatchObject({
      startDay: "2025-10-03",
      lastDay: "2025-12-31",
      nextRegionNumber: archive.nextRegionNumber,
    });
    console.log(
      `demo archive, ${DAYS} days: ${result.elapsedMs} ms for ${Object.values(expected).reduce((s, n) => s + n, 0)} rows`,
    );
  });

  it("leaves the current day free and marks every row as demo", async () => {
    const days = await getDb().execute<{ first: string; last: string }>(
      sql`select min(forecast_day)::text as first, max(forecast_day)::text as last from assessments`,
    );
    expect(days.rows[0]).toEqual({ first: "2025-10-03", last: "2025-12-31" });
    expect(await count("assessments", "not is_demo")).toBe(0);
    expect(await count("regions", "not is_demo")).toBe(0);
    expect(await count("flare_events", "not is_demo")).toBe(0);
    expect(await count("forecast_records", "not is_demo")).toBe(0);
    expect(await count("forecast_records", `issue_time >= '${END_DAY}T00:00:00Z'`)).toBe(0);
    const lists = await getDb().execute<{ name: string; convention: string; is_demo: boolean }>(
      sql`select name, convention, is_demo from event_lists`,
    );
    expect(lists.rows).toEqual([{ name: DEMO_EVENT_LIST_NAME, convention: "true", is_demo: true }]);
  });

  it("credits the assessments to the demo forecasters, in weekly turns", async () => {
    const forecasterEmails = DEMO_PEOPLE.filter((p) => p.role === "forecaster").map((p) => p.email);
    const rows = await getDb().execute<{ email: string; n: number }>(
      sql`select u.email, count(*)::int as n from assessments a join ${users} u on u.id = a.created_by group by u.email order by u.email`,
    );
    expect(rows.rows.map((r) => r.email).sort()).toEqual([...forecasterEmails].sort());
    expect(rows.rows.reduce((s, r) => s + r.n, 0)).toBe(archive.regionDays.length);
  });

  it("stores region-days, guidance and records as generated", async () => {
    const first = archive.regionDays[0]!;
    const stored = await getDb().execute<{
      location: string;
      mcintosh: string;
      finals: unknown;
      blended: unknown;
      flares_c: number;
    }>(
      sql`select a.location, a.mcintosh, a.finals, a.blended, a.flares_c from assessments a join regions r on r.id = a.region_id
          where r.number = ${first.regionNumber} and a.forecast_day = ${first.day}`,
    );
    expect(stored.rows[0]).toEqual({
      location: first.input.location,
      mcintosh: first.input.mcintosh,
      finals: first.finals,
      blended: first.blended,
      flares_c: first.input.flares24h.C,
    });
    expect(
      await count("guidance g join models m on m.id = g.model_id", "m.key <> g.model_key"),
    ).toBe(0);
    expect(await count("guidance", "probabilities = 'null'::jsonb or probabilities is null")).toBe(
      archive.regionDays.reduce(
        (s, r) => s + r.guidance.filter((g) => g.probabilities === null).length,
        0,
      ),
    );
    const missingLogR = archive.regionDays.filter((r) => r.input.logR === null).length;
    expect(missingLogR).toBeGreaterThan(0);
    expect(await count("assessments", "log_r is null")).toBe(missingLogR);
    expect(await count("assessments", "notes <> 'Demo archive — invented for the scenario.'")).toBe(
      0,
    );
    const sources = await getDb().execute<{ source: string }>(
      sql`select distinct source from forecast_records order by source`,
    );
    expect(sources.rows.map((r) => r.source)).toEqual([
      "forecaster",
      "model:flare-history@demo-1",
      "model:logistic-magnetic@demo-1",
      "model:mcintosh-poisson@demo-1",
    ]);
    const fullDisk = archive.dayRecords.reduce((s, d) => s + d.fullDisk.length, 0);
    expect(await count("forecast_records", "region_number is null")).toBe(9 * fullDisk);
    expect(await count("flare_events", "region_number is null")).toBe(
      archive.flares.filter((f) => f.regionNumber === null).length,
    );
  });

  it("does nothing on a second call", async () => {
    const before = await countAll();
    const again = await loadDemoArchive(getDb(), { days: DAYS, endDay: END_DAY });
    expect(again).toEqual({ loaded: false, reason: "the demo archive is already loaded" });
    expect(await countAll()).toEqual(before);
  });
});
