import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { assessments, auditEvents, guidance, regions } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { getActiveModels, seedDemoModels } from "@/server/forecast/models.db";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { createActor } from "./api-call";
import {
  DAY,
  HEADER,
  VALID,
  expectRefusedAndUnchanged as refuse,
  mappingOf,
  sendImport,
  snapshot,
} from "./csv-fixture";

let forecaster: CurrentUser;
const send = (body: Record<string, unknown>, user: CurrentUser | null = forecaster) =>
  sendImport(body, user);
const expectRefusedAndUnchanged = (body: Record<string, unknown>, status: number) =>
  refuse(body, status, forecaster);

beforeAll(async () => {
  await useTestDatabase();
  await seedDemoModels();
  forecaster = await createActor("forecaster", "forecaster@halden.example");
});
afterAll(closeTestDatabase);

describe("a valid file", () => {
  it("previews three rows with guidance and warnings, writing nothing", async () => {
    const before = await snapshot();
    const { status, body } = await send({ csv: VALID, mode: "preview" });
    expect(status).toBe(200);
    expect(body.counts).toEqual({ rows: 3, valid: 3, withErrors: 0, withWarnings: 1 });
    expect(body.rows[2].warnings.map((w: { field: string }) => w.field)).toEqual(["areaMsh"]);
    expect(body.rows[0].warnings).toEqual([]);
    for (const r of body.rows) expect(r.guidance.mPlus24h).toBeGreaterThan(0);
    expect(await snapshot()).toEqual(before);
  });

  it("commits all three in one go, each with guidance from every active model, and audits once", async () => {
    const preview = (await send({ csv: VALID, mode: "preview" })).body;
    const { status, body } = await send({ csv: VALID });
    expect(status).toBe(201);
    expect(body.imported).toBe(3);
    expect(body.ids).toHaveLength(3);
    const stored = await getDb()
      .select()
      .from(assessments)
      .where(eq(assessments.forecastDay, DAY))
      .orderBy(assessments.id);
    expect(
      stored.map((a) => [a.areaMsh, a.spotCount, a.mcintosh, a.mountWilson, a.flaresM]),
    ).toEqual([
      [250, 14, "Dkc", "beta-gamma", 1],
      [80, 6, "Cso", "beta", 0],
      [5200, 22, "Fkc", "beta-gamma-delta", 2],
    ]);
    expect(stored[0]!.unsignedFluxMx).toBe(2.5e22);
    expect(stored[1]!.pilLengthMm).toBeNull();
    // The preview's guidance is the guidance that was stored.
    expect(stored.map((a) => a.blended?.["M+"]["24h"])).toEqual(
      preview.rows.map((r: { guidance: { mPlus24h: number } }) => r.guidance.mPlus24h),
    );
    const active = (await getActiveModels()).length;
    expect(active).toBeGreaterThan(0);
    const [g] = await getDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(guidance)
      .where(sql`${guidance.assessmentId} in (${sql.join(body.ids, sql`, `)})`);
    expect(g?.n).toBe(3 * active);
    const audits = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "assessment.imported"));
    expect(audits.map((a) => a.details)).toEqual([
      { count: 3, regions: ["HR-0901", "HR-0902", "HR-0903"] },
    ]);
  });
});

describe("refused files leave the database unchanged", () => {
  it("a required column the file does not have, named in the message", async () => {
    const noSpots = VALID.replace(",Spots,", ",Count,");
    const auto = await expectRefusedAndUnchanged({ csv: noSpots, forecastDay: "2031-03-15" }, 400);
    expect(auto.error.fields["mapping.spotCount"]).toMatch(/Number of spots/);
    const named = await expectRefusedAndUnchanged(
      {
        csv: noSpots,
        forecastDay: "2031-03-15",
        mapping: { ...mappingOf(VALID), spotCount: "Spots" },
      },
      400,
    );
    expect(named.error.fields["mapping.spotCount"]).toMatch(/no column "Spots"/);
  });

  it("a McIntosh class with a penumbra letter x on a D group", async () => {
    const body = await expectRefusedAndUnchanged(
      { csv: VALID.replace("Dkc", "Dxx"), forecastDay: "2031-03-15" },
      422,
    );
    // McIntosh (1990): D, E, F groups have penumbra, so p = x is not allowed.
    expect(body.error.fields["rows.1.mcintosh"]).toMatch(/D-class groups have penumbra/);
    expect(Object.keys(body.error.fields)).toEqual(["rows.1.mcintosh"]);
  });

  it("the same region twice in the file", async () => {
    const csv = VALID.replace("HR-0903", "HR-0901");
    const body = await expectRefusedAndUnchanged({ csv, forecastDay: "2031-03-15" }, 422);
    expect(body.error.fields["rows.1.region"]).toMatch(/more than once.*rows 1, 3/);
    expect(body.error.fields["rows.3.region"]).toMatch(/more than once/);
    expect(body.error.fields["rows.2.region"]).toBeUndefined();
  });

  it("a flux that is not a number", async () => {
    const csv = VALID.replace("2.5e22", "abc");
    const preview = await send({ csv, forecastDay: "2031-03-15", mode: "preview" });
    expect(preview.body.rows[0].errors).toEqual({
      unsignedFluxMx: "Enter a number, or leave it empty.",
    });
    expect(preview.body.counts.withErrors).toBe(1);
    await expectRefusedAndUnchanged({ csv, forecastDay: "2031-03-15" }, 422);
  });

  it("a body over 2 MiB, with a message saying so", async () => {
    const csv = `${HEADER}\n${"x".repeat(2 * 1024 * 1024)}`;
    const body = await expectRefusedAndUnchanged({ csv, forecastDay: "2031-03-15" }, 413);
    expect(body.error.message).toMatch(/too large.*2 MiB/);
  });

  // Scoring 2,000 rows takes seconds, more when other test files share the two cores.
  it(
    "more than 2,000 data rows, while exactly 2,000 are accepted",
    { timeout: 120_000 },
    async () => {
      const rowsOf = (n: number) =>
        [
          HEADER,
          ...Array.from({ length: n }, (_, i) => `HR-${i + 1},N10E10,50,3,Cso,beta,,,,,0,0,0,`),
        ].join("\n");
      const body = await expectRefusedAndUnchanged(
        { csv: rowsOf(2001), forecastDay: "2031-03-15" },
        400,
      );
      expect(body.error.message).toMatch(/too many rows/);
      const atLimit = await send({ csv: rowsOf(2000), forecastDay: "2031-03-15", mode: "preview" });
      expect(atLimit.status).toBe(200);
      expect(atLimit.body.counts.valid).toBe(2000);
    },
  );

  it("a region already assessed on that day, while another day is free", async () => {
    const body = await expectRefusedAndUnchanged({ csv: VALID }, 422);
    expect(body.error.fields["rows.1.region"]).toMatch(
      /HR-0901 already has an assessment for 2031-03-14/,
    );
    const otherDay = await send({ csv: VALID, forecastDay: "2031-03-16", mode: "preview" });
    expect(otherDay.body.counts.withErrors).toBe(0);
  });

  it("a signed-in verifier, whose role may not import", async () => {
    const verifier = await createActor("verifier", "verifier@halden.example");
    const before = await snapshot();
    expect((await send({ csv: VALID, forecastDay: "2031-03-17" }, verifier)).status).toBe(403);
    expect(await snapshot()).toEqual(before);
  });
});

describe("a failure inside the transaction", () => {
  it("rolls back the rows and regions written before it", async () => {
    const csv = VALID.replace(/HR-09/gi, "HR-19");
    // The database refuses the third row as a duplicate; no check before the transaction sees it.
    await getDb().execute(
      sql.raw(`create function refuse_third() returns trigger language plpgsql as $$ begin
      if new.location = 'N20W40' then raise exception 'duplicate row' using errcode = 'unique_violation'; end if; return new; end $$`),
    );
    await getDb().execute(
      sql.raw(
        "create trigger refuse_third before insert on assessments for each row execute function refuse_third()",
      ),
    );
    const body = await expectRefusedAndUnchanged({ csv, forecastDay: "2031-03-18" }, 409);
    expect(body.error.message).toMatch(/nothing was imported/);
    expect(
      await getDb()
        .select()
        .from(regions)
        .where(sql`upper(${regions.number}) like 'HR-19%'`),
    ).toEqual([]);
    await getDb().execute(sql.raw("drop trigger refuse_third on assessments"));
    expect((await send({ csv, forecastDay: "2031-03-18" })).body.imported).toBe(3);
  });
});
