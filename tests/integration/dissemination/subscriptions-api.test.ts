import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { alertThresholds, alerts, auditEvents, contacts } from "@/db/schema";
import * as contactThreshold from "@/pages/api/contacts/[id]/thresholds/[thresholdId]";
import * as ownAck from "@/pages/api/subscriptions/alerts/[id]/ack";
import * as own from "@/pages/api/subscriptions/index";
import * as ownThresholds from "@/pages/api/subscriptions/thresholds/index";
import * as ownThreshold from "@/pages/api/subscriptions/thresholds/[id]";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callRoute } from "../forecast/api-call";
import { gridWith, insertContact, insertOrganisation, insertUser, issueBulletin } from "./fixture";

const NOW = new Date();
let dana: Awaited<ReturnType<typeof insertUser>>;
let rui: Awaited<ReturnType<typeof insertUser>>;
let danaContact: Awaited<ReturnType<typeof insertContact>>;
let ruiContact: Awaited<ReturnType<typeof insertContact>>;

beforeAll(async () => {
  process.env.PUBLIC_BASE_URL = "https://desk.halden-ridge.example";
  await useTestDatabase();
  const organisationId = await insertOrganisation();
  dana = await insertUser("subscriber", "dana@northmarch.example", organisationId);
  rui = await insertUser("subscriber", "rui@skylark-hf.example", organisationId);
  // Dana's contact is linked by user id; Rui's only by the same e-mail address.
  danaContact = await insertContact({
    organisationId,
    email: "dana@northmarch.example",
    userId: dana.id,
    thresholds: [["M+", 24, 0.4]],
  });
  ruiContact = await insertContact({
    organisationId,
    email: "RUI@skylark-hf.example",
    thresholds: [["X", 24, 0.1]],
  });
});
afterAll(closeTestDatabase);

const thresholdBody = { level: "M+", windowHours: 48, probabilityPercent: 35 };

describe("a subscriber's own thresholds", () => {
  it("cannot change or remove another contact's threshold (403), and nothing changes", async () => {
    const ruisThreshold = ruiContact.thresholdIds[0]!;
    const put = await callRoute(
      ownThreshold.PUT,
      `/api/subscriptions/thresholds/${ruisThreshold}`,
      { method: "PUT", user: dana, params: { id: String(ruisThreshold) }, body: thresholdBody },
    );
    expect(put.status).toBe(403);
    expect(put.body.error.message).toContain("belongs to another contact");
    const del = await callRoute(
      ownThreshold.DELETE,
      `/api/subscriptions/thresholds/${ruisThreshold}`,
      { method: "DELETE", user: dana, params: { id: String(ruisThreshold) } },
    );
    expect(del.status).toBe(403);
    const [row] = await getDb()
      .select()
      .from(alertThresholds)
      .where(eq(alertThresholds.id, ruisThreshold));
    expect(row).toMatchObject({ level: "X", windowHours: 24, probability: 0.1 });
    // The desk's endpoint for any contact is not open to subscribers either.
    const desk = await callRoute(
      contactThreshold.PUT,
      `/api/contacts/${ruiContact.id}/thresholds/${ruisThreshold}`,
      {
        method: "PUT",
        user: dana,
        params: { id: String(ruiContact.id), thresholdId: String(ruisThreshold) },
        body: thresholdBody,
      },
    );
    expect(desk.status).toBe(403);
  });

  it("changes their own threshold, and the change is audited", async () => {
    const mine = danaContact.thresholdIds[0]!;
    const put = await callRoute(ownThreshold.PUT, `/api/subscriptions/thresholds/${mine}`, {
      method: "PUT",
      user: dana,
      params: { id: String(mine) },
      body: thresholdBody,
    });
    expect(put).toMatchObject({
      status: 200,
      body: { id: mine, level: "M+", windowHours: 48, probability: 0.35 },
    });
    const audit = await getDb()
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.action, "threshold.changed"),
          eq(auditEvents.targetId, String(danaContact.id)),
        ),
      );
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({
      actorUserId: dana.id,
      details: {
        via: "portal",
        before: { windowHours: 24, probability: 0.4 },
        after: { windowHours: 48, probability: 0.35 },
      },
    });
  });

  it("adds one, refuses a second for the same level and window, and refuses bad values", async () => {
    const added = await callRoute(ownThresholds.POST, "/api/subscriptions/thresholds", {
      method: "POST",
      user: rui,
      body: { level: "C+", windowHours: 72, probabilityPercent: 90 },
    });
    expect(added.status).toBe(201);
    const twin = await callRoute(ownThresholds.POST, "/api/subscriptions/thresholds", {
      method: "POST",
      user: rui,
      body: { level: "C+", windowHours: 72, probabilityPercent: 80 },
    });
    expect(twin.status).toBe(409);
    const bad = await callRoute(ownThresholds.POST, "/api/subscriptions/thresholds", {
      method: "POST",
      user: rui,
      body: { level: "Z", windowHours: 12, probabilityPercent: 0 },
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual([
      "level",
      "probabilityPercent",
      "windowHours",
    ]);
    // Rui's contact was found by e-mail (another case) and is now linked to the account.
    const [linked] = await getDb().select().from(contacts).where(eq(contacts.id, ruiContact.id));
    expect(linked?.userId).toBe(rui.id);
  });

  it("is refused to staff and to subscribers who are not on the list", async () => {
    const officer = await insertUser("duty_officer");
    expect(
      (await callRoute(own.GET, "/api/subscriptions", { method: "GET", user: officer })).status,
    ).toBe(403);
    expect(
      (await callRoute(own.GET, "/api/subscriptions", { method: "GET", user: null })).status,
    ).toBe(401);
    const stranger = await insertUser("subscriber");
    expect(
      await callRoute(own.GET, "/api/subscriptions", { method: "GET", user: stranger }),
    ).toMatchObject({ status: 200, body: { subscription: null } });
    const add = await callRoute(ownThresholds.POST, "/api/subscriptions/thresholds", {
      method: "POST",
      user: stranger,
      body: thresholdBody,
    });
    expect(add.status).toBe(403);
  });
});

describe("a subscriber's alerts in the portal", () => {
  it("lists their open alerts and acknowledges their own, never someone else's", async () => {
    await issueBulletin(gridWith({ "M+.48h": 0.5, "X.24h": 0.2 }), null, NOW);
    const got = await callRoute(own.GET, "/api/subscriptions", { method: "GET", user: dana });
    expect(got.body.subscription.openAlerts.map((a: { level: string }) => a.level)).toEqual(["M+"]);
    const [ruiAlert] = await getDb()
      .select()
      .from(alerts)
      .where(eq(alerts.contactId, ruiContact.id));
    const [danaAlert] = await getDb()
      .select()
      .from(alerts)
      .where(eq(alerts.contactId, danaContact.id));

    const foreign = await callRoute(ownAck.POST, `/api/subscriptions/alerts/${ruiAlert!.id}/ack`, {
      method: "POST",
      user: dana,
      params: { id: String(ruiAlert!.id) },
    });
    expect(foreign.status).toBe(403);
    const mine = await callRoute(ownAck.POST, `/api/subscriptions/alerts/${danaAlert!.id}/ack`, {
      method: "POST",
      user: dana,
      params: { id: String(danaAlert!.id) },
    });
    expect(mine).toMatchObject({ status: 200, body: { acknowledgedVia: "portal" } });
    const again = await callRoute(ownAck.POST, `/api/subscriptions/alerts/${danaAlert!.id}/ack`, {
      method: "POST",
      user: dana,
      params: { id: String(danaAlert!.id) },
    });
    expect(again.status).toBe(409);
    const [ruiAfter] = await getDb().select().from(alerts).where(eq(alerts.id, ruiAlert!.id));
    expect(ruiAfter?.acknowledgedAt).toBeNull();
  });
});
