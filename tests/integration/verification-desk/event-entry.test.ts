import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEvents } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { GET as listRoute, POST as createRoute } from "@/pages/api/events/index";
import { PATCH as correctRoute } from "@/pages/api/events/[id]";
import { closeTestDatabase, useTestDatabase } from "../../support/test-db";
import { callJson, createPerson } from "./route-call";

let verifier: CurrentUser;
let forecaster: CurrentUser;

beforeAll(async () => {
  await useTestDatabase();
  verifier = await createPerson("verifier", "verifier@entry.example");
  forecaster = await createPerson("forecaster", "forecaster@entry.example");
});
afterAll(closeTestDatabase);

describe("entering and correcting one event", () => {
  const entry = {
    start: "2031-06-01T12:00Z",
    peak: "2031-06-01T12:20Z",
    end: "2031-06-01T12:45Z",
    goesClass: "m1.4",
    regionNumber: "hr-0600",
    convention: "true",
  };

  it("creates an event in the hand-entry list, audited with the event after", async () => {
    const res = await callJson(createRoute, "/api/events", {
      method: "POST",
      user: verifier,
      body: entry,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      originalClass: "M1.4",
      regionNumber: "HR-0600",
      peakFluxTrue: 1.4e-5,
      listName: "Entered by hand (true flux)",
    });
    const [audit] = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "event.created"));
    expect((audit?.details as { after: { id: number } }).after.id).toBe(res.body.id);
    const again = await callJson(createRoute, "/api/events", {
      method: "POST",
      user: verifier,
      body: entry,
    });
    expect(again.status).toBe(409);
  });

  it("corrects it with a reason, keeping before and after in the audit", async () => {
    const { body: list } = await callJson(listRoute, "/api/events?region=HR-0600", {
      user: verifier,
    });
    const id = String(list.events[0].id);
    const patch = {
      ...entry,
      goesClass: "M1.6",
      reason: "Reprocessed peak from the 1-minute data",
    };
    const res = await callJson(correctRoute, `/api/events/${id}`, {
      method: "PATCH",
      user: verifier,
      params: { id },
      body: patch,
    });
    expect(res.status).toBe(200);
    expect(res.body.peakFluxTrue).toBe(1.6e-5);
    const [audit] = await getDb()
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, "event.corrected"));
    const details = audit?.details as {
      reason: string;
      before: { originalClass: string };
      after: { originalClass: string };
    };
    expect([details.before.originalClass, details.after.originalClass, details.reason]).toEqual([
      "M1.4",
      "M1.6",
      patch.reason,
    ]);
  });

  it("refuses a correction without a reason, with the peak after the end, or by a forecaster", async () => {
    const { body: list } = await callJson(listRoute, "/api/events?region=HR-0600", {
      user: verifier,
    });
    const id = String(list.events[0].id);
    const noReason = await callJson(correctRoute, `/api/events/${id}`, {
      method: "PATCH",
      user: verifier,
      params: { id },
      body: { ...entry, reason: "" },
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeDefined();
    const badOrder = await callJson(correctRoute, `/api/events/${id}`, {
      method: "PATCH",
      user: verifier,
      params: { id },
      body: { ...entry, end: "2031-06-01T12:10Z", reason: "typo" },
    });
    expect(badOrder.body.error.fields.end).toBe("The end is before the peak.");
    const byForecaster = await callJson(correctRoute, `/api/events/${id}`, {
      method: "PATCH",
      user: forecaster,
      params: { id },
      body: { ...entry, reason: "mine" },
    });
    expect(byForecaster.status).toBe(403);
    const { body: after } = await callJson(listRoute, "/api/events?region=HR-0600", {
      user: verifier,
    });
    expect(after.events[0].originalClass).toBe("M1.6");
  });
});
