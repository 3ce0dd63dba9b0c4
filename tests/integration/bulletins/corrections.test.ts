import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, isNull, ne, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents, bulletins, outbox } from "@/db/schema";
import { POST as create } from "@/pages/api/bulletins/index";
import { PATCH as edit } from "@/pages/api/bulletins/[id]/index";
import { POST as submit } from "@/pages/api/bulletins/[id]/submit";
import { POST as approve } from "@/pages/api/bulletins/[id]/approve";
import { POST as withdraw } from "@/pages/api/bulletins/[id]/withdraw";
import { withdrawBulletin } from "@/server/bulletins/bulletins.service";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { assessDay, auditActionsFor, call, seedDesk, type Desk } from "./desk-fixture";
import { issueDay, refusalOf } from "./bulletin-steps";

let desk: Desk;

beforeAll(async () => {
  await useTestDatabase();
  desk = await seedDesk();
  await assessDay("2031-06-01", desk.forecaster);
  await assessDay("2031-06-02", desk.forecaster);
  await issueDay("2031-06-01", desk.forecaster, desk.dutyA);
  await issueDay("2031-06-02", desk.forecaster, desk.dutyA);
});
afterAll(closeTestDatabase);

describe("a correction", () => {
  it("is version n+1 of the day, starts from the issued text, and supersedes the old one when issued", async () => {
    const [old] = await getDb()
      .select()
      .from(bulletins)
      .where(and(eq(bulletins.forecastDay, "2031-06-01"), eq(bulletins.status, "issued")));
    const created = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: "2031-06-01",
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      version: 2,
      supersedesId: old!.id,
      discussion: old!.discussion,
      status: "draft",
    });
    expect(created.body.content.supersedesVersion).toBe(1);
    const id = created.body.id as number;
    await call(
      edit,
      "/",
      "PATCH",
      desk.forecaster,
      { discussion: "Corrected: HR-0413 location." },
      { id: String(id) },
    );
    await call(submit, "/", "POST", desk.forecaster, undefined, { id: String(id) });
    const issued = await call(approve, "/", "POST", desk.dutyB, undefined, { id: String(id) });
    expect(issued.status).toBe(200);
    expect(issued.body.issue.supersededId).toBe(old!.id);
    const [oldAfter] = await getDb().select().from(bulletins).where(eq(bulletins.id, old!.id));
    expect(oldAfter?.status).toBe("superseded");
    expect(oldAfter?.content).toEqual(old!.content);
    expect(await auditActionsFor(old!.id)).toContain("bulletin.superseded");
    // Both moves happened in one transaction: same approver, one issue time.
    const [superseding] = await getDb()
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.action, "bulletin.superseded"),
          eq(auditEvents.targetId, String(old!.id)),
        ),
      );
    expect(superseding?.details).toMatchObject({ supersededBy: id });
  });

  it("is not created while the day has an open bulletin", async () => {
    const open = await call(create, "/api/bulletins", "POST", desk.forecaster, {
      forecastDay: "2031-06-01",
    });
    expect(open.status).toBe(201);
    expect(open.body.version).toBe(3);
    const again = await call(create, "/api/bulletins", "POST", desk.dutyA, {
      forecastDay: "2031-06-01",
    });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.existingId).toBe(String(open.body.id));
  });
});

describe("withdrawing", () => {
  it("needs a reason, then marks the bulletin withdrawn and nothing can change it after", async () => {
    const [issued] = await getDb()
      .select()
      .from(bulletins)
      .where(and(eq(bulletins.forecastDay, "2031-06-02"), eq(bulletins.status, "issued")));
    const p = { id: String(issued!.id) };
    const noReason = await call(withdraw, "/", "POST", desk.dutyB, { reason: "" }, p);
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeTruthy();
    await expect(withdrawBulletin(issued!.id, { reason: "   " }, desk.dutyB)).rejects.toMatchObject(
      { code: "BAD_REQUEST" },
    );
    expect(
      (
        await call(
          withdraw,
          "/",
          "POST",
          desk.forecaster,
          { reason: "Wrong day in the header." },
          p,
        )
      ).status,
    ).toBe(403);
    const done = await call(
      withdraw,
      "/",
      "POST",
      desk.dutyB,
      { reason: "Issued for the wrong forecast day." },
      p,
    );
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({
      status: "withdrawn",
      withdrawnReason: "Issued for the wrong forecast day.",
    });
    expect(
      (await call(withdraw, "/", "POST", desk.dutyB, { reason: "Again, to be sure." }, p)).status,
    ).toBe(409);
    expect(
      await refusalOf(
        sql`update bulletins set withdrawn_reason = 'other' where id = ${issued!.id}`,
      ),
    ).toMatch(/is withdrawn and cannot change/);
    expect(await auditActionsFor(issued!.id)).toContain("bulletin.withdrawn");
  });

  it("cancels the withdrawn bulletin's e-mails still queued, and no other bulletin's", async () => {
    const [withdrawn] = await getDb()
      .select()
      .from(bulletins)
      .where(eq(bulletins.status, "withdrawn"));
    const mail = await getDb().select().from(outbox).where(ne(outbox.kind, "bulletin-body"));
    const ofWithdrawn = mail.filter((m) => m.bulletinId === withdrawn!.id);
    expect(ofWithdrawn.length).toBeGreaterThan(0);
    expect(
      ofWithdrawn.every(
        (m) => m.status === "failed" && m.lastError === "cancelled: the bulletin was withdrawn",
      ),
    ).toBe(true);
    expect(
      mail.filter((m) => m.bulletinId !== withdrawn!.id).every((m) => m.status === "queued"),
    ).toBe(true);
    const [audit] = await getDb()
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.action, "bulletin.withdrawn"),
          eq(auditEvents.targetId, String(withdrawn!.id)),
        ),
      );
    expect(audit?.details).toMatchObject({
      cancelledDeliveries: ofWithdrawn.length,
      reason: "Issued for the wrong forecast day.",
    });
  });

  it("refuses to withdraw a draft (409)", async () => {
    const [draft] = await getDb()
      .select()
      .from(bulletins)
      .where(and(eq(bulletins.status, "draft"), isNull(bulletins.issueTime)));
    expect(
      (
        await call(
          withdraw,
          "/",
          "POST",
          desk.dutyB,
          { reason: "Not issued yet anyway." },
          { id: String(draft!.id) },
        )
      ).status,
    ).toBe(409);
  });
});
