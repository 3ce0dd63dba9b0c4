import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, bulletins, forecastRecords, guidance, outbox } from "@/db/schema";
import { POST as create } from "@/pages/api/bulletins/index";
import { PATCH as edit } from "@/pages/api/bulletins/[id]/index";
import { POST as approve } from "@/pages/api/bulletins/[id]/approve";
import { editBulletin } from "@/server/bulletins/bulletins.service";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { assessDay, call, countWhere, seedDesk, type Desk } from "./desk-fixture";
import { readyForReview, refusalOf } from "./bulletin-steps";

let desk: Desk;

beforeAll(async () => {
  await useTestDatabase();
  desk = await seedDesk();
  await assessDay("2031-06-01", desk.forecaster);
});
afterAll(closeTestDatabase);

describe("two duty officers approving at once", () => {
  it("issues exactly once; the other gets 409 and nothing is written twice", async () => {
    const id = await readyForReview("2031-06-01", desk.forecaster);
    const p = { id: String(id) };
    const answers = await Promise.all([
      call(approve, "/", "POST", desk.dutyA, undefined, p),
      call(approve, "/", "POST", desk.dutyB, undefined, p),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    const loser = answers.find((a) => a.status === 409);
    expect(loser?.body.error.code).toBe("CONFLICT");
    const [row] = await getDb().select().from(bulletins).where(eq(bulletins.id, id));
    expect(row?.status).toBe("issued");
    const winner = answers.find((a) => a.status === 200)!;
    const issuedRows = await getDb()
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.action, "bulletin.approved_issued"),
          eq(auditEvents.targetId, String(id)),
        ),
      );
    expect(issuedRows).toHaveLength(1);
    expect([desk.dutyA.id, desk.dutyB.id]).toContain(row?.approverId);
    expect(issuedRows[0]?.actorUserId).toBe(row?.approverId);
    // Two regions + the full disk, 9 cells each, for the forecaster and for every model.
    const models = await getDb()
      .selectDistinct({ key: guidance.modelKey, version: guidance.modelVersion })
      .from(guidance);
    expect(models.length).toBeGreaterThan(0);
    expect(await countWhere("forecast_records", id)).toBe(winner.body.issue.forecastRecords);
    const kinds = await getDb()
      .select({ kind: outbox.kind, n: sql<number>`count(*)::int` })
      .from(outbox)
      .where(eq(outbox.bulletinId, id))
      .groupBy(outbox.kind)
      .orderBy(outbox.kind);
    // One delivery to the one subscribed contact, the stored body, and the alert e-mail its threshold raised.
    expect(kinds).toEqual([
      { kind: "alert", n: 1 },
      { kind: "bulletin", n: 1 },
      { kind: "bulletin-body", n: 1 },
    ]);
  });
});

describe("forecast records of an issued bulletin", () => {
  it("hold the issued finals as 'forecaster' and each model's stored guidance as model:<key>@<version>", async () => {
    const [issued] = await getDb()
      .select()
      .from(bulletins)
      .where(eq(bulletins.forecastDay, "2031-06-01"));
    const records = await getDb()
      .select()
      .from(forecastRecords)
      .where(eq(forecastRecords.bulletinId, issued!.id));
    const forecaster = records.filter((r) => r.source === "forecaster");
    expect(forecaster).toHaveLength(27);
    expect(
      forecaster.find(
        (r) => r.regionNumber === "HR-0412" && r.level === "M+" && r.windowHours === 24,
      )?.probability,
    ).toBe(0.2);
    expect(
      forecaster.find(
        (r) => r.regionNumber === "HR-0412" && r.level === "X" && r.windowHours === 72,
      )?.probability,
    ).toBe(0.07);
    expect(
      records.every((r) => r.issueTime.getTime() === issued!.issueTime!.getTime() && r.isDemo),
    ).toBe(true);
    const stored = await getDb()
      .select({ key: guidance.modelKey, version: guidance.modelVersion, p: guidance.probabilities })
      .from(guidance);
    const scored = stored.filter((g) => g.p !== null);
    expect(scored.length).toBeGreaterThan(0);
    for (const g of scored) {
      const source = `model:${g.key}@${g.version}`;
      expect(
        records.filter((r) => r.source === source && r.regionNumber !== null).length,
      ).toBeGreaterThanOrEqual(9);
    }
    expect(
      records.filter((r) => r.source.startsWith("model:") && r.regionNumber === null).length % 9,
    ).toBe(0);
    expect(records.some((r) => r.source === "model:unknown@0")).toBe(false);
  });
});

describe("an issued bulletin is frozen", () => {
  it("refuses edits through the service (409) and through raw SQL (the trigger)", async () => {
    const [issued] = await getDb()
      .select()
      .from(bulletins)
      .where(and(eq(bulletins.forecastDay, "2031-06-01"), eq(bulletins.status, "issued")));
    const id = issued!.id;
    await expect(
      editBulletin(id, { discussion: "rewritten" }, desk.forecaster),
    ).rejects.toMatchObject({ code: "CONFLICT" });
    expect(
      (
        await call(
          edit,
          "/",
          "PATCH",
          desk.forecaster,
          { discussion: "rewritten" },
          { id: String(id) },
        )
      ).status,
    ).toBe(409);
    expect(
      (await call(approve, "/", "POST", desk.dutyB, undefined, { id: String(id) })).status,
    ).toBe(409);
    expect(
      await refusalOf(sql`update bulletins set discussion = 'rewritten' where id = ${id}`),
    ).toMatch(/is issued: only superseding or withdrawing/);
    expect(await refusalOf(sql`update bulletins set status = 'draft' where id = ${id}`)).toMatch(
      /is issued: only superseding or withdrawing/,
    );
    expect(await refusalOf(sql`delete from bulletins where id = ${id}`)).toMatch(
      /cannot be deleted/,
    );
    // The trigger lets a draft change, so the refusals above are about the issued state.
    const draft = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: "2031-06-09",
    });
    expect(
      await refusalOf(
        sql`update bulletins set discussion = 'draft text' where id = ${draft.body.id}`,
      ),
    ).toBeNull();
    const [after] = await getDb().select().from(bulletins).where(eq(bulletins.id, id));
    expect(after?.discussion).toBe("Discussion for 2031-06-01.");
    expect(after?.content).toEqual(issued!.content);
  });
});
