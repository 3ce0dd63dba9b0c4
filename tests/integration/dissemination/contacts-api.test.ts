import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { alertThresholds, auditEvents, contacts } from "@/db/schema";
import * as boardApi from "@/pages/api/alerts/index";
import * as deskAck from "@/pages/api/alerts/[id]/ack";
import * as contactApi from "@/pages/api/contacts/[id]/index";
import * as contactsApi from "@/pages/api/contacts/index";
import * as importApi from "@/pages/api/contacts/import";
import * as deliveriesApi from "@/pages/api/deliveries/index";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callRoute } from "../forecast/api-call";
import { gridWith, insertContact, insertOrganisation, insertUser, issueBulletin } from "./fixture";

let officer: Awaited<ReturnType<typeof insertUser>>;
let orgId: number;
const ORG = "Fenwick Grid Cooperative (demo)";

beforeAll(async () => {
  process.env.PUBLIC_BASE_URL = "https://desk.halden-ridge.example";
  await useTestDatabase();
  officer = await insertUser("duty_officer");
  orgId = await insertOrganisation(ORG);
});
afterAll(closeTestDatabase);

const countContacts = async () =>
  (
    await getDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(contacts)
  )[0]?.n ?? -1;

describe("contacts, for the desk", () => {
  it("adds a contact linked to the subscriber account with the same address, once", async () => {
    const account = await insertUser("subscriber", "lea@fenwick.example", orgId);
    const made = await callRoute(contactsApi.POST, "/api/contacts", {
      method: "POST",
      user: officer,
      body: {
        organisationId: orgId,
        name: "Lea Fenwick",
        email: "Lea@Fenwick.example",
        wantsBulletins: true,
      },
    });
    expect(made).toMatchObject({
      status: 201,
      body: { userId: account.id, organisationName: ORG, thresholds: [] },
    });
    const twin = await callRoute(contactsApi.POST, "/api/contacts", {
      method: "POST",
      user: officer,
      body: {
        organisationId: orgId,
        name: "Lea Again",
        email: "lea@fenwick.example",
        wantsBulletins: true,
      },
    });
    expect(twin).toMatchObject({
      status: 409,
      body: { error: { fields: { email: "This address is already a contact." } } },
    });
    const asSubscriber = await callRoute(contactsApi.POST, "/api/contacts", {
      method: "POST",
      user: account,
      body: {
        organisationId: orgId,
        name: "Sneaky",
        email: "x@fenwick.example",
        wantsBulletins: true,
      },
    });
    expect(asSubscriber.status).toBe(403);
    const list = await callRoute(contactsApi.GET, `/api/contacts?q=fenwick`, {
      method: "GET",
      user: officer,
    });
    expect(list.body.contacts.map((c: { email: string }) => c.email)).toEqual([
      "Lea@Fenwick.example",
    ]);
  });

  it("unsubscribes on the contact's behalf, keeps a contact with history, deletes one without", async () => {
    const withHistory = await insertContact({ organisationId: orgId });
    await issueBulletin(gridWith({}), null, new Date());
    const off = await callRoute(contactApi.PATCH, `/api/contacts/${withHistory.id}`, {
      method: "PATCH",
      user: officer,
      params: { id: String(withHistory.id) },
      body: { isSubscribed: false },
    });
    expect(off.status).toBe(200);
    expect(off.body.unsubscribedAt).not.toBeNull();
    const del = await callRoute(contactApi.DELETE, `/api/contacts/${withHistory.id}`, {
      method: "DELETE",
      user: officer,
      params: { id: String(withHistory.id) },
    });
    expect(del.status).toBe(409);
    const fresh = await insertContact({ organisationId: orgId, thresholds: [["X", 24, 0.1]] });
    const gone = await callRoute(contactApi.DELETE, `/api/contacts/${fresh.id}`, {
      method: "DELETE",
      user: officer,
      params: { id: String(fresh.id) },
    });
    expect(gone.status).toBe(204);
    expect(
      await getDb().select().from(alertThresholds).where(eq(alertThresholds.contactId, fresh.id)),
    ).toEqual([]);
  });
});

describe("importing contacts from CSV", () => {
  const good = `organisation,name,email,bulletins,thresholds\n${ORG},Ana Holm,ana@fenwick.example,yes,M+ 24h 40%\n${ORG},Bo Lund,bo@fenwick.example,no,"X 24h 5%; C+ 48h 95%"\n`;

  it("previews with row errors and imports nothing while any row is wrong", async () => {
    const before = await countContacts();
    const bad = `${good}Unknown Org,Cy,cy@x.example,yes,\n`;
    const preview = await callRoute(importApi.POST, "/api/contacts/import", {
      method: "POST",
      user: officer,
      body: { csv: bad, mode: "preview" },
    });
    expect(preview).toMatchObject({
      status: 200,
      body: { committed: false, preview: { validCount: 2, invalidCount: 1 } },
    });
    expect(preview.body.preview.rows[2].errors[0]).toContain(
      'Organisation "Unknown Org" does not exist',
    );
    const commit = await callRoute(importApi.POST, "/api/contacts/import", {
      method: "POST",
      user: officer,
      body: { csv: bad, mode: "commit" },
    });
    expect(commit).toMatchObject({
      status: 422,
      body: {
        error: { message: "Nothing was imported: fix the rows marked below and try again." },
      },
    });
    expect(await countContacts()).toBe(before);
  });

  it("imports every row with its thresholds in one go, audited", async () => {
    const before = await countContacts();
    const commit = await callRoute(importApi.POST, "/api/contacts/import", {
      method: "POST",
      user: officer,
      body: { csv: good, mode: "commit" },
    });
    expect(commit).toMatchObject({
      status: 201,
      body: { committed: true, created: 2, thresholds: 3 },
    });
    expect(await countContacts()).toBe(before + 2);
    const [bo] = await getDb()
      .select()
      .from(contacts)
      .where(eq(contacts.email, "bo@fenwick.example"));
    expect(bo?.wantsBulletins).toBe(false);
    expect(
      (await getDb().select().from(alertThresholds).where(eq(alertThresholds.contactId, bo!.id)))
        .map((t) => [t.level, t.windowHours, t.probability])
        .sort(),
    ).toEqual([
      ["C+", 48, 0.95],
      ["X", 24, 0.05],
    ]);
    const audit = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "contact.imported"));
    expect(audit[0]?.details).toMatchObject({ contacts: 2, thresholds: 3 });
    // The same file again: every row is now a duplicate.
    const again = await callRoute(importApi.POST, "/api/contacts/import", {
      method: "POST",
      user: officer,
      body: { csv: good, mode: "commit" },
    });
    expect(again.status).toBe(422);
  });

  it("refuses a file over the size limit", async () => {
    const huge = `organisation,name,email\n${"x".repeat(600 * 1024)}`;
    const res = await callRoute(importApi.POST, "/api/contacts/import", {
      method: "POST",
      user: officer,
      body: { csv: huge, mode: "preview" },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.csv).toContain("larger than 512 KiB");
  });
});

describe("the alert board and delivery progress", () => {
  it("shows each alert's state, the chase list, and records an acknowledgement taken by phone", async () => {
    const watcher = await insertContact({
      organisationId: orgId,
      name: "Watcher (demo)",
      thresholds: [["C+", 24, 0.5]],
    });
    const { bulletin } = await issueBulletin(gridWith({ "C+.24h": 0.8 }), null, new Date());
    const board = await callRoute(boardApi.GET, `/api/alerts?bulletin=${bulletin.id}`, {
      method: "GET",
      user: officer,
    });
    const mine = board.body.alerts.find((a: { contactId: number }) => a.contactId === watcher.id);
    expect(mine).toMatchObject({ state: "open", mailStatus: "queued", level: "C+" });
    expect(board.body.chase.map((a: { contactId: number }) => a.contactId)).toContain(watcher.id);

    const acked = await callRoute(deskAck.POST, `/api/alerts/${mine.id}/ack`, {
      method: "POST",
      user: officer,
      params: { id: String(mine.id) },
      body: { note: "Confirmed by phone" },
    });
    expect(acked).toMatchObject({ status: 200, body: { acknowledgedVia: "desk" } });
    const after = await callRoute(
      boardApi.GET,
      `/api/alerts?bulletin=${bulletin.id}&state=acknowledged`,
      { method: "GET", user: officer },
    );
    expect(after.body.alerts.map((a: { id: number }) => a.id)).toEqual([mine.id]);
    expect(after.body.chase.map((a: { contactId: number }) => a.contactId)).not.toContain(
      watcher.id,
    );

    const progress = await callRoute(deliveriesApi.GET, `/api/deliveries?bulletin=${bulletin.id}`, {
      method: "GET",
      user: officer,
    });
    expect(progress).toMatchObject({
      status: 200,
      body: { bulletin: { id: bulletin.id }, counts: { sent: 0, failed: 0 } },
    });
    expect(progress.body.counts.queued).toBe(progress.body.counts.total);
    expect(progress.body.byKind.alert.total).toBe(1);
    const subscriber = await insertUser("subscriber");
    expect(
      (await callRoute(boardApi.GET, "/api/alerts", { method: "GET", user: subscriber })).status,
    ).toBe(403);
    expect(
      (
        await callRoute(deliveriesApi.GET, "/api/deliveries?bulletin=999999", {
          method: "GET",
          user: officer,
        })
      ).status,
    ).toBe(404);
  });
});
