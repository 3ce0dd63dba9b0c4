import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, eventLists, flareEvents, forecastRecords } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET as listRoute, POST as uploadRoute } from "@/pages/api/verification/external/index";
import { GET as reportRoute } from "@/pages/api/verification/report";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callJson, countTables, createPerson } from "./route-call";

// An invented external series (demo — invented for the scenario).
const CSV = [
  "Issue time,Level,Window,Probability,Region",
  "2031-08-01T00:00Z,M+,24,0.30,",
  "2031-08-02T00:00Z,M+,24,10%,",
  "2031-08-02T00:00Z,M+,48,0.2,",
  "2031-08-02T00:00Z,X,24,0.01,HR-0801",
].join("\n");

let verifier: CurrentUser;
let forecaster: CurrentUser;
const send = (body: Record<string, unknown>, user: CurrentUser | null = verifier) =>
  callJson(uploadRoute, "/api/verification/external", {
    method: "POST",
    user,
    body: {
      name: "Neighbour office",
      provenance: "Daily full-disk probabilities sent by a partner desk (invented)",
      csv: CSV,
      mode: "commit",
      ...body,
    },
  });

async function expectRefusedAndUnchanged(
  body: Record<string, unknown>,
  status: number,
  user: CurrentUser | null = verifier,
) {
  const before = await countTables();
  const answer = await send(body, user);
  expect(answer.status).toBe(status);
  expect(await countTables()).toEqual(before);
  return answer.body;
}

beforeAll(async () => {
  await useTestDatabase();
  verifier = await createPerson("verifier", "verifier@external.example");
  forecaster = await createPerson("forecaster", "forecaster@external.example");
});
afterAll(closeTestDatabase);

describe("uploading an external series", () => {
  it("previews, then stores the series and every record under external:<id>, audited once", async () => {
    const preview = await send({ mode: "preview" });
    expect(preview.body.counts).toEqual({ rows: 4, valid: 4, withErrors: 0, duplicates: 0 });
    expect(preview.body.period).toEqual({
      first: "2031-08-01T00:00:00.000Z",
      last: "2031-08-02T00:00:00.000Z",
    });
    const { status, body } = await send({});
    expect(status).toBe(201);
    expect(body).toEqual({
      seriesId: expect.any(Number),
      source: `external:${body.seriesId}`,
      stored: 4,
    });
    const rows = await getDb()
      .select()
      .from(forecastRecords)
      .where(eq(forecastRecords.source, body.source))
      .orderBy(forecastRecords.id);
    expect(rows.map((r) => [r.level, r.windowHours, r.probability, r.regionNumber])).toEqual([
      ["M+", 24, 0.3, null],
      ["M+", 24, 0.1, null],
      ["M+", 48, 0.2, null],
      ["X", 24, 0.01, "HR-0801"],
    ]);
    expect(
      await getDb()
        .select()
        .from(auditEvents)
        .where(eq(auditEvents.action, "external_series.uploaded")),
    ).toHaveLength(1);
    const list = await callJson(listRoute, "/api/verification/external", { user: forecaster });
    expect(list.body.series).toMatchObject([
      { name: "Neighbour office", records: 4, source: body.source },
    ]);
  });

  it("scores the series like the office's own forecasts", async () => {
    const [list] = await getDb()
      .insert(eventLists)
      .values({ name: "External test events", convention: "true" })
      .returning();
    await getDb()
      .insert(flareEvents)
      .values({
        listId: list!.id,
        startTime: new Date("2031-08-01T09:00Z"),
        peakTime: new Date("2031-08-01T09:10Z"),
        endTime: new Date("2031-08-01T09:30Z"),
        originalClass: "M4.0",
        peakFluxTrue: 4e-5,
        regionNumber: null,
      });
    const [series] = (await callJson(listRoute, "/api/verification/external", { user: verifier }))
      .body.series;
    const { body } = await callJson(
      reportRoute,
      `/api/verification/report?source=${series.source}&level=M%2B&window=24&scope=full-disk`,
      { user: verifier },
    );
    // Two 24 h M+ cases: 0.30 with an event, 0.10 without: BS = (0.49 + 0.01) / 2 = 0.25 (by hand).
    expect(body.sample).toMatchObject({ n: 2, events: 1 });
    expect(body.scores.brier.value).toBeCloseTo(0.25, 12);
    expect(body.source.label).toBe("External: Neighbour office");
  });
});

describe("refused series store nothing", () => {
  it("a row with a probability above 1 or a second row for the same case", async () => {
    const bad = await expectRefusedAndUnchanged(
      { csv: `${CSV}\n2031-08-03T00:00Z,M+,24,35,\n2031-08-01T00:00Z,M+,24,0.4,` },
      422,
    );
    expect(bad.error.message).toBe("2 of 6 rows need attention; nothing was stored.");
    expect(bad.error.fields["rows.5.probability"]).toMatch(/outside 0–1/);
    expect(bad.error.fields["rows.6.row"]).toMatch(/Row 1 already forecasts/);
  });

  it("a file without a probability column, or without provenance", async () => {
    const noColumn = await expectRefusedAndUnchanged(
      { csv: "issue,level,window\n2031-08-01T00:00Z,M+,24" },
      400,
    );
    expect(noColumn.error.fields.csv).toMatch(/no column for "probability"/);
    const noProvenance = await expectRefusedAndUnchanged({ provenance: "" }, 400);
    expect(noProvenance.error.fields.provenance).toBeDefined();
  });

  it("a file over 8 MiB, and anyone but a verifier", async () => {
    const huge = await expectRefusedAndUnchanged({ csv: "x".repeat(8 * 1024 * 1024 + 1) }, 413);
    expect(huge.error.message).toMatch(/at most 8 MiB/);
    await expectRefusedAndUnchanged({}, 403, forecaster);
    await expectRefusedAndUnchanged({}, 401, null);
  });
});
