import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, flareEvents } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET as listRoute } from "@/pages/api/events/index";
import { POST as uploadRoute } from "@/pages/api/events/uploads";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callJson, countTables, createPerson } from "./route-call";

// Demo events — invented for the scenario.
const HEADER = "start,peak,end,class,region";
const GOOD = [
  HEADER,
  "2031-04-01T06:10Z,2031-04-01T06:24Z,2031-04-01T06:40Z,M2.5,HR-0412",
  "2031-04-02T10:00Z,2031-04-02T10:15Z,2031-04-02T10:50Z,X1.2,",
  "2031-04-03T01:00Z,2031-04-03T01:05Z,2031-04-03T01:20Z,C4.0,HR-0413",
].join("\n");

let verifier: CurrentUser;
let forecaster: CurrentUser;
const upload = (body: Record<string, unknown>, user: CurrentUser | null = verifier) =>
  callJson(uploadRoute, "/api/events/uploads", {
    method: "POST",
    user,
    body: { name: "Test list", convention: "true", format: "csv", mode: "commit", ...body },
  });

async function expectRefusedAndUnchanged(body: Record<string, unknown>, status: number) {
  const before = await countTables();
  const answer = await upload(body);
  expect(answer.status).toBe(status);
  expect(await countTables()).toEqual(before);
  return answer.body;
}

beforeAll(async () => {
  await useTestDatabase();
  verifier = await createPerson("verifier", "verifier@events.example");
  forecaster = await createPerson("forecaster", "forecaster@events.example");
});
afterAll(closeTestDatabase);

describe("uploading an event list", () => {
  it("previews without storing, then commits every row with its true flux and one audit row", async () => {
    const before = await countTables();
    const preview = await upload({ content: GOOD, mode: "preview" });
    expect(preview.status).toBe(200);
    expect(preview.body.counts).toEqual({ rows: 3, valid: 3, withErrors: 0, duplicates: 0 });
    expect(await countTables()).toEqual(before);

    const committed = await upload({ content: GOOD });
    expect(committed.status).toBe(201);
    expect(committed.body).toMatchObject({ stored: 3, skippedDuplicates: 0 });
    const rows = await getDb()
      .select()
      .from(flareEvents)
      .where(eq(flareEvents.listId, committed.body.listId))
      .orderBy(flareEvents.peakTime);
    expect(rows.map((r) => [r.originalClass, r.peakFluxTrue, r.regionNumber])).toEqual([
      ["M2.5", 2.5e-5, "HR-0412"],
      ["X1.2", 1.2e-4, null],
      ["C4.0", 4e-6, "HR-0413"],
    ]);
    const audits = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "event_list.uploaded"));
    expect(audits).toHaveLength(1);
  });

  it("stores a legacy-scaled JSON list divided by 0.7 and filters it by level", async () => {
    const json = JSON.stringify([
      {
        start: "2031-04-05T00:00Z",
        peak: "2031-04-05T00:10Z",
        end: "2031-04-05T00:30Z",
        class: "C7.0",
        region: "HR-0420",
      },
    ]);
    const committed = await upload({
      content: json,
      format: "json",
      convention: "legacy-scaled",
      name: "Legacy list",
    });
    expect(committed.status).toBe(201);
    const mPlus = await callJson(
      listRoute,
      "/api/events?level=M%2B&from=2031-04-05&to=2031-04-05",
      { user: forecaster },
    );
    expect(mPlus.status).toBe(200);
    // Legacy C7.0 is true M1.0 (NOAA GOES-R XRS L2 Users Guide, 2020), so it lists under M+.
    expect(
      mPlus.body.events.map(
        (e: { originalClass: string; trueClass: string; convention: string }) => [
          e.originalClass,
          e.trueClass,
          e.convention,
        ],
      ),
    ).toEqual([["C7.0", "M1.0", "legacy-scaled"]]);
    const xOnly = await callJson(listRoute, "/api/events?level=X&from=2031-04-05&to=2031-04-05", {
      user: forecaster,
    });
    expect(xOnly.body.total).toBe(0);
  });
});

describe("refused uploads store nothing", () => {
  it.each([
    [
      "a class without a number",
      "2031-05-01T06:10Z,2031-05-01T06:24Z,2031-05-01T06:40Z,M,",
      /not a GOES class/,
    ],
    [
      "an unknown class letter",
      "2031-05-01T06:10Z,2031-05-01T06:24Z,2031-05-01T06:40Z,Q1.0,",
      /not a GOES class/,
    ],
    [
      "a peak before the start",
      "2031-05-01T06:10Z,2031-05-01T06:00Z,2031-05-01T06:40Z,M1.0,",
      /peak is before the start/,
    ],
  ])("%s", async (_label, line, message) => {
    const body = await expectRefusedAndUnchanged(
      {
        content: [HEADER, "2031-05-02T06:10Z,2031-05-02T06:24Z,2031-05-02T06:40Z,M1.0,", line].join(
          "\n",
        ),
      },
      422,
    );
    expect(body.error.message).toMatch(/1 of 2 rows need attention; nothing was stored/);
    expect(Object.values(body.error.fields).join(" ")).toMatch(message);
  });

  it("a duplicate within the file, and one already stored unless asked to skip it", async () => {
    const line = "2031-05-03T06:10Z,2031-05-03T06:24Z,2031-05-03T06:40Z,M1.0,HR-0500";
    const inFile = await expectRefusedAndUnchanged(
      { content: [HEADER, line, line].join("\n") },
      422,
    );
    expect(inFile.error.fields["rows.2.row"]).toBe(
      "Duplicate of row 1 (same peak time and peak flux).",
    );
    const stored = await expectRefusedAndUnchanged(
      {
        content: [
          HEADER,
          "2031-04-01T06:10Z,2031-04-01T06:24Z,2031-04-01T06:40Z,M2.5,HR-0412",
          line,
        ].join("\n"),
      },
      422,
    );
    expect(stored.error.message).toMatch(/skip events already stored/);
    const skipped = await upload({
      content: [
        HEADER,
        "2031-04-01T06:10Z,2031-04-01T06:24Z,2031-04-01T06:40Z,M2.5,HR-0412",
        line,
      ].join("\n"),
      skipDuplicates: true,
    });
    expect(skipped.status).toBe(201);
    expect(skipped.body).toMatchObject({ stored: 1, skippedDuplicates: 1 });
  });

  it("a file over the size limit (413) or the row limit (400)", async () => {
    const huge = await expectRefusedAndUnchanged(
      { content: "x".repeat(2 * 1024 * 1024 + 10) },
      413,
    );
    expect(huge.error.message).toMatch(/at most 2 MiB/);
    const rows = Array.from(
      { length: 20_001 },
      (_, i) => `2032-01-01T00:00Z,2032-01-01T00:00Z,2032-01-01T00:01Z,C${1 + (i % 9)}.${i % 10},`,
    );
    const many = await expectRefusedAndUnchanged({ content: [HEADER, ...rows].join("\n") }, 400);
    expect(many.error.message).toMatch(/20,001 rows; send at most 20,000/);
  });

  it("anyone but a verifier: 403, and signed out: 401", async () => {
    const before = await countTables();
    expect((await upload({ content: GOOD }, forecaster)).status).toBe(403);
    expect((await upload({ content: GOOD }, null)).status).toBe(401);
    expect(await countTables()).toEqual(before);
  });
});
